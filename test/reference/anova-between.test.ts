/**
 * Between-subjects ANOVA against R: one-way (balanced and unbalanced),
 * two-way unbalanced and three-way, Type II and III sums of squares with
 * sum-to-zero contrasts, effect sizes, Welch ANOVA, Kruskal–Wallis, variance
 * and normality checks, every pairwise method, simple effects and F power
 * (fixtures anova-*.json from test/reference/r/anova-between.R).
 * Tolerances: statistics 1e-6 relative, p-values and power 1e-6 absolute.
 */
import { describe, it } from 'vitest';
import { BETWEEN_FIXTURES } from './fixture-lists';
import {
  checkAssumptions, checkComparisons, checkCounts, checkDescriptives, checkNonparametric, checkPower, checkResidual,
  checkSimpleEffects, checkTests, loadFixture,
} from './r-fixtures';


describe.each(BETWEEN_FIXTURES)('R reference: %s', (name) => {
  const fx = loadFixture(name);
  // source: R 4.2.2 car 3.1.1 Anova(lm, type = 2 | 3) with options(contrasts = c("contr.sum", "contr.poly"));
  // partial eta² = SS/(SS + SSE), one-way eta² and omega² by formula; Welch row from oneway.test(var.equal = FALSE)
  it('F tests, sums of squares, effect sizes', () => checkTests(fx));
  // source: R 4.2.2 car::Anova residual row
  it('residual row', () => checkResidual(fx));
  // source: R 4.2.2 car 3.1.1 leveneTest(center = mean | median) across all cells; shapiro.test(residuals(lm))
  it('Levene, Brown–Forsythe, Shapiro–Wilk on residuals', () => checkAssumptions(fx));
  // source: R 4.2.2 tapply mean/sd/length; se and t interval by formula per cell
  it('cell descriptives and counts', () => { checkDescriptives(fx); checkCounts(fx); });
  // source: R 4.2.2 pf(qf(1 − a, df1, df2), df1, df2, ncp = f²·N, lower.tail = FALSE) with f² = η²p/(1 − η²p), N = rows used
  it('F power and detectable effect', () => checkPower(fx));
  if (fx.expected.nonparametric) {
    // source: R 4.2.2 kruskal.test
    it('Kruskal–Wallis', () => checkNonparametric(fx));
  }
  if (fx.expected.comparisons) {
    // source: R 4.2.2 TukeyHSD(conf.level = 1 − alpha) (Tukey–Kramer when n differ); pairwise.t.test(pool.sd = TRUE,
    // p.adjust.method = bonferroni | holm | BH); Games–Howell by formula in R with ptukey/qtukey and Welch df;
    // factorial designs: raw marginal groups on the full model's residual MS by formula with p.adjust/ptukey/qtukey;
    // intervals of the t-based families by formula (Bonferroni and Holm at 1 − alpha/m, BH at 1 − alpha)
    it('pairwise comparisons', () => checkComparisons(fx));
  }
  if (fx.expected.simpleEffects) {
    // source: R 4.2.2 cell-means formula against the full model's residual MS, checked in the generator against emmeans 1.8.4.1 joint_tests(lm, by = ...)
    it('simple effects', () => checkSimpleEffects(fx));
  }
});
