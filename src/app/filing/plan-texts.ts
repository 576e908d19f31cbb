import type { DesignKind } from '../../../shared/api/types';
import type { ComparisonMethod } from '../../../shared/stats/contract';

/** One plain sentence per design kind, shown under its name in the design chooser. */
export const DESIGN_KIND_HINTS: Record<DesignKind, string> = {
  'one-sample': 'One group compared with a fixed value, e.g. a target or last year\'s mean.',
  'two-independent': 'Two separate groups of different people, e.g. pilot versus usual practice.',
  paired: 'The same people measured twice, e.g. before and after a workshop.',
  'between-anova': 'Three or more groups, or several grouping factors, each person in one cell only.',
  'repeated-measures': 'The same people measured three or more times or under several conditions.',
  mixed: 'Groups of different people, each measured several times.',
  regression: 'An outcome explained by one or more numeric or categorical predictors.',
};

/** Plain labels for the comparison methods and corrections. */
export const METHOD_LABELS: Record<ComparisonMethod, string> = {
  tukey: 'Tukey HSD (all pairs, equal variances)',
  'games-howell': 'Games–Howell (all pairs, unequal variances)',
  bonferroni: 'Bonferroni (divide alpha by the number of tests)',
  holm: 'Holm (step-down Bonferroni)',
  bh: 'Benjamini–Hochberg (false discovery rate)',
};

/** Short labels for summaries. */
export const METHOD_SHORT: Record<ComparisonMethod | 'none', string> = {
  tukey: 'Tukey HSD',
  'games-howell': 'Games–Howell',
  bonferroni: 'Bonferroni',
  holm: 'Holm',
  bh: 'Benjamini–Hochberg',
  none: 'No correction',
};

/** Which design kinds use which parts of the plan, so the form shows only what applies (two-level designs have no comparison family). */
export const DESIGN_USES: Record<DesignKind, { between: boolean; within: boolean; subject: boolean; predictors: boolean; mu: boolean; comparisons: boolean }> = {
  'one-sample': { between: false, within: false, subject: false, predictors: false, mu: true, comparisons: false },
  'two-independent': { between: true, within: false, subject: false, predictors: false, mu: false, comparisons: false },
  paired: { between: false, within: true, subject: true, predictors: false, mu: false, comparisons: false },
  'between-anova': { between: true, within: false, subject: false, predictors: false, mu: false, comparisons: true },
  'repeated-measures': { between: false, within: true, subject: true, predictors: false, mu: false, comparisons: true },
  mixed: { between: true, within: true, subject: true, predictors: false, mu: false, comparisons: true },
  regression: { between: false, within: false, subject: false, predictors: true, mu: false, comparisons: false },
};
