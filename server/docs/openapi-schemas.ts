/**
 * Component schemas of the OpenAPI description. The TypeScript shapes in shared/api/
 * (types.ts, workflow.ts, review-types.ts) are authoritative; these mirror them for readers
 * and client generators.
 */
import { CRITERIA, DECISIONS, DESIGN_KINDS, REQUEST_STATES, ROLES, VERDICTS } from '../../shared/api/types';
import { NOTIFY_EVENTS } from '../../shared/api/workflow';

type Schema = Record<string, unknown>;
/** A reference to a component schema. */
export const ref = (name: string): Schema => ({ $ref: `#/components/schemas/${name}` });
const str = (description?: string, extra: Schema = {}): Schema => ({ type: 'string', ...(description ? { description } : {}), ...extra });
const num = (description?: string): Schema => ({ type: 'number', ...(description ? { description } : {}) });
const int = (description?: string): Schema => ({ type: 'integer', ...(description ? { description } : {}) });
const bool = (description?: string): Schema => ({ type: 'boolean', ...(description ? { description } : {}) });
const nullable = (s: Schema): Schema => ({ oneOf: [s, { type: 'null' }] });
const arr = (items: Schema, description?: string): Schema => ({ type: 'array', items, ...(description ? { description } : {}) });
const date = (description?: string) => str(description, { format: 'date-time' });
const uuid = (description?: string) => str(description, { format: 'uuid' });
/** An object schema; every property is required unless listed in `optional`. */
export const obj = (properties: Record<string, Schema>, optional: string[] = [], description?: string): Schema => ({
  type: 'object', ...(description ? { description } : {}), properties, required: Object.keys(properties).filter((k) => !optional.includes(k)),
});
/** A loosely described object (its shape is given in the TypeScript file named). */
const shapeIn = (file: string, name: string): Schema => ({ type: 'object', description: `See ${name} in ${file}.`, additionalProperties: true });

