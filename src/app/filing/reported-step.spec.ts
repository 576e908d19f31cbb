import { ComponentFixture, TestBed } from '@angular/core/testing';
import { FormArray } from '@angular/forms';
import { reportedForm, type ReportedForm } from './filing-form';
import { ReportedStep } from './reported-step';
import { composeReported, emptyParts } from './reported-text';

describe('ReportedStep', () => {
  let fixture: ComponentFixture<ReportedStep>;
  let lines: FormArray<ReportedForm>;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [ReportedStep] });
    lines = new FormArray<ReportedForm>([reportedForm()]);
    fixture = TestBed.createComponent(ReportedStep);
    fixture.componentRef.setInput('lines', lines);
    fixture.detectChanges();
    el = fixture.nativeElement;
  });

  function type(text: string): void {
    const input = el.querySelector<HTMLInputElement>('input[formcontrolname="text"]')!;
    input.value = text;
    input.dispatchEvent(new Event('input'));
    fixture.detectChanges();
  }

  it('says what it read from a well-formed reporting string as the person types', () => {
    type('F(2, 87) = 4.10, p = .020');
    const reading = el.querySelector('.reading')!;
    expect(reading.textContent).toContain('Read as: F = 4.10 with 2 and 87 degrees of freedom; p = 0.020.');
    expect(reading.classList.contains('bad')).toBe(false);
    expect(reading.getAttribute('aria-live')).toBe('polite');
  });

  it('says why a string cannot be read, in the parser\'s words', () => {
    type('F = 4.10, p = .020');
    const reading = el.querySelector('.reading')!;
    expect(reading.classList.contains('bad')).toBe(true);
    expect(reading.textContent).toContain('F needs degrees of freedom in parentheses');
  });

  it('builds the string field by field', () => {
    Array.from(el.querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.includes('Build'))!.dispatchEvent(new Event('click'));
    fixture.detectChanges();
    const field = (label: string) => Array.from(el.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)!.querySelector('input')!;
    for (const [label, v] of [['df (effect)', '2'], ['df (error)', '87'], ['Value', '4.10'], ['p', '0.020']] as const) {
      const input = field(label);
      input.value = v;
      input.dispatchEvent(new Event('input'));
    }
    fixture.detectChanges();
    expect(lines.at(0).controls.text.value).toBe('F(2, 87) = 4.10, p = .020');
    expect(el.querySelector('.reading')!.textContent).toContain('p = 0.020');
  });

  it('shows a server problem for a line under that line, counting only filled lines', () => {
    lines.insert(0, reportedForm(''));
    lines.at(1).controls.text.setValue('t(28) = 2.10, p = .045');
    fixture.componentRef.setInput('problems', { 'reported.0': 'No term "group" in this design.' });
    fixture.detectChanges();
    const groups = el.querySelectorAll('.line');
    expect(groups[0].textContent).not.toContain('No term');
    expect(groups[1].textContent).toContain('No term "group" in this design.');
  });
});

describe('composeReported', () => {
  it('writes chi-square, t and z in reporting style', () => {
    expect(composeReported({ ...emptyParts(), test: 'chi2', df1: '3', value: '7.90', p: '0.048' })).toBe('χ²(3) = 7.90, p = .048');
    expect(composeReported({ ...emptyParts(), test: 't', df1: '28', value: '2.10', pOp: '<', p: '.05', effectName: 'd', effectValue: '0.41' })).toBe('t(28) = 2.10, p < .05, d = 0.41');
    expect(composeReported({ ...emptyParts(), test: 'z', df1: '9', value: '1.96' })).toBe('z = 1.96');
  });
});
