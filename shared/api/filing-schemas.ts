/**
 * Validation schemas (zod) for the filing routes: the plan draft and reported results
 * (also accepted by PATCH /api/requests/:id), reshaping, identifier confirmations,
 * submit and withdraw; and reading a stored plan as a PlanDraft. Messages name the field so the form can show them beside it.
 */
import { z } from 'zod';
import { COMPARISON_METHODS } from '../stats/contract';
import type { PlanDraft } from './workflow';
import { DESIGN_KINDS, type DesignKind } from './types';

const columnName = (label: string) =>
  z.string({ error: `${label} must be a column name` }).trim().min(1, { error: `${label} must name a column` }).max(200, { error: `${label} is longer than any column name (200 characters)` });

const factorSchema = (label: string) => z.object({
  column: columnName(`${label} column`),
  levels: z.array(z.string({ error: `${label} levels must be text` }).trim().min(1, { error: `${label} levels must not be empty` }).max(200), { error: `${label} levels must be a list` })
    .max(200, { error: `${label} may list at most 200 levels` }).default([]),
}, { error: `${label} must be an object with a column and its levels` });

/** The analysis plan as the filing form holds it ({@link PlanDraft}); lists default to empty so autosave can send partial drafts. */
export const planDraftSchema = z.object({
  designKind: z.enum(DESIGN_KINDS, { error: `plan.designKind must be one of: ${DESIGN_KINDS.join(', ')}` }).nullable().default(null),
  outcome: columnName('plan.outcome').nullable().default(null),
  between: z.array(factorSchema('Between-subjects factor'), { error: 'plan.between must be a list of factors' }).max(10, { error: 'plan.between may have at most 10 factors' }).default([]),
  within: z.array(factorSchema('Within-subjects factor'), { error: 'plan.within must be a list of factors' }).max(10, { error: 'plan.within may have at most 10 factors' }).default([]),
  subject: columnName('plan.subject').nullable().default(null),
  predictors: z.array(columnName('Predictor'), { error: 'plan.predictors must be a list of column names' }).max(50, { error: 'plan.predictors may have at most 50 columns' }).default([]),
  mu: z.number({ error: 'plan.mu (the hypothesised mean) must be a number' }).finite().nullable().optional(),
  sigma: z.number({ error: 'plan.sigma (the known SD) must be a number' }).positive({ error: 'plan.sigma must be positive' }).finite().nullable().optional(),
  alpha: z.number({ error: 'plan.alpha must be a number such as 0.05' }).gt(0, { error: 'plan.alpha must be above 0' }).lt(0.5, { error: 'plan.alpha must be below 0.5 (usually 0.05)' }).default(0.05),
  ssType: z.union([z.literal(2), z.literal(3)], { error: 'plan.ssType must be 2 or 3' }).optional(),
  comparisons: z.array(z.object({
    factor: columnName('Comparison factor'),
    method: z.enum(COMPARISON_METHODS, { error: `Comparison method must be one of: ${COMPARISON_METHODS.join(', ')}` }),
  }), { error: 'plan.comparisons must be a list' }).max(20).default([]),
  submitterCorrection: z.enum([...COMPARISON_METHODS, 'none'], { error: `plan.submitterCorrection must be one of: ${COMPARISON_METHODS.join(', ')}, none` }).nullable().default(null),
  familySize: z.number({ error: 'plan.familySize must be a whole number' }).int().min(1, { error: 'plan.familySize must be at least 1' }).max(1000).nullable().optional(),
}, { error: 'plan must be an object' }).strict() satisfies z.ZodType<PlanDraft, unknown>;

/** The reported results: reporting strings, optionally tied to a term. */
export const reportedSchema = z.array(z.object({
  term: z.string({ error: 'The term must be text, e.g. "group" or "group:time"' }).trim().max(200).optional(),
  text: z.string({ error: 'The reported result must be text, e.g. "t(28) = 2.10, p = .045"' }).trim().max(1000, { error: 'A reported result must be at most 1000 characters' }),
}, { error: 'Each reported result must be an object with text' }).strict(), { error: 'reported must be a list of reported results' }).max(100, { error: 'At most 100 reported results' });

