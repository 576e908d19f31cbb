/**
 * API shapes of the review workflow (filing, intake, review, decisions, letters),
 * shared by the Express routes and the Angular screens. Request-body schemas for
 * these live in ./workflow-schemas.ts.
 */
import type { AnalysisPlan, ComparisonMethod, RerunResult, ReportedInput } from '../stats/contract';
import type { AutoFinding } from '../review/checklist-findings';
import type { IdentifierFinding } from '../review/identifier-scan';
import type { Criterion, Decision, DesignKind, PersonRef, RequestState, Verdict } from './types';

// ───────────────────────── filing ─────────────────────────

/** A factor as the submitter describes it on the design step. */
export interface PlanFactor {
  /** Column in the data. */
  column: string;
  /** Levels the submitter expects (checked against the data on submit). */
  levels: string[];
}

/**
 * The analysis plan as the filing form holds it (`review_requests.plan`). Converted to the
 * engine's AnalysisPlan by `toEnginePlan` (shared/review/plan-mapping.ts) when the request is
 * submitted or rerun.
 */
export interface PlanDraft {
  designKind: DesignKind | null;
  outcome: string | null;
  between: PlanFactor[];
  within: PlanFactor[];
  subject: string | null;
  predictors: string[];
  /** One-sample: hypothesised mean and optional known SD. */
  mu?: number | null;
  sigma?: number | null;
  alpha: number;
  ssType?: 2 | 3;
  /** Planned comparisons and the correction the submitter used. */
  comparisons: { factor: string; method: ComparisonMethod }[];
  /** Correction the submitter says they used ('none' when none). */
  submitterCorrection: ComparisonMethod | 'none' | null;
  /** Number of tests the submitter treats as one family (optional). */
  familySize?: number | null;
}

/** Type detected for one column of an uploaded table. */
export type ColumnKind = 'numeric' | 'categorical' | 'identifier-like' | 'empty';

/** Profile of one column of an uploaded table. */
export interface ColumnProfile {
  name: string;
  kind: ColumnKind;
  /** Empty cells and NA. */
  missing: number;
  distinct: number;
  /** Up to 5 distinct example values. */
  examples: string[];
  /** Numeric columns: minimum and maximum. */
  min?: number;
  max?: number;
}

/** A dataset as the filing form shows it after upload (POST /api/requests/:id/datasets). */
export interface DatasetPreview {
  id: string;
  filename: string;
  format: 'csv' | 'xlsx';
  sizeBytes: number;
  sha256: string;
  rows: number;
  columns: ColumnProfile[];
  /** First rows (at most 20), as cell strings in column order. */
  previewRows: string[][];
  /** Columns that look like direct identifiers. */
  identifierFindings: IdentifierFinding[];
  /** Identifier columns the submitter confirmed as needed, with their reasons. */
  identifierConfirmations: { column: string; reason: string }[];
  /** True while an identifier finding is neither removed nor confirmed: submission is blocked. */
  blocked: boolean;
  /** Dataset this one was reshaped from (wide → long), if any. */
  derivedFrom: string | null;
  revisionNo: number;
  uploadedAt: string;
}

/** Body of POST /api/requests/:id/datasets/:datasetId/reshape (wide → long). */
export interface ReshapeBody {
  /** Column identifying the subject in the wide file. */
  subjectColumn: string;
  /** Columns holding the repeated measurements, in order. */
  measureColumns: string[];
  /** Name of the new within-subjects factor column, e.g. "wave". */
  factorName: string;
  /** Name of the new outcome column, e.g. "belonging". */
  valueName: string;
  /** Level labels for the measure columns (defaults to the column names). */
  levels?: string[];
  /** Other columns to carry along (between factors), repeated on every long row. */
  keepColumns?: string[];
}

/** Problems found when a request is submitted: plain words keyed by form field. */
export interface SubmitProblems {
  /** Keys like "plan.outcome", "dataset", "reported.0", "title". */
  fields: Record<string, string>;
}

