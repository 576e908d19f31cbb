/**
 * Validation schemas (zod) for request bodies and list queries. The server validates
 * every body with these; the Angular forms reuse them so both sides say the same thing.
 */
import { z } from 'zod';
import { planDraftSchema, reportedSchema } from './filing-schemas';
import { DESIGN_KINDS, REQUEST_STATES, ROLES } from './types';

const trimmed = (label: string, max: number) =>
  z.string({ error: `${label} must be text` }).trim().max(max, { error: `${label} must be at most ${max} characters` });
const required = (label: string, max: number) => trimmed(label, max).min(1, { error: `${label} is required` });
const isoDate = (label: string) =>
  z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: `${label} must be a date written YYYY-MM-DD` })
    .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), { error: `${label} is not a real date` });

/** POST /api/auth/login */
export const loginSchema = z.object({
  email: z.email({ error: 'Enter the e-mail address of your account' }).max(254),
  password: z.string({ error: 'Enter your password' }).min(1, { error: 'Enter your password' }).max(200),
});
/** Body of POST /api/auth/login. */
export type LoginBody = z.infer<typeof loginSchema>;

/** Fields a submitter fills in on the purpose step (shared by create and edit). */
const requestFields = {
  title: required('Title', 300),
  purpose: trimmed('Purpose', 10_000),
  decisionInformed: trimmed('Decision informed', 10_000),
  audience: trimmed('Audience', 500),
  samplingNotes: trimmed('Sampling notes', 20_000),
  deadline: isoDate('Deadline').nullable(),
  departmentId: z.uuid({ error: 'Department must be one of the listed departments' }).nullable(),
  designKind: z.enum(DESIGN_KINDS, { error: `Design kind must be one of: ${DESIGN_KINDS.join(', ')}` }).nullable(),
  plan: z.record(z.string(), z.unknown()).nullable(),
};

/** POST /api/requests — only the title is needed to start a draft. */
export const requestCreateSchema = z.object({
  ...requestFields,
  purpose: requestFields.purpose.optional(),
  decisionInformed: requestFields.decisionInformed.optional(),
  audience: requestFields.audience.optional(),
  samplingNotes: requestFields.samplingNotes.optional(),
  deadline: requestFields.deadline.optional(),
  departmentId: requestFields.departmentId.optional(),
  designKind: requestFields.designKind.optional(),
  plan: requestFields.plan.optional(),
}).strict();
/** Body of POST /api/requests. */
export type RequestCreateBody = z.infer<typeof requestCreateSchema>;

/** PATCH /api/requests/:id — any subset of the fields plus the version last read. */
export const requestPatchSchema = z.object({
  ...Object.fromEntries(Object.entries(requestFields).map(([k, v]) => [k, v.optional()])) as {
    [K in keyof typeof requestFields]: z.ZodOptional<(typeof requestFields)[K]>;
  },
  /** The plan as the filing form holds it (PlanDraft). */
  plan: planDraftSchema.nullable().optional(),
  /** Reported results the submitter intends to publish. */
  reported: reportedSchema.nullable().optional(),
  version: z.number({ error: 'version is required (the version you last read)' }).int().min(0),
}).strict();
/** Body of PATCH /api/requests/:id. */
export type RequestPatchBody = z.infer<typeof requestPatchSchema>;

const pageFields = {
  q: z.string().trim().max(200).optional(),
  dir: z.enum(['asc', 'desc'], { error: 'dir must be asc or desc' }).optional(),
  page: z.coerce.number({ error: 'page must be a whole number' }).int().min(0).default(0),
  pageSize: z.coerce.number({ error: 'pageSize must be a whole number' }).int().min(1).max(100, { error: 'pageSize must be at most 100' }).default(25),
};

/** Request list scopes: own requests, the head's intake queue, the reviewer's queue, everything visible. */
export const REQUEST_SCOPES = ['mine', 'intake', 'assigned', 'all'] as const;
/** One of {@link REQUEST_SCOPES}. */
export type RequestScope = (typeof REQUEST_SCOPES)[number];

