/** API shapes of the review routes beyond shared/api/workflow.ts (additive). */
import type { PersonRef } from './types';
import type { RerunSummary } from './workflow';

/** POST /api/reruns/:id/reproduce — the new rerun and whether it reproduced the original exactly. */
export interface ReproduceResult {
  /** The rerun that was reproduced. */
  originalId: string;
  /** The new rerun (same plan snapshot and data). */
  rerun: RerunSummary;
  /** True when both result JSONs are identical, timings left aside. */
  identical: boolean;
  /** JSON paths that differ (at most 20), empty when identical. */
  differences: string[];
}

/** GET /api/requests/:id/revision-request — the latest required changes. */
export interface RevisionRequestView {
  changes: string[];
  message: string;
  requestedBy: PersonRef | null;
  requestedAt: string;
  /** Revision round the changes were asked of (the submitter's next revision is this + 1). */
  revisionNo: number;
}
