/**
 * The product's vocabulary in words, for every screen, e-mail and letter: one source so
 * the reviewer's checklist and the signed letter name things identically.
 */
import type { Criterion, Decision, Verdict } from './types';

/** Checklist criteria, in the order the reviewer walks them. */
export const CRITERION_LABELS: Record<Criterion, string> = {
  independence: 'Independence of observations',
  'variance-homogeneity': 'Variance homogeneity',
  sphericity: 'Sphericity',
  'multiplicity-control': 'Multiplicity control',
  'residual-normality': 'Residual normality',
  outliers: 'Outliers',
  'effect-size-precision': 'Effect size and precision',
  'sample-size-power': 'Sample size and power',
  'reported-agreement': 'Reported versus recomputed results',
};

/** Verdicts on one criterion. */
export const VERDICT_LABELS: Record<Verdict, string> = {
  met: 'Met',
  concern: 'Concern',
  'not-met': 'Not met',
  'not-applicable': 'Not applicable',
};

/** Decisions as the reviewer chooses them. */
export const DECISION_LABELS: Record<Decision, string> = {
  endorse: 'Endorse',
  'endorse-with-conditions': 'Endorse with conditions',
  'revise-and-resubmit': 'Revise and resubmit',
  'not-endorsed': 'Not endorsed',
};
