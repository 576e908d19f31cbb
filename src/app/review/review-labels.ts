export { CRITERION_LABELS, DECISION_LABELS, VERDICT_LABELS } from '../../../shared/api/labels';
import type { LetterStatus, RerunStatus } from '../../../shared/api/workflow';

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
