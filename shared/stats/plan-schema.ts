/**
 * The analysis plan's schema: one zod definition used by the rerun command,
 * the server and the Angular plan form, so every side rejects the same plans
 * with the same field-named messages.
 */
import { z } from 'zod';
import { COMPARISON_METHODS, DESIGNS, InputError } from './contract';
import type { ResolvedPlan } from './prepared';

const column = (field: string) =>
  z
    .string({ error: `plan.${field} must be a column name (text)` })
    .trim()
    .min(1, { error: `plan.${field} must not be empty` });

const columnList = (field: string) =>
  z.array(column(`${field}[]`), { error: `plan.${field} must be a list of column names, e.g. ["group"]` });

/** Schema of one requested comparison family. */
export const comparisonRequestSchema = z.strictObject(
  {
    factor: column('comparisons[].factor'),
    method: z.enum(COMPARISON_METHODS, {
      error: `plan.comparisons[].method must be one of ${COMPARISON_METHODS.join(', ')}`,
    }),
  },
  { error: 'plan.comparisons[] entries must be objects like {"factor": "group", "method": "holm"}' },
);

/** Schema of one reported statistic to reconcile. */
export const reportedInputSchema = z.strictObject(
  {
    term: z.string({ error: 'plan.reported[].term must be text' }).optional(),
    text: z.string({ error: 'plan.reported[].text must be the statistic as typed, e.g. "F(2, 27) = 4.85, p = .016"' }).min(1),
  },
  { error: 'plan.reported[] entries must be objects like {"text": "t(28) = 2.10, p = .045"}' },
);

/** Field-level schema of the analysis plan (cross-field rules are in {@link analysisPlanSchema}). */
export const analysisPlanFieldsSchema = z.strictObject(
  {
    design: z.enum(DESIGNS, { error: `plan.design must be one of ${DESIGNS.join(', ')}` }),
    outcome: column('outcome'),
    between: columnList('between').optional(),
    within: columnList('within').optional(),
    subject: column('subject').optional(),
    predictors: columnList('predictors').optional(),
    mu: z.number({ error: 'plan.mu must be a number' }).finite({ error: 'plan.mu must be a finite number' }).optional(),
    sigma: z.number({ error: 'plan.sigma must be a number' }).positive({ error: 'plan.sigma must be greater than 0' }).finite().optional(),
    alpha: z
      .number({ error: 'plan.alpha must be a number such as 0.05' })
      .gt(0, { error: 'plan.alpha must be between 0 and 1, e.g. 0.05' })
      .lt(1, { error: 'plan.alpha must be between 0 and 1, e.g. 0.05' })
      .optional(),
    ssType: z.union([z.literal(2), z.literal(3)], { error: 'plan.ssType must be 2 or 3' }).optional(),
    comparisons: z.array(comparisonRequestSchema, { error: 'plan.comparisons must be a list' }).optional(),
    reported: z.array(reportedInputSchema, { error: 'plan.reported must be a list' }).optional(),
  },
  { error: (iss) => (iss.code === 'unrecognized_keys' ? undefined : 'the plan must be a JSON object like {"design": "anova", "outcome": "score", ...}') },
);

type PlanFields = z.infer<typeof analysisPlanFieldsSchema>;

/** Adds one issue at a plan path. */
function flag(ctx: z.RefinementCtx<PlanFields>, path: string, message: string): void {
  ctx.addIssue({ code: 'custom', path: [path], message });
}

