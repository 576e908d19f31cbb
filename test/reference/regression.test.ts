/**
 * Multiple regression against R: coefficients, SE, t, p, CI, VIF, R²,
 * adjusted R², residual SD and the overall F (fixtures regression-*.json from
 * test/reference/r/regression.R). Tolerances: statistics 1e-6 relative, p-values 1e-6 absolute.
 */
import { describe, it } from 'vitest';
import { REGRESSION_FIXTURES } from './fixture-lists';
import { checkCounts, checkRegression, checkTests, loadFixture } from './r-fixtures';


describe.each(REGRESSION_FIXTURES)('R reference: %s', (name) => {
  const fx = loadFixture(name);
  // source: R 4.2.2 summary(lm) coefficients, confint(lm), car 3.1.1 vif(lm), r.squared, adj.r.squared, sigma
  it('coefficients, intervals, VIF and fit', () => checkRegression(fx));
  // source: R 4.2.2 summary(lm)$fstatistic with pf(F, df1, df2, lower.tail = FALSE)
  it('overall F', () => checkTests(fx));
  // source: R 4.2.2 nrow of the data read back with read.csv
  it('rows used', () => checkCounts(fx));
});
