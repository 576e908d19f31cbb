import { ComponentFixture, TestBed } from '@angular/core/testing';
import type { RerunResult } from '../../../shared/stats/contract';
import { RerunResultView } from './rerun-result-view';
import { ADVISING_PILOT_RESULT, ADVISING_REGRESSION_RESULT, BELONGING_SURVEY_RESULT } from './testing/sample-results';

// Rendering checks only: the numbers come from the engine (its own tests check them against R and NIST);
// here we check that they reach the page, formatted by the shared APA helpers and placed under the right heading.
describe('RerunResultView', () => {
  let fixture: ComponentFixture<RerunResultView>;
  let el: HTMLElement;

  function render(r: RerunResult): void {
    TestBed.configureTestingModule({ imports: [RerunResultView] });
    fixture = TestBed.createComponent(RerunResultView);
    fixture.componentRef.setInput('result', r);
    fixture.detectChanges();
    el = fixture.nativeElement;
  }

  const section = (title: string) => Array.from(el.querySelectorAll('section')).find((s) => s.querySelector('h3')?.textContent?.trim() === title) as HTMLElement | undefined;

  it('puts APA-style headlines first for a between-subjects design', () => {
    render(ADVISING_PILOT_RESULT);
    const lines = Array.from(section('In brief')!.querySelectorAll('li')).map((li) => li.textContent);
    expect(lines[0]).toBe('advising_format: F(2, 86) = 5.86, p = .004, ηp² = .12');
    expect(lines[1]).toMatch(/^advising_format \(Welch F\): F\(2, 57\.1\) = 6\.00, p = \.004/);
    expect(lines.some((l) => l?.startsWith('advising_format, standard vs embedded: difference = -4.23'))).toBe(true);
  });

  it('renders the tables with numbers right-aligned in the mono font', () => {
    render(ADVISING_PILOT_RESULT);
    const tests = section('Tests of effects')!;
    const first = tests.querySelector('tbody tr')!;
    const cells = Array.from(first.querySelectorAll('td')).map((td) => td.textContent?.trim());
    expect(cells.slice(0, 4)).toEqual(['F', '2, 86', '5.86', '.004']);
    expect(first.querySelector('td.n')).not.toBeNull();
    const desc = section('Group summaries')!;
    expect(desc.querySelectorAll('tbody tr').length).toBe(ADVISING_PILOT_RESULT.descriptives.length);
    const comp = section('Pairwise comparisons')!;
    expect(comp.textContent).toContain('Tukey HSD');
    expect(comp.textContent).toContain('.003');
    expect(comp.querySelector('thead')?.textContent).not.toContain('unadjusted');
    expect(section('Rank-based alternatives')?.textContent).toContain('Kruskal–Wallis H');
    expect(section('Power and sensitivity')?.textContent).toContain('88%');
  });

  it('shows reconciliation verdicts as chips with words, and the engine notes', () => {
    render(ADVISING_PILOT_RESULT);
    const recon = section('Reported versus recomputed')!;
    expect(recon.querySelector('.chip')?.textContent).toContain('Agrees');
    expect(recon.textContent).toContain('F(2, 86) = 5.86, p = .004');
    expect(section('Notes from the engine')?.textContent).toContain('1 of 90 rows had a missing value');
  });

  it('draws an accessible Q-Q plot with a reference line', () => {
    render(ADVISING_PILOT_RESULT);
    const svg = el.querySelector('svg[role="img"]')!;
    const ids = svg.getAttribute('aria-labelledby')!.split(' ');
    expect(svg.querySelector(`#${ids[0]}`)?.textContent).toBe('Normal Q-Q plot of residuals');
    expect(svg.querySelector(`#${ids[1]}`)?.textContent).toContain(`${ADVISING_PILOT_RESULT.qq!.length} residual quantiles`);
    expect(svg.querySelectorAll('circle').length).toBe(ADVISING_PILOT_RESULT.qq!.length);
    expect(svg.querySelector('line.ref')).not.toBeNull();
  });

  it("shows Mauchly's test and the corrected df and p for a within-subject term", () => {
    render(BELONGING_SURVEY_RESULT);
    const sph = section('Sphericity and corrections (within-subject terms)')!;
    expect(sph.querySelector('.mauchly')?.textContent).toContain('W = .871, χ²(5) = 7.40, p = .192');
    const rows = Array.from(sph.querySelectorAll('tbody tr')).map((tr) => Array.from(tr.children).map((c) => c.textContent?.trim()));
    expect(rows[0]).toEqual(['Uncorrected: applies', '1', '3, 165', '31.13', '< .001']);
    expect(rows[1]).toEqual(['Greenhouse–Geisser', '.911', '2.73, 150.35', '31.13', '< .001']);
    expect(rows[3]).toEqual(['Lower bound', '.333', '1, 55', '31.13', '< .001']);
    expect(section('Pairwise comparisons')?.querySelector('thead')?.textContent).toContain('p (unadjusted)');
  });

  it('shows coefficients and model fit for a regression', () => {
    render(ADVISING_REGRESSION_RESULT);
    const coef = section('Regression coefficients')!;
    expect(coef.textContent).toContain('R² = .105');
    expect(coef.textContent).toContain('Intercept');
    expect(coef.textContent).toContain('VIF');
    const lines = Array.from(section('In brief')!.querySelectorAll('li')).map((li) => li.textContent);
    expect(lines).toContain('hs_gpa: b = 2.44, SE = 1.12, t(86) = 2.17, p = .033, 95% CI [0.20, 4.67]');
  });
});
