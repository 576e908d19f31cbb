/**
 * API shapes of filing that workflow.ts does not define: the frozen snapshot of a
 * revision (GET /api/requests/:id/versions/:revisionNo).
 */
import type { ReportedInput, AnalysisPlan } from '../stats/contract';
import type { DesignKind } from './types';
import type { PlanDraft, RequestVersionSummary } from './workflow';

/** What a request looked like when one revision was filed. */
export interface RequestVersionSnapshot {
  title: string;
  purpose: string;
  decisionInformed: string;
  audience: string;
  samplingNotes: string;
  deadline: string | null;
  designKind: DesignKind | null;
  /** The plan as the form held it. */
  plan: PlanDraft | null;
  /** The engine plan built from it at filing time (reruns start from this). */
  enginePlan: AnalysisPlan | null;
  reported: ReportedInput[];
  /** The dataset the plan uses, with its hash. */
  datasetId: string | null;
  datasetSha256: string | null;
  /** What the submitter said changed (revisions). */
  note: string | null;
}

/** GET /api/requests/:id/versions/:revisionNo */
export interface RequestVersionDetail extends RequestVersionSummary {
  /** Snapshot fields; versions written before filing existed may lack some of them. */
  snapshot: Partial<RequestVersionSnapshot>;
}
