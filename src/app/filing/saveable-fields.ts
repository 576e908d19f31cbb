import { requestPatchSchema } from '../../../shared/api/schemas';
import { planDraftSchema, reportedSchema } from '../../../shared/api/filing-schemas';
import type { z } from 'zod';
import type { DraftFields } from './filing-draft';

const FIELD_SCHEMAS: Partial<Record<keyof DraftFields, z.ZodType>> = {
  ...(requestPatchSchema.shape as unknown as Record<string, z.ZodType>),
  plan: planDraftSchema,
  reported: reportedSchema,
};

/**
 * Splits changed fields into those the server will accept and those it would reject, using
 * the shared schemas, so one half-typed field does not stop the rest of the draft saving.
 * Problems are keyed by API path ("title", "plan.alpha").
 */
export function splitSaveable(diff: Partial<DraftFields>): { ok: Partial<DraftFields>; problems: Record<string, string> } {
  const ok: Partial<DraftFields> = {};
  const problems: Record<string, string> = {};
  for (const [key, value] of Object.entries(diff) as [keyof DraftFields, unknown][]) {
    const schema = FIELD_SCHEMAS[key];
    const r = schema ? schema.safeParse(value) : { success: true as const };
    if (r.success) (ok as Record<string, unknown>)[key] = value;
    else {
      const issue = r.error.issues[0];
      const path = [key, ...(issue?.path ?? [])].join('.');
      problems[path] = issue?.message ?? `${key} is not valid`;
    }
  }
  return { ok, problems };
}
