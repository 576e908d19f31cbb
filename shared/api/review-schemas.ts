/**
 * Validation schemas (zod) for the review routes: reruns, checklist verdicts, comments,
 * revision requests and decisions. The server validates every body with these; the
 * Angular review screens reuse them so both sides say the same thing.
 */
import { z } from 'zod';
import { CRITERIA, DECISIONS, VERDICTS } from './types';

const version = z.number({ error: 'version must be the number you last read' }).int().min(0);
const text = (label: string, max: number) =>
  z.string({ error: `${label} must be text` }).trim().max(max, { error: `${label} must be at most ${max} characters` });

/** POST /api/requests/:id/reruns — the plan override is checked by the engine's own plan schema. */
export const rerunBodySchema = z.strictObject({
  label: text('label', 200).min(1, { error: 'label must not be empty (leave it out for the default)' }).optional(),
  planOverride: z.record(z.string(), z.unknown(), { error: 'planOverride must be an object of plan fields, e.g. {"comparisons": [...]}' }).optional(),
});
/** Parsed body of POST /api/requests/:id/reruns. */
export type RerunBodyInput = z.infer<typeof rerunBodySchema>;

/** A checklist criterion in a URL. */
export const criterionSchema = z.enum(CRITERIA, { error: `criterion must be one of ${CRITERIA.join(', ')}` });

/** PUT /api/requests/:id/checklist/:criterion */
export const checklistPutSchema = z.strictObject({
  verdict: z.enum(VERDICTS, { error: `verdict must be one of ${VERDICTS.join(', ')} (or null)` }).nullable(),
  note: text('note', 10_000),
  version,
});
/** Parsed body of PUT /api/requests/:id/checklist/:criterion. */
export type ChecklistPutInput = z.infer<typeof checklistPutSchema>;

/** POST /api/requests/:id/comments */
export const commentBodySchema = z.strictObject({
  body: z.string({ error: 'body must be text (HTML from the editor)' }).max(50_000, { error: 'body must be at most 50000 characters' }),
  internal: z.boolean({ error: 'internal must be true or false' }).optional(),
});
/** Parsed body of POST /api/requests/:id/comments. */
export type CommentBodyInput = z.infer<typeof commentBodySchema>;

/** POST /api/requests/:id/revision-request */
export const revisionRequestSchema = z.strictObject({
  changes: z
    .array(text('changes[]', 2_000).min(1, { error: 'each required change must say what to change' }), { error: 'changes must be a list of required changes' })
    .min(1, { error: 'changes must list at least one required change' })
    .max(50, { error: 'changes may list at most 50 items' }),
  message: text('message', 10_000).optional(),
  version,
});
/** Parsed body of POST /api/requests/:id/revision-request. */
export type RevisionRequestInput = z.infer<typeof revisionRequestSchema>;

/** POST /api/requests/:id/decision */
export const decisionBodySchema = z
  .strictObject({
    decision: z.enum(DECISIONS, { error: `decision must be one of ${DECISIONS.join(', ')}` }),
    conditions: z.array(text('conditions[]', 2_000).min(1, { error: 'each condition must say something' }), { error: 'conditions must be a list' }).max(30),
    rationale: text('rationale', 20_000).min(1, { error: 'rationale is required: say why, in a few sentences' }),
    rerunId: z.uuid({ error: 'rerunId must be the id of a rerun of this request' }).optional(),
    version,
  })
  .superRefine((b, ctx) => {
    if (b.decision === 'endorse-with-conditions' && b.conditions.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['conditions'], message: 'endorse-with-conditions needs at least one condition' });
    }
  });
/** Parsed body of POST /api/requests/:id/decision. */
export type DecisionBodyInput = z.infer<typeof decisionBodySchema>;
