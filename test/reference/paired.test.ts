/**
 * Paired design against R: paired t, d_z, Wilcoxon signed-rank (exact and
 * normal approximation) and power (fixtures paired-*.json from test/reference/r/t-tests.R).
 * Tolerances: statistics 1e-6 relative, p-values and power 1e-6 absolute.
 */
import { describe, it } from 'vitest';
import { PAIRED_FIXTURES } from './fixture-lists';
import { checkAssumptions, checkCounts, checkDescriptives, checkNonparametric, checkPower, checkTests, loadFixture } from './r-fixtures';


describe.each(PAIRED_FIXTURES)('R reference: %s', (name) => {
  const fx = loadFixture(name);
  // source: R 4.2.2 t.test(first, last, paired = TRUE); d_z = mean(diff)/sd(diff) by formula
  it('paired t, mean difference, CI, d_z', () => checkTests(fx));
  // source: R 4.2.2 wilcox.test(first, last, paired = TRUE) with its defaults; V = sum of positive ranks
  it('Wilcoxon signed-rank', () => checkNonparametric(fx));
  // source: R 4.2.2 shapiro.test(first − last)
  it('Shapiro–Wilk on the differences', () => checkAssumptions(fx));
  // source: R 4.2.2 per-visit length, mean, sd; se and t interval by formula
  it('visit descriptives and rows used', () => { checkDescriptives(fx); checkCounts(fx); });
  // source: R 4.2.2 noncentral t by formula, cross-checked with power.t.test(type = "paired", strict = TRUE)
  it('power and detectable effect', () => checkPower(fx));
});
