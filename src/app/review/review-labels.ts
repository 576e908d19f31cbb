import type { Criterion, Decision, Verdict } from '../../../shared/api/types';
import type { LetterStatus, RerunStatus } from '../../../shared/api/workflow';

/** Checklist criteria in our own words, in the order the reviewer walks them. */
export const CRITERION_LABELS: Record<Criterion, string> = {
  independence: 'Independence of observations',
  'variance-homogeneity': 'Equal variances across groups',
  sphericity: 'Sphericity of within-subject terms',
  'multiplicity-control': 'Control of multiple comparisons',
  'residual-normality': 'Normality of residuals',
  outliers: 'Outlying observations',
  'effect-size-precision': 'Effect sizes and their precision',
  'sample-size-power': 'Sample size and power',
  'reported-agreement': 'Reported versus recomputed results',
};

/** Verdict names as the reviewer picks them. */
export const VERDICT_LABELS: Record<Verdict, string> = {
  met: 'Met',
  concern: 'Concern',
  'not-met': 'Not met',
  'not-applicable': 'Not applicable',
};

/** Decision names as the letter states them. */
export const DECISION_LABELS: Record<Decision, string> = {
  endorse: 'Endorse',
  'endorse-with-conditions': 'Endorse with conditions',
  'revise-and-resubmit': 'Revise and resubmit',
  'not-endorsed': 'Not endorsed',
};

/** Rerun status in words. */
export const RERUN_STATUS_LABELS: Record<RerunStatus, string> = {
  queued: 'Waiting to start',
  running: 'Running',
  done: 'Finished',
  failed: 'Failed',
};

/** Letter status in words. */
export const LETTER_STATUS_LABELS: Record<LetterStatus, string> = {
  'awaiting-countersign': 'Awaiting the head’s countersignature',
  issued: 'Issued',
  superseded: 'Superseded',
};

/** Shortens a SHA-256 for lists; the full value goes in a title attribute and the screen-reader text. */
export function shortHash(hash: string | null | undefined): string {
  if (!hash) return '—';
  return hash.length > 16 ? `${hash.slice(0, 10)}…${hash.slice(-4)}` : hash;
}

/** Rerun stages (engine and worker names) in plain words; unknown stages are shown as sent. */
export const STAGE_LABELS: Record<string, string> = {
  queued: 'waiting for a worker',
  starting: 'starting',
  'reading data': 'reading the data file',
  validate: 'checking the plan against the data',
  prepare: 'preparing the cells',
  analyse: 'computing the tests and assumption checks',
  power: 'computing power and sensitivity',
  reconcile: 'comparing with the reported results',
  done: 'storing the result',
};

/** A stage name in words. */
export function stageText(stage: string | null): string {
  return stage ? STAGE_LABELS[stage] ?? stage : 'working';
}