/** POST /api/requests/:id/datasets/:datasetId/reshape (ReshapeBody). */
export const reshapeSchema = z.object({
  subjectColumn: columnName('subjectColumn'),
  measureColumns: z.array(columnName('Measure column'), { error: 'measureColumns must be a list of column names' })
    .min(2, { error: 'measureColumns must list at least two columns (one per occasion)' }).max(50)
    .refine((a) => new Set(a).size === a.length, { error: 'measureColumns must not repeat a column' }),
  factorName: columnName('factorName'),
  valueName: columnName('valueName'),
  levels: z.array(z.string().trim().min(1, { error: 'Level labels must not be empty' }).max(200)).optional()
    .refine((a) => !a || new Set(a).size === a.length, { error: 'levels must not repeat a label' }),
  keepColumns: z.array(columnName('Kept column')).max(50).optional(),
}).strict().refine((b) => !b.levels || b.levels.length === b.measureColumns.length, { error: 'levels must give one label per measure column', path: ['levels'] })
  .refine((b) => b.factorName !== b.valueName, { error: 'factorName and valueName must differ', path: ['valueName'] });
/** Parsed reshape body. */
export type ReshapeInput = z.infer<typeof reshapeSchema>;

/** POST /api/requests/:id/datasets/:datasetId/identifiers */
export const identifierConfirmSchema = z.object({
  confirmations: z.array(z.object({
    column: columnName('column'),
    reason: z.string({ error: 'reason must be text' }).trim().min(10, { error: 'Say in at least 10 characters why this column is needed' }).max(2000),
  }).strict(), { error: 'confirmations must be a list of {column, reason}' }).min(1, { error: 'confirmations must name at least one column' }).max(100),
}).strict();
/** Parsed identifier confirmation body. */
export type IdentifierConfirmInput = z.infer<typeof identifierConfirmSchema>;

const versionField = z.number({ error: 'version is required (the version you last read)' }).int().min(0);

/** POST /api/requests/:id/submit — `note` optionally says what changed in a revision. */
export const submitSchema = z.object({
  version: versionField,
  note: z.string({ error: 'note must be text' }).trim().max(5000).optional(),
}).strict();
/** Parsed submit body. */
export type SubmitInput = z.infer<typeof submitSchema>;

/** POST /api/requests/:id/withdraw */
export const withdrawSchema = z.object({
  version: versionField,
  reason: z.string({ error: 'reason must be text' }).trim().min(3, { error: 'Say briefly why the request is withdrawn' }).max(5000),
}).strict();
/** Parsed withdraw body. */
export type WithdrawInput = z.infer<typeof withdrawSchema>;

// Engine designs that name one design kind; 'anova' is told apart by its factors.
const ENGINE_KIND: Record<string, DesignKind> = { 'one-sample': 'one-sample', independent: 'two-independent', paired: 'paired', regression: 'regression' };

/**
 * Reads a stored plan (`RequestDetail.plan`) as a PlanDraft. Plans stored in the engine's
 * shape (the demo seed) are converted, so the filing form can edit them; null when there
 * is no usable plan.
 */
export function asPlanDraft(plan: Record<string, unknown> | null, designKind: DesignKind | null): PlanDraft | null {
  if (!plan) return null;
  if (typeof plan['design'] === 'string') {
    const list = (k: string) => (Array.isArray(plan[k]) ? (plan[k] as unknown[]).map(String) : []);
    const between = list('between');
    const within = list('within');
    const kind = designKind ?? ENGINE_KIND[plan['design']] ?? (plan['design'] === 'anova' ? (within.length ? (between.length ? 'mixed' : 'repeated-measures') : 'between-anova') : null);
    const parsed = planDraftSchema.safeParse({
      designKind: kind, outcome: plan['outcome'] ?? null, between: between.map((column) => ({ column, levels: [] })),
      within: within.map((column) => ({ column, levels: [] })), subject: plan['subject'] ?? null, predictors: list('predictors'),
      mu: plan['mu'] ?? null, sigma: plan['sigma'] ?? null, alpha: plan['alpha'] ?? 0.05, ...(plan['ssType'] ? { ssType: plan['ssType'] } : {}),
      comparisons: plan['comparisons'] ?? [], submitterCorrection: null,
    });
    return parsed.success ? parsed.data : null;
  }
  const parsed = planDraftSchema.safeParse(plan);
  if (!parsed.success) return null;
  return { ...parsed.data, designKind: parsed.data.designKind ?? designKind };
}
