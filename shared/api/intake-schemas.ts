/**
 * Validation schemas (zod) for intake: assigning and declining, office settings and a
 * reviewer's declared expertise. Messages name the field so forms can show them beside it.
 */
import { z } from 'zod';
import type { AssignBody, DeclineBody, OfficeSettings } from './workflow';

const isoDate = (label: string) =>
  z.string({ error: `${label} must be a date written YYYY-MM-DD` }).regex(/^\d{4}-\d{2}-\d{2}$/, { error: `${label} must be a date written YYYY-MM-DD` })
    .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), { error: `${label} is not a real date` });

const version = z.number({ error: 'version is required (the version you last read)' }).int({ error: 'version must be a whole number' }).min(0, { error: 'version must not be negative' });

/** PUT /api/requests/:id/assignment */
export const assignBodySchema = z.object({
  reviewerId: z.uuid({ error: 'reviewerId must be the id of one of the listed reviewers' }),
  dueAt: isoDate('dueAt').nullable().optional(),
  note: z.string({ error: 'note must be text' }).trim().max(2000, { error: 'note must be at most 2000 characters' }).optional(),
  version,
}).strict() satisfies z.ZodType<AssignBody>;

/** Reasons a reviewer may give for declining. */
export const DECLINE_REASONS = ['conflict', 'capacity', 'other'] as const;

/** POST /api/requests/:id/assignment/decline */
export const declineBodySchema = z.object({
  reason: z.enum(DECLINE_REASONS, { error: `reason must be one of: ${DECLINE_REASONS.join(', ')}` }),
  note: z.string({ error: 'note must be text' }).trim().max(2000, { error: 'note must be at most 2000 characters' }),
}).strict().superRefine((b, ctx) => {
  // The head needs to know what the conflict is to avoid the same mistake with the next reviewer.
  if (b.reason === 'conflict' && !b.note) ctx.addIssue({ code: 'custom', path: ['note'], message: 'note is required when declining for a conflict of interest: say what the conflict is' });
}) satisfies z.ZodType<DeclineBody>;

const text = (label: string, max: number) => z.string({ error: `${label} must be text` }).trim().max(max, { error: `${label} must be at most ${max} characters` });

/** PUT /api/office/settings */
export const officeSettingsSchema = z.object({
  name: text('name', 200).min(1, { error: 'name (the office name) is required' }),
  serviceLevelDays: z.number({ error: 'serviceLevelDays must be a whole number of days' }).int({ error: 'serviceLevelDays must be a whole number of days' })
    .min(1, { error: 'serviceLevelDays must be at least 1 day' }).max(365, { error: 'serviceLevelDays must be at most 365 days' }),
  defaultAlpha: z.number({ error: 'defaultAlpha must be a number such as 0.05' }).gt(0, { error: 'defaultAlpha must be above 0' }).lt(0.5, { error: 'defaultAlpha must be below 0.5 (usually 0.05)' }),
  countersignRequired: z.boolean({ error: 'countersignRequired must be true or false' }),
  dueSoonDays: z.number({ error: 'dueSoonDays must be a whole number of days' }).int({ error: 'dueSoonDays must be a whole number of days' })
    .min(1, { error: 'dueSoonDays must be at least 1 day' }).max(60, { error: 'dueSoonDays must be at most 60 days' }),
  letterhead: z.object({
    unit: text('letterhead.unit', 200).min(1, { error: 'letterhead.unit (the office as printed on letters) is required' }),
    institution: text('letterhead.institution', 200).min(1, { error: 'letterhead.institution is required' }),
    addressLines: z.array(text('letterhead.addressLines', 200), { error: 'letterhead.addressLines must be a list of lines' }).max(6, { error: 'letterhead.addressLines may have at most 6 lines' }),
    email: z.union([z.literal(''), z.email({ error: 'letterhead.email must be an e-mail address' })], { error: 'letterhead.email must be an e-mail address' }),
    phone: text('letterhead.phone', 60),
    website: z.union([z.literal(''), z.url({ protocol: /^https?$/, error: 'letterhead.website must be a web address starting with http:// or https://' })], { error: 'letterhead.website must be a web address' }),
  }, { error: 'letterhead must be an object with unit, institution, addressLines, email, phone and website' }).strict(),
  version,
}).strict() satisfies z.ZodType<OfficeSettings>;

/** PATCH /api/me/expertise */
export const expertiseSchema = z.object({
  expertise: z.array(text('expertise', 60).min(1, { error: 'expertise entries must not be empty' }), { error: 'expertise must be a list of methods, e.g. ["repeated measures", "regression"]' })
    .max(20, { error: 'expertise may list at most 20 methods' }),
}).strict();
/** Body of PATCH /api/me/expertise. */
export type ExpertiseBody = z.infer<typeof expertiseSchema>;