/** Cross-field rules: which fields each design needs and forbids, and that columns are distinct. */
function checkDesign(p: PlanFields, ctx: z.RefinementCtx<PlanFields>): void {
  const between = p.between ?? [];
  const within = p.within ?? [];
  const predictors = p.predictors ?? [];
  const forbid = (field: 'between' | 'within' | 'predictors' | 'subject' | 'mu' | 'sigma', why: string) => {
    const v = p[field];
    if (v !== undefined && !(Array.isArray(v) && v.length === 0)) flag(ctx, field, `plan.${field} ${why}`);
  };
  switch (p.design) {
    case 'one-sample':
      forbid('between', 'is not used by a one-sample design (remove it, or use design "independent" or "anova")');
      forbid('within', 'is not used by a one-sample design (use design "paired" or "anova")');
      forbid('predictors', 'is only used by design "regression"');
      break;
    case 'independent':
      if (between.length !== 1) flag(ctx, 'between', 'plan.between must name exactly one grouping column for design "independent", e.g. ["group"]');
      forbid('within', 'is not used by design "independent" (use "paired" or "anova")');
      forbid('predictors', 'is only used by design "regression"');
      break;
    case 'paired':
      if (within.length !== 1) flag(ctx, 'within', 'plan.within must name exactly one two-level condition column for design "paired", e.g. ["occasion"]');
      if (!p.subject) flag(ctx, 'subject', 'plan.subject is required for design "paired": the column identifying each subject');
      forbid('between', 'is not used by design "paired" (use design "anova" for a mixed design)');
      forbid('predictors', 'is only used by design "regression"');
      break;
    case 'anova':
      if (between.length + within.length === 0) flag(ctx, 'between', 'plan.between or plan.within must name at least one factor column for design "anova"');
      if (within.length > 0 && !p.subject) flag(ctx, 'subject', 'plan.subject is required when plan.within is given: the column identifying each subject');
      forbid('predictors', 'is only used by design "regression"');
      break;
    case 'regression':
      if (predictors.length === 0) flag(ctx, 'predictors', 'plan.predictors must name at least one numeric predictor column for design "regression"');
      forbid('between', 'is not used by design "regression" (code groups as numeric predictors)');
      forbid('within', 'is not used by design "regression"');
      break;
  }
  if (p.design !== 'one-sample') {
    forbid('mu', 'is only used by design "one-sample"');
    forbid('sigma', 'is only used by design "one-sample"');
  }
  const seen = new Map<string, string>([[p.outcome, 'outcome']]);
  const claim = (name: string, field: string) => {
    const prior = seen.get(name);
    if (prior !== undefined) flag(ctx, field, `plan.${field} names column '${name}', which is already used as plan.${prior}`);
    else seen.set(name, field);
  };
  between.forEach((c) => claim(c, 'between'));
  within.forEach((c) => claim(c, 'within'));
  if (p.subject && p.design !== 'one-sample' && p.design !== 'independent' && p.design !== 'regression') claim(p.subject, 'subject');
  predictors.forEach((c) => claim(c, 'predictors'));
  const factors = [...between, ...within];
  (p.comparisons ?? []).forEach((c, i) => {
    if (!factors.includes(c.factor)) {
      flag(ctx, `comparisons[${i}].factor`, `plan.comparisons[${i}].factor '${c.factor}' is not one of the plan's factors (${factors.join(', ') || 'none'})`);
    }
  });
}

/** The complete analysis plan schema (fields plus design rules). */
export const analysisPlanSchema = analysisPlanFieldsSchema.superRefine(checkDesign);

/** The field path of a zod issue as "plan.x[0].y". */
function issueField(path: PropertyKey[]): string {
  let out = 'plan';
  for (const part of path) out += typeof part === 'number' ? `[${part}]` : `.${String(part)}`;
  return out;
}

/** The first problem with a plan as an InputError (field "plan.<name>"), or null when it is valid. */
export function planProblem(plan: unknown): InputError | null {
  const parsed = analysisPlanSchema.safeParse(plan);
  if (parsed.success) return null;
  const issue = parsed.error.issues[0];
  if (issue.code === 'unrecognized_keys') {
    const keys = issue.keys.map((k) => `plan.${k}`).join(', ');
    const known = Object.keys(analysisPlanFieldsSchema.shape).join(', ');
    return new InputError(issueField([...issue.path, issue.keys[0]]), `${keys} is not a plan field (known fields: ${known})`);
  }
  const field = issueField(issue.path);
  const message = issue.message.startsWith('plan.') || issue.message.startsWith('the plan') ? issue.message : `${field}: ${issue.message}`;
  // Array entry messages are written with "[]"; name the exact entry.
  const exact = message.replace(/plan\.(\w+)\[\]/, (_m, f: string) => {
    const idx = issue.path.find((x) => typeof x === 'number');
    return idx === undefined ? `plan.${f}[]` : `plan.${f}[${String(idx)}]`;
  });
  return new InputError(field, exact);
}

/** Validates a plan and fills in defaults; throws InputError naming the field at fault. */
export function resolvePlan(plan: unknown): ResolvedPlan {
  const problem = planProblem(plan);
  if (problem) throw problem;
  const p = analysisPlanSchema.parse(plan);
  return {
    ...p,
    alpha: p.alpha ?? 0.05,
    ssType: p.ssType ?? 3,
    between: p.between ?? [],
    within: p.within ?? [],
    predictors: p.predictors ?? [],
    comparisons: p.comparisons ?? [],
    ...(p.design === 'one-sample' ? { mu: p.mu ?? 0 } : {}),
  };
}
