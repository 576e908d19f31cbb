/**
 * The OpenAPI 3.1 description of every /api route. docs/openapi.yaml is written from this
 * (npx tsx server/docs/write-openapi.ts) and a test keeps the two and the routers in step.
 */
import { componentSchemas, ref } from './openapi-schemas';

type Json = Record<string, unknown>;
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

const json = (schema: Json) => ({ 'application/json': { schema } });
const ERROR_TEXT: Record<number, string> = {
  400: 'Invalid input; the message and fields name what is wrong',
  401: 'Not signed in',
  403: 'Visible, but your role may not do this',
  404: 'Absent, or not visible to you',
  409: 'Stale version (someone changed it since you read it) or the wrong state for this action',
  413: 'Too large',
  415: 'Not a CSV or XLSX file (the content is sniffed, not just the name)',
  422: 'Understood but not possible as things stand (the message says why)',
  429: 'Too many attempts; wait and retry',
  503: 'The database is unreachable',
};

interface OpSpec {
  summary: string;
  description?: string;
  params?: Json[];
  body?: Json | { content: Json };
  ok: [number, string, Json?] | [number, string, Json, string];
  errors?: number[];
  public?: boolean;
}

function operation(tag: string, o: OpSpec): Json {
  const [code, description, schema, type] = o.ok;
  const responses: Json = { [code]: { description, ...(schema ? { content: type ? { [type]: { schema } } : json(schema) } : {}) } };
  for (const e of o.errors ?? []) responses[e] = { description: ERROR_TEXT[e] ?? 'Error', content: json(ref('ApiError')) };
  if (!o.public && !(o.errors ?? []).includes(401)) responses[401] = { description: ERROR_TEXT[401], content: json(ref('ApiError')) };
  return {
    tags: [tag], summary: o.summary, ...(o.description ? { description: o.description } : {}),
    ...(o.params?.length ? { parameters: o.params } : {}),
    ...(o.body ? { requestBody: { required: true, content: 'content' in o.body ? o.body.content : json(o.body as Json) } } : {}),
    responses, ...(o.public ? { security: [] } : {}),
  };
}

const pathParam = (name: string, description: string, format?: string): Json => ({ name, in: 'path', required: true, description, schema: { type: 'string', ...(format ? { format } : {}) } });
const queryParam = (name: string, description: string, schema: Json = { type: 'string' }): Json => ({ name, in: 'query', required: false, description, schema });
const id = pathParam('id', 'Review request id', 'uuid');
const rerunId = pathParam('id', 'Rerun id', 'uuid');
const datasetId = pathParam('datasetId', 'Dataset id', 'uuid');
const listQuery = [queryParam('q', 'Search text'), queryParam('sort', 'Sort field'), queryParam('dir', 'asc or desc'), queryParam('page', '0-based page', { type: 'integer' }), queryParam('pageSize', 'Rows per page', { type: 'integer' })];
const arr = (items: Json): Json => ({ type: 'array', items });
const multipart = (description: string) => ({ content: { 'multipart/form-data': { schema: { type: 'object', properties: { file: { type: 'string', format: 'binary', description } }, required: ['file'] } } } });

