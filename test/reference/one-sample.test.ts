/**
 * One-sample design against R: t test, z test with a known SD, Cohen's d and
 * t-test power (fixtures one-sample-*.json from test/reference/r/t-tests.R).
 * Tolerances: statistics 1e-6 relative, p-values and power 1e-6 absolute.
 */
import { describe, it } from 'vitest';
import { ONE_SAMPLE_FIXTURES } from './fixture-lists';
import { checkAssumptions, checkCounts, checkDescriptives, checkPower, checkTests, loadFixture } from './r-fixtures';


describe.each(ONE_SAMPLE_FIXTURES)('R reference: %s', (name) => {
  const fx = loadFixture(name);
  // source: R 4.2.2 t.test(x, mu = mu); z = (mean − mu)/(sigma/√n), p = 2·pnorm(−|z|) by formula in R; d = (mean − mu)/sd by formula
  it('t (and z) test, estimate, CI, Cohen\'s d', () => checkTests(fx));
  // source: R 4.2.2 length, mean, sd of the data read back with read.csv; se and t interval by formula
  it('descriptives and rows used', () => { checkDescriptives(fx); checkCounts(fx); });
  if (fx.expected.assumptions) {
    // source: R 4.2.2 shapiro.test(x)
    it('Shapiro–Wilk', () => checkAssumptions(fx));
  }
  if (fx.expected.power) {
    // source: R 4.2.2 noncentral t pt()/qt() by formula, cross-checked in the generator with power.t.test(type = "one.sample", strict = TRUE)
    it('power and detectable effect', () => checkPower(fx));
  }
});
