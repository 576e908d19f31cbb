/**
 * Validation schemas (zod) for the letter routes: the deliberate signing confirmation
 * and the amendment that issues a new letter version. Shapes follow SignBody in workflow.ts.
 */
import { z } from 'zod';
import { DECISIONS } from './types';

const confirmReference = z
  .string({ error: 'confirmReference: type the request reference (e.g. HV-2026-014) to confirm' })
  .trim()
  .min(1, { error: 'confirmReference: type the request reference (e.g. HV-2026-014) to confirm' })
  .max(40, { error: 'confirmReference must be at most 40 characters' });
const password = z.string({ error: 'password must be text' }).max(200, { error: 'password must be at most 200 characters' }).optional();

/** POST /api/requests/:id/letter/sign and /countersign. */
export const signBodySchema = z.object({ confirmReference, password }).strict();

/** Body of POST /api/requests/:id/letter/amend: a changed decision and why, with the same confirmation. */
export const amendBodySchema = z
  .object({
    decision: z.enum(DECISIONS, { error: `decision must be one of: ${DECISIONS.join(', ')}` }),
    conditions: z
      .array(z.string({ error: 'each condition must be text' }).trim().min(1, { error: 'a condition cannot be empty' }).max(2000, { error: 'a condition must be at most 2000 characters' }), {
        error: 'conditions must be a list of texts',
      })
      .max(20, { error: 'at most 20 conditions' })
      .default([]),
    rationale: z.string({ error: 'rationale must be text' }).trim().min(1, { error: 'rationale: say why the decision changes' }).max(10_000, { error: 'rationale must be at most 10000 characters' }),
    reason: z.string({ error: 'reason must be text' }).trim().min(1, { error: 'reason: say why the letter is amended (it is printed in the audit log)' }).max(2000, { error: 'reason must be at most 2000 characters' }),
    confirmReference,
    password,
  })
  .strict()
  .refine((b) => b.decision !== 'endorse-with-conditions' || b.conditions.length > 0, {
    path: ['conditions'],
    error: 'conditions: an endorsement with conditions needs at least one condition',
  });
/** Parsed body of the amend route. */
export type AmendBody = z.infer<typeof amendBodySchema>;
