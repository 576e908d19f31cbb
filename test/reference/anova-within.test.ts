/**
 * Repeated-measures and mixed ANOVA against R: one within factor (with a
 * listwise-dropped subject), two within factors, one and two between factors
 * with one within factor; Mauchly, Greenhouse–Geisser, Huynh–Feldt (Lecoutre
 * form) and lower-bound corrections, generalized eta², Friedman and paired
 * comparisons (fixtures rm-*.json and mixed-*.json from test/reference/r/anova-within.R).
 * Tolerances: statistics 1e-6 relative, p-values 1e-6 absolute.
 */
import { describe, it } from 'vitest';
import { WITHIN_FIXTURES } from './fixture-lists';
import { checkComparisons, checkCounts, checkDescriptives, checkNonparametric, checkTests, loadFixture } from './r-fixtures';


describe.each(WITHIN_FIXTURES)('R reference: %s', (name) => {
  const fx = loadFixture(name);
  // source: R 4.2.2 afex 1.2.1 aov_ez(type = 3) → car 3.1.1 summary.Anova.mlm (univariate tests, Mauchly W and p,
  // GG and HF epsilon and p; HF in the Lecoutre N − g + 1 form, re-derived by formula); ges from afex's anova_table;
  // Mauchly chi-square and lower-bound correction by formula
  it('F tests, sphericity and corrections, eta² (partial and generalized)', () => checkTests(fx));
  // source: R 4.2.2 subjects with every cell present (listwise deletion done in the generator before aov_ez)
  it('subjects used and dropped', () => checkCounts(fx));
  // source: R 4.2.2 cell length, mean, sd on complete subjects; se and t interval by formula
  it('cell descriptives', () => checkDescriptives(fx));
  if (fx.expected.nonparametric) {
    // source: R 4.2.2 friedman.test(y ~ w | subject)
    it('Friedman', () => checkNonparametric(fx));
  }
  if (fx.expected.comparisons) {
    // source: R 4.2.2 t.test(paired = TRUE, conf.level = 1 − alpha/m, or 1 − alpha for BH) per pair;
    // pairwise.t.test(paired = TRUE, p.adjust.method = bonferroni | holm | BH)
    it('paired comparisons', () => checkComparisons(fx));
  }
});