/** One saved revision of a request (GET /api/requests/:id/versions). */
export interface RequestVersionSummary {
  revisionNo: number;
  createdAt: string;
  createdBy: PersonRef | null;
  reason: string | null;
  datasetIds: string[];
  rerunIds: string[];
}

// ───────────────────────── intake and workload ─────────────────────────

/** One reviewer on the workload board (GET /api/workload). */
export interface ReviewerLoad {
  reviewer: PersonRef;
  department: string | null;
  expertise: string[];
  openCount: number;
  dueSoon: number;
  overdue: number;
  open: { id: string; reference: string; title: string; state: RequestState; dueAt: string | null }[];
  /** Median days from assignment to decision over the last 180 days (null when none). */
  medianTurnaroundDays: number | null;
  /** Recent completed reviews for the turnaround chart. */
  completed: { reference: string; decidedAt: string; days: number }[];
}

/** GET /api/workload */
export interface Workload {
  serviceLevelDays: number;
  reviewers: ReviewerLoad[];
  /** Filed requests waiting for assignment. */
  unassigned: number;
}

/** GET /api/requests/:id/assignment/candidates */
export interface AssignmentCandidate {
  reviewer: PersonRef;
  openCount: number;
  expertiseMatch: boolean;
  expertise: string[];
  /** Why this reviewer cannot take the request (conflict of interest), or null. */
  conflict: string | null;
  /** The suggested reviewer: lowest load among those without conflict, expertise first. */
  suggested: boolean;
}

/** Body of PUT /api/requests/:id/assignment */
export interface AssignBody {
  reviewerId: string;
  /** YYYY-MM-DD; defaults to today + the office's service-level days. */
  dueAt?: string | null;
  note?: string;
  /** The request's version, for optimistic locking. */
  version: number;
}

/** Body of POST /api/requests/:id/assignment/decline (the assigned reviewer). */
export interface DeclineBody {
  reason: 'conflict' | 'capacity' | 'other';
  note: string;
}

/** Office settings (GET/PUT /api/office/settings). */
export interface OfficeSettings {
  name: string;
  serviceLevelDays: number;
  defaultAlpha: number;
  countersignRequired: boolean;
  dueSoonDays: number;
  letterhead: { unit: string; institution: string; addressLines: string[]; email: string; phone: string; website: string };
  version: number;
}

// ───────────────────────── review ─────────────────────────

/** Rerun status. */
export type RerunStatus = 'queued' | 'running' | 'done' | 'failed';

/** A rerun as lists show it. */
export interface RerunSummary {
  id: string;
  label: string;
  status: RerunStatus;
  engineVersion: string | null;
  dataSha256: string | null;
  datasetId: string | null;
  revisionNo: number;
  startedBy: PersonRef | null;
  startedAt: string | null;
  finishedAt: string | null;
  timings: { queuedMs?: number; parseMs?: number; totalMs?: number } | null;
  error: string | null;
}

/** GET /api/reruns/:id */
export interface RerunDetail extends RerunSummary {
  requestId: string;
  planSnapshot: AnalysisPlan;
  result: RerunResult | null;
  /** Progress while running (0–1) and the stage name. */
  progress: number;
  stage: string | null;
}

/** Body of POST /api/requests/:id/reruns */
export interface RerunBody {
  /** Label of the variant, e.g. "as filed", "Welch", "with Games–Howell". */
  label?: string;
  /** Changes to the engine plan for this variant (merged over the filed plan). */
  planOverride?: Partial<AnalysisPlan>;
}

/** Server-sent event on GET /api/reruns/:id/events (event name "progress", "done" or "failed"). */
export interface RerunEvent {
  status: RerunStatus;
  progress: number;
  stage: string | null;
  error?: string;
}

