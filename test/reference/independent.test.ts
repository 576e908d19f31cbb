/**
 * Two independent groups against R: Student and Welch t, Levene and
 * Brown–Forsythe, Mann–Whitney (exact and normal approximation), Cohen's d,
 * descriptives and power (fixtures independent-*.json from test/reference/r/t-tests.R).
 * Tolerances: statistics 1e-6 relative, p-values and power 1e-6 absolute.
 */
import { describe, it } from 'vitest';
import { INDEPENDENT_FIXTURES } from './fixture-lists';
import { checkAssumptions, checkCounts, checkDescriptives, checkNonparametric, checkPower, checkTests, loadFixture } from './r-fixtures';


describe.each(INDEPENDENT_FIXTURES)('R reference: %s', (name) => {
  const fx = loadFixture(name);
  // source: R 4.2.2 t.test(y ~ g, var.equal = TRUE) and t.test(y ~ g, var.equal = FALSE); Cohen's d with pooled SD by formula
  it('Student and Welch t, mean difference, CI, d', () => checkTests(fx));
  // source: R 4.2.2 car 3.1.1 leveneTest(y ~ g, center = mean) and leveneTest(y ~ g, center = median); shapiro.test(residuals(lm(y ~ g)))
  it('Levene, Brown–Forsythe, Shapiro–Wilk on residuals', () => checkAssumptions(fx));
  // source: R 4.2.2 wilcox.test(y ~ g) with its defaults (exact without ties and n < 50, else normal approximation with continuity correction); W = U of the first group
  it('Mann–Whitney U', () => checkNonparametric(fx));
  // source: R 4.2.2 tapply mean/sd/length; se and t interval by formula on the data read back with read.csv
  it('group descriptives and counts', () => { checkDescriptives(fx); checkCounts(fx); });
  // source: R 4.2.2 noncentral t by formula (ncp = d·√(n1·n2/(n1+n2))); equal-n case cross-checked with power.t.test(strict = TRUE)
  it('power and detectable effect', () => checkPower(fx));
});
