/**
 * Builds PreparedData straight from arrays, so family specs can exercise an
 * analysis without going through file parsing. Levels are coded in order of
 * first appearance (as the data layer does for text labels); numeric columns
 * get offset 0 unless one is given.
 */
import type { AnalysisPlan } from './contract';
import type { Factor, NumericColumn, PreparedData } from './prepared';

/** Column data for {@link buildPrepared}: numbers for numeric columns, strings for factors. */
export type ColumnData = Record<string, (number | string)[]>;

/** A factor coded in order of first appearance. */
export function codeLevels(name: string, values: (number | string)[]): Factor {
  const levels: string[] = [];
  const index = new Map<string, number>();
  const codes = new Int32Array(values.length);
  values.forEach((v, i) => {
    const key = String(v);
    let k = index.get(key);
    if (k === undefined) {
      k = levels.length;
      levels.push(key);
      index.set(key, k);
    }
    codes[i] = k;
  });
  return { name, levels, codes };
}

/** PreparedData for `plan` over `columns`; `offsets` shifts numeric columns (value − offset). */
export function buildPrepared(plan: AnalysisPlan, columns: ColumnData, offsets: Record<string, number> = {}): PreparedData {
  const numeric = (name: string): NumericColumn => {
    const off = offsets[name] ?? 0;
    return { name, values: Float64Array.from(columns[name] as number[], (v) => v - off), offset: off };
  };
  const outcome = numeric(plan.outcome);
  const n = outcome.values.length;
  return {
    plan: { ...plan, alpha: plan.alpha ?? 0.05, ssType: plan.ssType ?? 3, between: plan.between ?? [], within: plan.within ?? [], predictors: plan.predictors ?? [], comparisons: plan.comparisons ?? [] },
    n,
    outcome,
    between: (plan.between ?? []).map((b) => codeLevels(b, columns[b])),
    within: (plan.within ?? []).map((w) => codeLevels(w, columns[w])),
    subject: plan.subject ? codeLevels(plan.subject, columns[plan.subject]) : undefined,
    predictors: (plan.predictors ?? []).map(numeric),
    rowNumbers: Int32Array.from({ length: n }, (_, i) => i + 2),
    excluded: 0,
    warnings: [],
  };
}