/** One checklist entry (GET /api/requests/:id/checklist). */
export interface ChecklistEntryView {
  criterion: Criterion;
  verdict: Verdict | null;
  note: string;
  /** Automatic finding from the latest completed rerun, or null before any rerun. */
  auto: AutoFinding | null;
  rerunId: string | null;
  reviewer: PersonRef | null;
  updatedAt: string | null;
  version: number;
}

/** Body of PUT /api/requests/:id/checklist/:criterion */
export interface ChecklistPutBody {
  verdict: Verdict | null;
  note: string;
  version: number;
}

/** One comment (GET /api/requests/:id/comments). */
export interface CommentView {
  id: string;
  author: PersonRef | null;
  /** Sanitized HTML. */
  bodyHtml: string;
  /** Internal notes are visible to reviewers and the head only. */
  internal: boolean;
  createdAt: string;
}

/** Body of POST /api/requests/:id/comments */
export interface CommentBody {
  /** HTML from the editor; sanitized on the server. */
  body: string;
  internal?: boolean;
}

/** Body of POST /api/requests/:id/revision-request */
export interface RevisionRequestBody {
  /** Required changes, one per item. */
  changes: string[];
  message?: string;
  version: number;
}

/** Body of POST /api/requests/:id/decision */
export interface DecisionBody {
  decision: Decision;
  /** Conditions (required for endorse-with-conditions). */
  conditions: string[];
  /** Reasoning shown in the letter. */
  rationale: string;
  /** The rerun the decision rests on (defaults to the latest completed). */
  rerunId?: string;
  version: number;
}

/** GET /api/requests/:id/decision */
export interface DecisionView {
  decision: Decision;
  conditions: string[];
  rationale: string;
  decidedBy: PersonRef | null;
  decidedAt: string;
  rerunId: string | null;
}

// ───────────────────────── letters ─────────────────────────

/** Letter status. */
export type LetterStatus = 'awaiting-countersign' | 'issued' | 'superseded';

/** A letter as the request page shows it. */
export interface LetterView {
  code: string;
  letterNo: number;
  status: LetterStatus;
  decision: Decision;
  signedBy: PersonRef | null;
  signedAt: string | null;
  countersignedBy: PersonRef | null;
  supersededBy: string | null;
  pdfSha256: string | null;
  /** Relative download URL (GET /api/letters/:code/pdf). */
  downloadUrl: string;
  verifyUrl: string;
}

/** Body of POST /api/requests/:id/letter/sign and /countersign: a deliberate confirmation. */
export interface SignBody {
  /** The request reference typed by the signer, e.g. "HV-2026-014". */
  confirmReference: string;
  /** The signer's password, for local accounts (re-authentication). */
  password?: string;
}

/** Public verification result (GET /api/letters/:code, POST /api/letters/verify). */
export interface VerificationView {
  status: 'valid-current' | 'valid-superseded' | 'altered' | 'unknown-code' | 'not-a-pdf';
  /** One plain sentence for the headline. */
  headline: string;
  details: string[];
  code?: string;
  letter?: {
    reference: string;
    title: string;
    office: string;
    decision: Decision;
    signedAt: string | null;
    signedBy: string | null;
    letterNo: number;
    supersededBy: string | null;
  };
}

// ───────────────────────── notifications ─────────────────────────

/** Events that notify people (in-app and by e-mail). */
export const NOTIFY_EVENTS = [
  'request.filed',
  'request.assigned',
  'assignment.declined',
  'request.revision-requested',
  'request.resubmitted',
  'request.decided',
  'request.due-soon',
  'letter.ready',
  'letter.countersign-needed',
  'comment.added',
] as const;
/** One of {@link NOTIFY_EVENTS}. */
export type NotifyEvent = (typeof NOTIFY_EVENTS)[number];

/** A stored e-mail on the development outbox page (GET /api/admin/outbox). */
export interface OutboxMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

/** The reported results the submitter intends to publish (`review_requests.reported`). */
export type ReportedResults = ReportedInput[];
