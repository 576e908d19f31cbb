/**
 * Shapes of the JSON the API sends and receives, shared by the Express server and
 * the Angular app. Validation schemas for request bodies live in ./schemas.ts.
 */

/** Roles a person can hold; a person may hold several. */
export const ROLES = ['submitter', 'reviewer', 'head', 'admin'] as const;
/** One of {@link ROLES}. */
export type Role = (typeof ROLES)[number];

/** Request states, in the order a request usually passes through them. */
export const REQUEST_STATES = ['draft', 'filed', 'assigned', 'in-review', 'revision-requested', 'decided', 'withdrawn'] as const;
/** One of {@link REQUEST_STATES}. */
export type RequestState = (typeof REQUEST_STATES)[number];

/** Human labels for request states (our vocabulary). */
export const REQUEST_STATE_LABELS: Record<RequestState, string> = {
  draft: 'Draft',
  filed: 'Filed',
  assigned: 'Assigned',
  'in-review': 'In review',
  'revision-requested': 'Revision requested',
  decided: 'Decided',
  withdrawn: 'Withdrawn',
};

/** Checklist criteria a reviewer walks. */
export const CRITERIA = [
  'independence',
  'variance-homogeneity',
  'sphericity',
  'multiplicity-control',
  'residual-normality',
  'outliers',
  'effect-size-precision',
  'sample-size-power',
  'reported-agreement',
] as const;
/** One of {@link CRITERIA}. */
export type Criterion = (typeof CRITERIA)[number];

/** Verdicts on one criterion. */
export const VERDICTS = ['met', 'concern', 'not-met', 'not-applicable'] as const;
/** One of {@link VERDICTS}. */
export type Verdict = (typeof VERDICTS)[number];

/** Decisions a reviewer returns. */
export const DECISIONS = ['endorse', 'endorse-with-conditions', 'revise-and-resubmit', 'not-endorsed'] as const;
/** One of {@link DECISIONS}. */
export type Decision = (typeof DECISIONS)[number];

/** Design kinds as the submitter describes them (mapped to engine designs). */
export const DESIGN_KINDS = ['one-sample', 'two-independent', 'paired', 'between-anova', 'repeated-measures', 'mixed', 'regression'] as const;
/** One of {@link DESIGN_KINDS}. */
export type DesignKind = (typeof DESIGN_KINDS)[number];

/** The signed-in person (GET /api/auth/me, POST /api/auth/login). */
export interface Me {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  /** Department name, when known. */
  department?: string | null;
}

/** A page of a list endpoint. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** Common list query: ?q=&sort=&dir=&page=&pageSize= (page is 0-based). */
export interface ListQuery {
  q?: string;
  sort?: string;
  dir?: 'asc' | 'desc';
  page?: number;
  pageSize?: number;
}

/** A person as lists show them. */
export interface PersonRef {
  id: string;
  name: string;
  email: string;
}

/** One row of a request list (GET /api/requests). */
export interface RequestSummary {
  id: string;
  /** Short human reference, e.g. "HV-2026-014". */
  reference: string;
  title: string;
  state: RequestState;
  designKind: DesignKind | null;
  department: string | null;
  submitter: PersonRef;
  reviewer: PersonRef | null;
  /** ISO dates. */
  createdAt: string;
  filedAt: string | null;
  dueAt: string | null;
  deadline: string | null;
  updatedAt: string;
}

/** GET /api/requests/:id */
export interface RequestDetail extends RequestSummary {
  purpose: string;
  decisionInformed: string;
  audience: string;
  samplingNotes: string;
  /** Analysis plan as filed (engine contract shape), if any. */
  plan: Record<string, unknown> | null;
  /** Results the submitter intends to report, as typed (reconciled by every rerun). */
  reported: { term?: string; text: string }[];
  /** Department id (for editing; `department` carries its name). */
  departmentId: string | null;
  /** Current revision number (1 until a revision is submitted). */
  revisionNo: number;
  datasets: { id: string; filename: string; sha256: string; rows: number; columns: string[]; uploadedAt: string }[];
  /** Version number for optimistic locking; send it back when editing. */
  version: number;
  /** What the caller may do now. */
  can: { edit: boolean; assign: boolean; review: boolean; decide: boolean; withdraw: boolean };
}

/** GET /api/admin/users rows. */
export interface UserAdminRow {
  id: string;
  email: string;
  name: string;
  department: string | null;
  roles: Role[];
  /** "local", "saml" or both. */
  signIn: ('local' | 'saml')[];
  active: boolean;
  lastSignInAt: string | null;
  version: number;
}

/** A mapping from an SSO attribute value to a role (office configuration). */
export interface RoleMapping {
  id: string;
  /** Attribute name, e.g. "eduPersonAffiliation" or "isMemberOf". */
  attribute: string;
  /** Value that grants the role, e.g. "staff" or "oie-reviewers". */
  value: string;
  role: Role;
}

/** One audit-log entry (GET /api/audit). Append-only. */
export interface AuditEntry {
  id: string;
  at: string;
  actor: PersonRef | null;
  /** Dotted action name, e.g. "auth.login", "request.filed", "user.roles-changed". */
  action: string;
  entityType: string | null;
  entityId: string | null;
  /** Free-form details (old/new values, IP). */
  details: Record<string, unknown>;
}

/** GET /api/health */
export interface Health {
  status: 'ok' | 'degraded';
  version: string;
  database: { status: 'ok' | 'down'; latencyMs?: number; error?: string };
  uptimeSeconds: number;
  /** True when the demo office is seeded and the sign-in page may list the demo accounts. */
  demo?: boolean;
  /** The office this installation serves, for the top bar. */
  office?: { name: string; institution?: string };
}

/** JSON error body of every failed API call. */
export interface ApiError {
  error: {
    status: number;
    /** Stable machine code, e.g. "validation", "forbidden", "not-found", "conflict". */
    code: string;
    message: string;
    /** Per-field messages for validation errors: path → message. */
    fields?: Record<string, string>;
  };
}

/** One in-app notification (GET /api/notifications). */
export interface NotificationItem {
  id: string;
  /** Event kind, e.g. "request.filed", "request.assigned". */
  kind: string;
  title: string;
  body: string;
  /** App-relative link, e.g. /requests/<id>. */
  link: string | null;
  requestId: string | null;
  createdAt: string;
  readAt: string | null;
}

/** GET /api/notifications: a page plus the caller's unread count. POST /api/notifications/:id/read marks one read (204). */
export interface NotificationPage extends Page<NotificationItem> {
  unread: number;
}

/** A department of the institution (GET /api/departments), for request and people forms. */
export interface DepartmentRef {
  id: string;
  code: string;
  name: string;
}
