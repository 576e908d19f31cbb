import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { VerificationView } from '../../../shared/api/workflow';
import { VerifyPage } from './verify-page';

const letter = {
  reference: 'HV-2026-001', title: 'Advising pilot', office: 'Office of Institutional Effectiveness', decision: 'endorse' as const,
  signedAt: '2026-11-30T10:00:00Z', signedBy: 'Tomas Lindqvist', letterNo: 1, supersededBy: null,
};

describe('VerifyPage', () => {
  let fixture: ComponentFixture<VerifyPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  function create(code?: string): void {
    TestBed.configureTestingModule({ imports: [VerifyPage], providers: [provideRouter([{ path: 'verify', children: [] }, { path: 'verify/:code', children: [] }]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(VerifyPage);
    if (code) fixture.componentRef.setInput('code', code);
    fixture.detectChanges();
    el = fixture.nativeElement;
  }
  afterEach(() => http.verify());

  const outcome = () => el.querySelector('.outcome') as HTMLElement | null;

  it('checks the code from the address and says "Valid and current" with the letter summary and the caution', () => {
    create('HVL-7K2M-9QX4');
    http.expectOne('/api/letters/HVL-7K2M-9QX4').flush({ status: 'valid-current', headline: 'This letter was issued by the office and is current.', details: ['Record signature checks out.'], code: 'HVL-7K2M-9QX4', letter } satisfies VerificationView);
    fixture.detectChanges();
    expect(outcome()?.dataset['tone']).toBe('good');
    expect(outcome()?.querySelector('h2')?.textContent).toBe('Valid and current');
    expect(outcome()?.textContent).toContain('Record signature checks out.');
    expect(outcome()?.textContent).toContain('HV-2026-001');
    expect(outcome()?.textContent).toContain('Endorse');
    expect(el.querySelector('.caution')?.textContent).toContain('statistical method only');
  });

  it('names the newer letter when superseded', () => {
    create('OLD-1');
    http.expectOne('/api/letters/OLD-1').flush({ status: 'valid-superseded', headline: 'Genuine, but replaced.', details: [], letter: { ...letter, supersededBy: 'NEW-2' } } satisfies VerificationView);
    fixture.detectChanges();
    expect(outcome()?.querySelector('h2')?.textContent).toBe('Valid but superseded by NEW-2');
    expect(outcome()?.querySelector('a')?.getAttribute('href')).toBe('/verify/NEW-2');
  });

  it('puts a typed code into the address, which runs the check', () => {
    create();
    const nav = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const input = el.querySelector('#vcode') as HTMLInputElement;
    input.value = ' HVL-1 ';
    input.dispatchEvent(new Event('input'));
    (el.querySelector('form button[type="submit"]') as HTMLButtonElement).click();
    expect(nav).toHaveBeenCalledWith(['/verify', 'HVL-1']);
    fixture.componentRef.setInput('code', 'HVL-1');
    fixture.detectChanges();
    http.expectOne('/api/letters/HVL-1').flush({ status: 'valid-current', headline: 'Current.', details: [], letter } satisfies VerificationView);
    fixture.detectChanges();
    expect(outcome()?.querySelector('h2')?.textContent).toBe('Valid and current');
  });

  it('shows "Unknown code" when the API answers 404 with a verification body', () => {
    create('NOPE');
    http.expectOne('/api/letters/NOPE').flush({ status: 'unknown-code', headline: 'No letter has this code.', details: [] }, { status: 404, statusText: 'Not Found' });
    fixture.detectChanges();
    expect(outcome()?.querySelector('h2')?.textContent).toBe('Unknown code');
  });

  it('asks for a code instead of calling the API with an empty one', () => {
    create();
    (el.querySelector('form button[type="submit"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')?.textContent).toContain('Enter the verification code');
  });

  it('uploads a dropped PDF as multipart field "file" and reports an altered copy', () => {
    create();
    const file = new File([new Uint8Array([37, 80, 68, 70])], 'letter.pdf', { type: 'application/pdf' });
    const drop = new Event('drop') as DragEvent;
    Object.defineProperty(drop, 'dataTransfer', { value: { files: [file] } });
    el.querySelector('.drop')!.dispatchEvent(drop);
    const req = http.expectOne('/api/letters/verify');
    expect(req.request.method).toBe('POST');
    expect((req.request.body as FormData).get('file')).toBeInstanceOf(File);
    req.flush({ status: 'altered', headline: 'This copy differs from the letter the office signed.', details: ['PDF signature does not match.'] } satisfies VerificationView);
    fixture.detectChanges();
    expect(outcome()?.dataset['tone']).toBe('bad');
    expect(outcome()?.querySelector('h2')?.textContent).toBe('Altered — do not rely on this copy');
  });

  it('reports "Not a PDF" from a 415/422 verification body', () => {
    create();
    const picker = el.querySelector('input[type="file"]') as HTMLInputElement;
    const file = new File(['a,b\n1,2'], 'data.csv', { type: 'text/csv' });
    Object.defineProperty(picker, 'files', { value: [file] });
    picker.dispatchEvent(new Event('change'));
    http.expectOne('/api/letters/verify').flush({ status: 'not-a-pdf', headline: 'The file is not a PDF.', details: [] }, { status: 415, statusText: 'Unsupported Media Type' });
    fixture.detectChanges();
    expect(outcome()?.querySelector('h2')?.textContent).toBe('Not a PDF');
  });

  it('says plainly when the check is rate-limited', () => {
    create('X');
    http.expectOne('/api/letters/X').flush({ error: { status: 429, code: 'rate-limited', message: 'Too many checks from this address; wait a minute.' } }, { status: 429, statusText: 'Too Many Requests' });
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')?.textContent).toContain('Too many checks');
  });
});