/** Every route: path → method → [tag, operation]. */
function routes(): Record<string, Partial<Record<Method, [string, OpSpec]>>> {
  return {
    '/api/health': { get: ['platform', { summary: 'Service and database status', ok: [200, 'Healthy', ref('Health')], errors: [503], public: true }] },
    '/api/docs': { get: ['platform', { summary: 'This API description as a readable HTML page', ok: [200, 'HTML page', { type: 'string' }, 'text/html'], public: true }] },
    '/api/docs/openapi.yaml': { get: ['platform', { summary: 'This API description (OpenAPI 3.1, YAML)', ok: [200, 'YAML document', { type: 'string' }, 'application/yaml'], public: true }] },
    '/api/docs/docs.css': { get: ['platform', { summary: 'Stylesheet of the HTML description', ok: [200, 'CSS', { type: 'string' }, 'text/css'], public: true }] },

    '/api/auth/csrf': { get: ['auth', { summary: 'Sets the XSRF-TOKEN cookie (echo it in X-XSRF-TOKEN on every state-changing call)', ok: [204, 'Cookie set'], public: true }] },
    '/api/auth/login': { post: ['auth', { summary: 'Local sign-in', body: { type: 'object', properties: { email: { type: 'string' }, password: { type: 'string' } }, required: ['email', 'password'] }, ok: [200, 'Signed in', ref('Me')], errors: [400, 401, 429], public: true }] },
    '/api/auth/logout': { post: ['auth', { summary: 'Signs out', ok: [204, 'Signed out'], public: true }] },
    '/api/auth/me': { get: ['auth', { summary: 'The signed-in person', ok: [200, 'The caller', ref('Me')] }] },
    '/api/auth/saml/login': { get: ['auth', { summary: 'Starts single sign-on (redirect to the identity provider)', params: [queryParam('RelayState', 'App path to return to')], ok: [302, 'Redirect to the identity provider'], public: true }] },
    '/api/auth/saml/callback': { post: ['auth', { summary: 'Assertion consumer service (form post from the identity provider)', body: { content: { 'application/x-www-form-urlencoded': { schema: { type: 'object', properties: { SAMLResponse: { type: 'string' }, RelayState: { type: 'string' } } } } } }, ok: [302, 'Signed in; redirect into the app'], errors: [401], public: true }] },
    '/api/auth/saml/metadata': { get: ['auth', { summary: 'Service-provider metadata (XML)', ok: [200, 'Metadata', { type: 'string' }, 'application/xml'], public: true }] },
    '/api/me/expertise': {
      get: ['people', { summary: "The reviewer's declared methods expertise", ok: [200, 'Expertise', { type: 'object', properties: { expertise: arr({ type: 'string' }) } }], errors: [403] }],
      patch: ['people', { summary: "Sets the reviewer's declared methods expertise (design kinds)", body: { type: 'object', properties: { expertise: arr({ type: 'string' }) } }, ok: [200, 'Saved', { type: 'object', properties: { expertise: arr({ type: 'string' }) } }], errors: [400, 403] }],
    },

    '/api/departments': { get: ['people', { summary: 'Departments of the institution', ok: [200, 'Departments', arr(ref('DepartmentRef'))] }] },
    '/api/notifications': { get: ['notifications', { summary: "The caller's in-app notifications with the unread count", params: listQuery, ok: [200, 'A page', ref('NotificationPage')] }] },
    '/api/notifications/{id}/read': { post: ['notifications', { summary: 'Marks one notification read', params: [pathParam('id', 'Notification id', 'uuid')], ok: [204, 'Marked'], errors: [404] }] },

    '/api/requests': {
      get: ['requests', { summary: 'Lists requests in a scope (mine, intake, assigned, all)', params: [queryParam('scope', 'mine | intake | assigned | all'), queryParam('state', 'Filter by state'), ...listQuery], ok: [200, 'A page', ref('RequestPage')], errors: [400, 403] }],
      post: ['requests', { summary: 'Starts a draft (submitter)', body: ref('RequestCreateBody'), ok: [201, 'Created', ref('RequestDetail')], errors: [400, 403] }],
    },
    '/api/requests/{id}': {
      get: ['requests', { summary: 'One request', params: [id], ok: [200, 'The request', ref('RequestDetail')], errors: [404] }],
      patch: ['requests', { summary: 'Edits a draft or a request returned for revision (submitter; send version)', description: 'The plan field holds the filing form\'s PlanDraft; reported holds the reporting strings.', params: [id], body: ref('RequestPatchBody'), ok: [200, 'Saved', ref('RequestDetail')], errors: [400, 403, 404, 409] }],
    },
    '/api/requests/{id}/datasets': {
      get: ['filing', { summary: 'Data files of the request', params: [id], ok: [200, 'Datasets', arr(ref('DatasetPreview'))], errors: [404] }],
      post: ['filing', { summary: 'Uploads a CSV or XLSX file (multipart field "file"); stored with its SHA-256', description: 'The content is sniffed, not just the extension; a malformed file is refused with a specific message and nothing is stored.', params: [id], body: multipart('CSV or XLSX'), ok: [201, 'Stored; preview, column profiles and identifier findings', ref('DatasetPreview')], errors: [400, 403, 404, 409, 413, 415, 422] }],
    },
    '/api/requests/{id}/datasets/{datasetId}': {
      get: ['filing', { summary: 'One data file (preview)', params: [id, datasetId], ok: [200, 'Preview', ref('DatasetPreview')], errors: [404] }],
      delete: ['filing', { summary: 'Removes a data file from an editable request', params: [id, datasetId], ok: [204, 'Removed'], errors: [403, 404, 409] }],
    },
    '/api/requests/{id}/datasets/{datasetId}/file': { get: ['filing', { summary: 'Downloads the stored file', params: [id, datasetId], ok: [200, 'The file as uploaded', { type: 'string', format: 'binary' }, 'application/octet-stream'], errors: [404] }] },
    '/api/requests/{id}/datasets/{datasetId}/reshape': { post: ['filing', { summary: 'Reshapes a wide repeated-measures file to long (a new dataset)', params: [id, datasetId], body: ref('ReshapeBody'), ok: [201, 'The long dataset', ref('DatasetPreview')], errors: [400, 403, 404, 409] }] },
    '/api/requests/{id}/datasets/{datasetId}/identifiers': { post: ['filing', { summary: 'Confirms identifier columns as needed (with reasons) to lift the submission block', params: [id, datasetId], body: { type: 'object', description: 'See identifierConfirmSchema in shared/api/filing-schemas.ts.' }, ok: [200, 'Updated preview', ref('DatasetPreview')], errors: [400, 403, 404, 409] }] },
    '/api/requests/{id}/submit': { post: ['filing', { summary: 'Files the request (or resubmits a revision): validates the plan against the data by a dry run', params: [id], body: { type: 'object', description: 'See submitSchema in shared/api/filing-schemas.ts (version).' }, ok: [200, 'Filed', ref('RequestDetail')], errors: [400, 403, 404, 409, 422] }] },
    '/api/requests/{id}/withdraw': { post: ['filing', { summary: 'Withdraws the request (submitter)', params: [id], body: { type: 'object', description: 'See withdrawSchema in shared/api/filing-schemas.ts.' }, ok: [200, 'Withdrawn', ref('RequestDetail')], errors: [400, 403, 404, 409] }] },
    '/api/requests/{id}/versions': { get: ['filing', { summary: 'Saved revisions of the request', params: [id], ok: [200, 'Revisions', arr(ref('RequestVersionSummary'))], errors: [404] }] },
    '/api/requests/{id}/versions/{revisionNo}': { get: ['filing', { summary: 'One saved revision', params: [id, pathParam('revisionNo', 'Revision number')], ok: [200, 'The revision', ref('RequestVersionDetail')], errors: [404] }] },

    '/api/workload': { get: ['intake', { summary: "Each reviewer's open requests, due dates and turnaround (head)", ok: [200, 'The board', ref('Workload')], errors: [403] }] },
    '/api/office/settings': {
      get: ['intake', { summary: 'Office settings (service-level days, alpha default, letterhead)', ok: [200, 'Settings', ref('OfficeSettings')] }],
      put: ['intake', { summary: 'Changes the office settings (head; send version)', body: ref('OfficeSettings'), ok: [200, 'Saved', ref('OfficeSettings')], errors: [400, 403, 409] }],
    },
    '/api/requests/{id}/assignment': { put: ['intake', { summary: 'Assigns or reassigns the request to a reviewer (head); conflicts of interest are refused', params: [id], body: ref('AssignBody'), ok: [200, 'Assigned', ref('RequestDetail')], errors: [400, 403, 404, 409, 422] }] },
    '/api/requests/{id}/assignment/candidates': { get: ['intake', { summary: 'Reviewers with load, expertise match, conflicts and the suggestion (head)', params: [id], ok: [200, 'Candidates', arr(ref('AssignmentCandidate'))], errors: [403, 404] }] },
    '/api/requests/{id}/assignment/decline': { post: ['intake', { summary: 'The assigned reviewer declines (conflict, capacity, other); the request returns to the queue', params: [id], body: ref('DeclineBody'), ok: [204, 'Declined'], errors: [400, 403, 404, 409] }] },

    '/api/requests/{id}/reruns': {
      get: ['review', { summary: 'Reruns of the request, newest first (the submitter sees completed ones only)', params: [id], ok: [200, 'Reruns', arr(ref('RerunSummary'))], errors: [404] }],
      post: ['review', { summary: 'Starts a rerun in a worker thread (assigned reviewer or head)', description: 'Plan = the filed plan with planOverride merged over it; data = the newest data file of the current revision. The first rerun of an assigned request moves it to in-review. Follow progress with GET /api/reruns/{id}/events.', params: [id], body: ref('RerunBody'), ok: [202, 'Queued; Location names the rerun', ref('RerunSummary')], errors: [400, 403, 404, 409, 422] }],
    },
    '/api/reruns/{id}': { get: ['review', { summary: 'One rerun with its plan snapshot, result and live progress', params: [rerunId], ok: [200, 'The rerun', ref('RerunDetail')], errors: [404] }] },
    '/api/reruns/{id}/events': { get: ['review', { summary: 'Progress as server-sent events', description: 'Event names: progress, done, failed; data: RerunEvent JSON. The current state is sent at once; the stream ends after done or failed; comment lines are sent as heartbeats.', params: [rerunId], ok: [200, 'An event stream of RerunEvent', ref('RerunEvent'), 'text/event-stream'], errors: [404] }] },
    '/api/reruns/{id}/reproduce': { post: ['review', { summary: 'Runs a stored rerun again with the same plan snapshot and data, and compares', description: 'Waits for the new rerun; identical is true when the result JSON is the same, timings left aside.', params: [rerunId], ok: [201, 'The reproduction and the comparison', ref('ReproduceResult')], errors: [403, 404, 409] }] },
    '/api/requests/{id}/checklist': { get: ['review', { summary: 'All nine checklist entries in order, with automatic findings from the latest completed rerun', params: [id], ok: [200, 'Entries', arr(ref('ChecklistEntryView'))], errors: [403, 404] }] },
    '/api/requests/{id}/checklist/{criterion}': { put: ['review', { summary: 'Records a verdict and note (assigned reviewer, in review; optimistic locking)', params: [id, { name: 'criterion', in: 'path', required: true, schema: ref('Criterion') }], body: ref('ChecklistPutBody'), ok: [200, 'Saved entry', ref('ChecklistEntryView')], errors: [400, 403, 404, 409] }] },
    '/api/requests/{id}/comments': {
      get: ['review', { summary: 'The comment thread (internal notes only for the reviewer and the head)', params: [id], ok: [200, 'Comments, oldest first', arr(ref('CommentView'))], errors: [404] }],
      post: ['review', { summary: 'Adds a comment (submitter, assigned reviewer, head); HTML is sanitized on the server', params: [id], body: ref('CommentBody'), ok: [201, 'The stored comment', ref('CommentView')], errors: [400, 403, 404, 409] }],
    },
    '/api/requests/{id}/revision-request': {
      post: ['review', { summary: 'Returns the request for revision with the required changes (assigned reviewer, in review)', params: [id], body: ref('RevisionRequestBody'), ok: [201, 'Recorded; the submitter is notified', ref('RevisionRequestView')], errors: [400, 403, 404, 409] }],
      get: ['review', { summary: 'The latest required changes', params: [id], ok: [200, 'Required changes', ref('RevisionRequestView')], errors: [404] }],
    },
    '/api/requests/{id}/decision': {
      post: ['review', { summary: 'Records the decision (assigned reviewer, in review)', description: 'Every criterion needs a verdict (422 lists the missing ones); endorse cannot stand on a not-met verdict (422); endorse-with-conditions needs a condition (400).', params: [id], body: ref('DecisionBody'), ok: [201, 'Decided; the submitter is notified', ref('DecisionView')], errors: [400, 403, 404, 409, 422] }],
      get: ['review', { summary: 'The decision', params: [id], ok: [200, 'The decision', ref('DecisionView')], errors: [404] }],
    },

    '/api/requests/{id}/letters': { get: ['letters', { summary: 'Letters of the request', params: [id], ok: [200, 'Letters', arr(ref('LetterView'))], errors: [404] }] },
    '/api/requests/{id}/letter/sign': { post: ['letters', { summary: 'Signs the recommendation letter (reviewer; deliberate confirmation)', params: [id], body: ref('SignBody'), ok: [201, 'Signed letter and a message', { type: 'object', properties: { letter: ref('LetterView'), message: { type: 'string' } } }], errors: [400, 403, 404, 409] }] },
    '/api/requests/{id}/letter/countersign': { post: ['letters', { summary: 'Countersigns the letter (head, when the office requires it)', params: [id], body: ref('SignBody'), ok: [201, 'Countersigned letter and a message', { type: 'object', properties: { letter: ref('LetterView'), message: { type: 'string' } } }], errors: [400, 403, 404, 409] }] },
    '/api/requests/{id}/letter/amend': { post: ['letters', { summary: 'Issues an amended letter that supersedes the current one', params: [id], body: ref('AmendBody'), ok: [201, 'The new letter and a message', { type: 'object', properties: { letter: ref('LetterView'), message: { type: 'string' } } }], errors: [400, 403, 404, 409] }] },
    '/api/letters/{code}': { get: ['letters', { summary: 'Public verification of a letter by its code', params: [pathParam('code', 'Verification code')], ok: [200, 'Verification', ref('VerificationView')], errors: [400, 404, 429], public: true }] },
    '/api/letters/{code}/pdf': { get: ['letters', { summary: 'The letter PDF', params: [pathParam('code', 'Verification code')], ok: [200, 'PDF', { type: 'string', format: 'binary' }, 'application/pdf'], errors: [404] }] },
    '/api/letters/verify': { post: ['letters', { summary: 'Public verification of an uploaded letter PDF (multipart field "file")', body: multipart('The letter PDF'), ok: [200, 'Verification', ref('VerificationView')], errors: [400, 413, 429], public: true }] },

    '/api/admin/users': {
      get: ['admin', { summary: 'People of the office (admin)', params: listQuery, ok: [200, 'A page', ref('UserAdminPage')], errors: [403] }],
      post: ['admin', { summary: 'Adds a person (admin)', body: { type: 'object', description: 'See shared/api/schemas.ts.' }, ok: [201, 'Created', ref('UserAdminRow')], errors: [400, 403, 409] }],
    },
    '/api/admin/users/{id}': { patch: ['admin', { summary: 'Changes roles, department or active status (admin; send version)', params: [pathParam('id', 'Person id', 'uuid')], body: { type: 'object', description: 'See shared/api/schemas.ts.' }, ok: [200, 'Saved', ref('UserAdminRow')], errors: [400, 403, 404, 409] }] },
    '/api/admin/role-mappings': {
      get: ['admin', { summary: 'SSO attribute → role mappings (admin)', ok: [200, 'Mappings', arr(ref('RoleMapping'))], errors: [403] }],
      put: ['admin', { summary: 'Replaces the mappings (admin)', body: arr(ref('RoleMapping')), ok: [200, 'Saved', arr(ref('RoleMapping'))], errors: [400, 403] }],
    },
    '/api/admin/outbox': { get: ['admin', { summary: 'E-mail caught by the development mail server (admin; exists only in development and tests)', ok: [200, 'Messages', arr(ref('OutboxMail'))], errors: [403, 404] }] },
    '/api/audit': { get: ['admin', { summary: 'The append-only audit log (admin)', params: [queryParam('actor', 'E-mail or name fragment'), queryParam('action', 'Action prefix'), queryParam('entity', 'Entity type or id'), queryParam('from', 'YYYY-MM-DD'), queryParam('to', 'YYYY-MM-DD'), ...listQuery], ok: [200, 'A page', ref('AuditPage')], errors: [400, 403] }] },
  };
}

/** The whole OpenAPI document. */
export function openApiSpec(): Json {
  const paths: Record<string, Json> = {};
  for (const [path, methods] of Object.entries(routes())) {
    paths[path] = Object.fromEntries(Object.entries(methods).map(([m, [tag, o]]) => [m, operation(tag, o)]));
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Assayer API', version: '1.0.0',
      description: 'Statistical-methods review: requests, data, assignment, reruns, checklist, comments, decisions and letters. Sign in for a session cookie; send the XSRF-TOKEN cookie back in the X-XSRF-TOKEN header on every POST, PUT, PATCH and DELETE. Records you may not see answer 404; 403 means your role may not do this.',
    },
    servers: [{ url: '/' }],
    security: [{ session: [] }],
    tags: ['platform', 'auth', 'people', 'notifications', 'requests', 'filing', 'intake', 'review', 'letters', 'admin'].map((name) => ({ name })),
    paths,
    components: {
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'assayer.sid', description: 'Session cookie from sign-in' } },
      schemas: componentSchemas(),
    },
  };
}
