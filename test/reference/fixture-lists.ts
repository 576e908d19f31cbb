/** Which R fixtures each reference test file checks (one list per design family). */

/** One-sample t and z. */
export const ONE_SAMPLE_FIXTURES = ['one-sample-t', 'one-sample-z'];
/** Two independent groups. */
export const INDEPENDENT_FIXTURES = ['independent-small-exact', 'independent-ties-approx', 'independent-equal-n'];
/** Paired design. */
export const PAIRED_FIXTURES = ['paired-exact', 'paired-ties-approx', 'paired-alpha-01'];
/** Between-subjects ANOVA. */
export const BETWEEN_FIXTURES = [
  'anova-oneway-balanced', 'anova-oneway-unbalanced', 'anova-oneway-alpha-10',
  'anova-twoway-unbalanced-type3', 'anova-twoway-unbalanced-type2',
  'anova-threeway-type3', 'anova-threeway-type2',
];
/** Repeated-measures and mixed ANOVA. */
export const WITHIN_FIXTURES = ['rm-one-within', 'rm-two-within', 'mixed-one-between', 'mixed-two-between'];
/** Multiple regression. */
export const REGRESSION_FIXTURES = ['regression-four-predictors', 'regression-year-offset'];