/** Columns a request list can be sorted by. */
export const REQUEST_SORT_KEYS = ['reference', 'title', 'state', 'createdAt', 'updatedAt', 'filedAt', 'deadline', 'department', 'submitter', 'reviewer', 'dueAt'] as const;

/** GET /api/requests query. */
export const requestListQuerySchema = z.object({
  ...pageFields,
  scope: z.enum(REQUEST_SCOPES, { error: `scope must be one of: ${REQUEST_SCOPES.join(', ')}` }).optional(),
  /** One state or several, comma-separated (the table's state chips). */
  state: z.string().trim().max(200).optional()
    .transform((s) => (s ? s.split(',').map((x) => x.trim()).filter(Boolean) : undefined))
    .pipe(z.array(z.enum(REQUEST_STATES, { error: `state must be one or more of: ${REQUEST_STATES.join(', ')}` })).optional()),
  sort: z.enum(REQUEST_SORT_KEYS, { error: `sort must be one of: ${REQUEST_SORT_KEYS.join(', ')}` }).optional(),
});
/** Parsed GET /api/requests query. */
export type RequestListQuery = z.infer<typeof requestListQuerySchema>;

/** GET /api/admin/users query. */
export const userListQuerySchema = z.object({
  ...pageFields,
  role: z.enum(ROLES, { error: `role must be one of: ${ROLES.join(', ')}` }).optional(),
  active: z.enum(['true', 'false']).optional(),
  sort: z.enum(['name', 'email', 'lastSignInAt', 'createdAt'], { error: 'sort must be a listed column' }).optional(),
});
/** Parsed GET /api/admin/users query. */
export type UserListQuery = z.infer<typeof userListQuerySchema>;

const rolesField = z.array(z.enum(ROLES, { error: `each role must be one of: ${ROLES.join(', ')}` }))
  .refine((r) => new Set(r).size === r.length, { error: 'roles must not repeat' });

/** POST /api/admin/users — a local account. */
export const userCreateSchema = z.object({
  email: z.email({ error: 'Enter a valid e-mail address' }).max(254),
  name: required('Name', 200),
  password: z.string().min(12, { error: 'Password must be at least 12 characters' }).max(200),
  roles: rolesField.default([]),
  departmentId: z.uuid({ error: 'Department must be one of the listed departments' }).nullable().optional(),
}).strict();
/** Body of POST /api/admin/users. */
export type UserCreateBody = z.infer<typeof userCreateSchema>;

/** PATCH /api/admin/users/:id */
export const userPatchSchema = z.object({
  roles: rolesField.optional(),
  active: z.boolean({ error: 'active must be true or false' }).optional(),
  name: required('Name', 200).optional(),
  departmentId: z.uuid().nullable().optional(),
  version: z.number({ error: 'version is required (the version you last read)' }).int().min(0),
}).strict();
/** Body of PATCH /api/admin/users/:id. */
export type UserPatchBody = z.infer<typeof userPatchSchema>;

/** PUT /api/admin/role-mappings — the full list replaces the old one. */
export const roleMappingsPutSchema = z.object({
  mappings: z.array(z.object({
    attribute: required('Attribute', 100).regex(/^[A-Za-z][\w.:-]*$/, { error: 'Attribute must be an attribute name such as eduPersonAffiliation' }),
    value: required('Value', 200),
    role: z.enum(ROLES, { error: `Role must be one of: ${ROLES.join(', ')}` }),
  })).max(200),
});
/** Body of PUT /api/admin/role-mappings. */
export type RoleMappingsPutBody = z.infer<typeof roleMappingsPutSchema>;

/** GET /api/audit query. */
export const auditQuerySchema = z.object({
  ...pageFields,
  actor: z.string().trim().max(254).optional(),
  action: z.string().trim().max(80).optional(),
  entity: z.string().trim().max(80).optional(),
  from: isoDate('from').optional(),
  to: isoDate('to').optional(),
});
/** Parsed GET /api/audit query. */
export type AuditQuery = z.infer<typeof auditQuerySchema>;

/** GET /api/notifications query. */
export const notificationQuerySchema = z.object({ ...pageFields, unread: z.enum(['true', 'false']).optional() });