/** All component schemas. */
export function componentSchemas(): Record<string, Schema> {
  return {
    ApiError: obj({ error: obj({ status: int(), code: str('Stable machine code, e.g. validation, forbidden, not-found, conflict'), message: str('Human message naming the field at fault'), fields: { type: 'object', additionalProperties: { type: 'string' }, description: 'Field path → message' } }, ['fields']) }, [], 'Every failed call answers with this body.'),
    PersonRef: obj({ id: uuid(), name: str(), email: str() }),
    Role: { type: 'string', enum: [...ROLES] },
    RequestState: { type: 'string', enum: [...REQUEST_STATES] },
    DesignKind: { type: 'string', enum: [...DESIGN_KINDS] },
    Criterion: { type: 'string', enum: [...CRITERIA] },
    Verdict: { type: 'string', enum: [...VERDICTS] },
    Decision: { type: 'string', enum: [...DECISIONS] },
    NotifyEvent: { type: 'string', enum: [...NOTIFY_EVENTS] },
    Me: obj({ id: uuid(), email: str(), name: str(), roles: arr(ref('Role')), department: nullable(str()) }, ['department']),
    Health: shapeIn('shared/api/types.ts', 'Health'),
    DepartmentRef: obj({ id: uuid(), code: str(), name: str() }),
    RequestSummary: obj({
      id: uuid(), reference: str('e.g. HV-2026-014'), title: str(), state: ref('RequestState'), designKind: nullable(ref('DesignKind')), department: nullable(str()),
      submitter: ref('PersonRef'), reviewer: nullable(ref('PersonRef')), createdAt: date(), filedAt: nullable(date()), dueAt: nullable(str()), deadline: nullable(str()), updatedAt: date(),
    }),
    RequestDetail: { allOf: [ref('RequestSummary'), obj({
      purpose: str(), decisionInformed: str(), audience: str(), samplingNotes: str(), plan: nullable({ type: 'object' }),
      datasets: arr({ type: 'object' }), version: int('Send back when editing (optimistic locking)'),
      can: obj({ edit: bool(), assign: bool(), review: bool(), decide: bool(), withdraw: bool() }),
    })], description: 'GET /api/requests/{id}' },
    RequestPage: obj({ items: arr(ref('RequestSummary')), total: int(), page: int(), pageSize: int() }),
    RequestCreateBody: shapeIn('shared/api/schemas.ts', 'requestCreateSchema'),
    RequestPatchBody: shapeIn('shared/api/schemas.ts', 'requestPatchSchema (any fields plus version)'),
    PlanDraft: shapeIn('shared/api/workflow.ts', 'PlanDraft'),
    DatasetPreview: shapeIn('shared/api/workflow.ts', 'DatasetPreview'),
    ReshapeBody: shapeIn('shared/api/workflow.ts', 'ReshapeBody'),
    SubmitProblems: shapeIn('shared/api/workflow.ts', 'SubmitProblems'),
    RequestVersionSummary: shapeIn('shared/api/workflow.ts', 'RequestVersionSummary'),
    RequestVersionDetail: shapeIn('shared/api/filing-types.ts', 'RequestVersionDetail'),
    Workload: shapeIn('shared/api/workflow.ts', 'Workload'),
    AssignmentCandidate: shapeIn('shared/api/workflow.ts', 'AssignmentCandidate'),
    AssignBody: obj({ reviewerId: uuid(), dueAt: nullable(str('YYYY-MM-DD')), note: str(), version: int() }, ['dueAt', 'note']),
    DeclineBody: obj({ reason: { type: 'string', enum: ['conflict', 'capacity', 'other'] }, note: str() }),
    OfficeSettings: shapeIn('shared/api/workflow.ts', 'OfficeSettings'),
    AnalysisPlan: { type: 'object', description: 'The engine plan (shared/stats/contract.ts, docs/rerun-contract.md): design, outcome, between, within, subject, predictors, mu, sigma, alpha, ssType, comparisons, reported.', additionalProperties: true },
    RerunResult: { type: 'object', description: 'The engine result (shared/stats/contract.ts, docs/rerun-contract.md).', additionalProperties: true },
    RerunStatus: { type: 'string', enum: ['queued', 'running', 'done', 'failed'] },
    RerunBody: obj({ label: str('Variant label; default "as filed" for the first rerun, else "variant N"'), planOverride: { type: 'object', description: 'Plan fields merged over the filed plan (null removes a field); validated by the engine plan schema — 400 names the field.' } }, ['label', 'planOverride']),
    RerunSummary: obj({
      id: uuid(), label: str(), status: ref('RerunStatus'), engineVersion: nullable(str()), dataSha256: nullable(str('SHA-256 of the data file used')), datasetId: nullable(uuid()),
      revisionNo: int('Revision round of the request'), startedBy: nullable(ref('PersonRef')), startedAt: nullable(date()), finishedAt: nullable(date()),
      timings: nullable(obj({ queuedMs: num(), parseMs: num(), totalMs: num() }, ['queuedMs', 'parseMs', 'totalMs'])), error: nullable(str()),
    }),
    RerunDetail: { allOf: [ref('RerunSummary'), obj({ requestId: uuid(), planSnapshot: ref('AnalysisPlan'), result: nullable(ref('RerunResult')), progress: num('0–1'), stage: nullable(str()) })] },
    RerunEvent: obj({ status: ref('RerunStatus'), progress: num('0–1'), stage: nullable(str()), error: str() }, ['error'], 'data of each server-sent event'),
    ReproduceResult: obj({ originalId: uuid(), rerun: ref('RerunSummary'), identical: bool('Result JSON identical, timings left aside'), differences: arr(str(), 'JSON paths that differ (at most 20)') }),
    AutoFinding: obj({ criterion: ref('Criterion'), suggested: nullable(ref('Verdict')), summary: str(), evidence: arr(obj({ label: str(), value: str() })), basis: arr(str(), 'Where thresholds come from ("common practice" when a rule of thumb)') }),
    ChecklistEntryView: obj({
      criterion: ref('Criterion'), verdict: nullable(ref('Verdict')), note: str(), auto: nullable(ref('AutoFinding')), rerunId: nullable(uuid()),
      reviewer: nullable(ref('PersonRef')), updatedAt: nullable(date()), version: int('0 before the first save'),
    }),
    ChecklistPutBody: obj({ verdict: nullable(ref('Verdict')), note: str(), version: int('The version you read; stale → 409') }),
    CommentView: obj({ id: uuid(), author: nullable(ref('PersonRef')), bodyHtml: str('Sanitized HTML'), internal: bool(), createdAt: date() }),
    CommentBody: obj({ body: str('HTML; sanitized to p, br, strong, em, ul, ol, li, a[href http/https/mailto], code, blockquote'), internal: bool('Reviewer and head only') }, ['internal']),
    RevisionRequestBody: obj({ changes: arr(str(), 'At least one required change'), message: str(), version: int() }, ['message']),
    RevisionRequestView: obj({ changes: arr(str()), message: str(), requestedBy: nullable(ref('PersonRef')), requestedAt: date(), revisionNo: int() }),
    DecisionBody: obj({ decision: ref('Decision'), conditions: arr(str(), 'At least one for endorse-with-conditions'), rationale: str(), rerunId: uuid('Defaults to the latest completed rerun'), version: int() }, ['rerunId']),
    DecisionView: obj({ decision: ref('Decision'), conditions: arr(str()), rationale: str(), decidedBy: nullable(ref('PersonRef')), decidedAt: date(), rerunId: nullable(uuid()) }),
    LetterView: shapeIn('shared/api/workflow.ts', 'LetterView'),
    SignBody: obj({ confirmReference: str('The request reference, typed'), password: str('Local accounts: re-authentication') }, ['password']),
    AmendBody: shapeIn('shared/api/letter-schemas.ts', 'amendBodySchema'),
    VerificationView: shapeIn('shared/api/workflow.ts', 'VerificationView'),
    NotificationPage: shapeIn('shared/api/types.ts', 'NotificationPage'),
    AuditPage: shapeIn('shared/api/types.ts', 'Page<AuditEntry>'),
    UserAdminRow: shapeIn('shared/api/types.ts', 'UserAdminRow'),
    UserAdminPage: shapeIn('shared/api/types.ts', 'Page<UserAdminRow>'),
    RoleMapping: shapeIn('shared/api/types.ts', 'RoleMapping'),
    OutboxMail: shapeIn('shared/api/workflow.ts', 'OutboxMail'),
  };
}
