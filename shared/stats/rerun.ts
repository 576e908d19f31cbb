/**
 * The engine's front door: validate the plan, prepare the data, hand them to
 * the analysis family for the design, then add power, reconciliation, the
 * engine version, timings and warnings. Pure: no Node or browser APIs.
 */
import { InputError, type RerunResult } from './contract';
import { parseDelimited, type RawTable } from './data/raw-table';
import { prepareData } from './data/prepare';
import { resolvePlan } from './plan-schema';
import type { PreparedData } from './prepared';
import { ENGINE_VERSION } from './version';
import { analyseFamily, powerFor, reconcileFor } from './rerun-dispatch';

/** Options of {@link runPlan}. */
export interface RunOptions {
  /** Called as the rerun advances: fraction in [0, 1] and a stage name. */
  onProgress?: (fraction: number, stage: string) => void;
}

const now = (): number => globalThis.performance?.now() ?? Date.now();

/** Merges a family's partial result over the common fields; warnings are concatenated. */
function mergeResult(d: PreparedData, part: Partial<RerunResult>): RerunResult {
  const { warnings: familyWarnings, excluded: familyExcluded, n: familyN, ...rest } = part;
  return {
    engine: ENGINE_VERSION,
    design: d.plan.design,
    n: familyN ?? d.n,
    // Rows dropped at preparation plus whatever the family dropped (subjects with incomplete cells).
    excluded: d.excluded + (familyExcluded ?? 0),
    alpha: d.plan.alpha,
    descriptives: [],
    tests: [],
    ...rest,
    warnings: [...d.warnings, ...(familyWarnings ?? [])],
  };
}

/**
 * Runs an analysis plan on a table. Throws InputError (field "plan.<name>",
 * "column <name>" or "row <n>") for input the engine cannot analyse.
 */
export function runPlan(plan: unknown, table: RawTable, options: RunOptions = {}): RerunResult {
  const progress = options.onProgress ?? (() => undefined);
  const start = now();
  progress(0, 'validate');
  const resolved = resolvePlan(plan);
  progress(0.05, 'prepare');
  const d = prepareData(resolved, table);
  progress(0.3, 'analyse');
  const result = mergeResult(d, analyseFamily(d));
  progress(0.85, 'power');
  // Power and reconciliation add to a finished analysis: if either fails, the
  // analysis still stands and the gap is stated rather than the rerun lost.
  try {
    const power = powerFor(result, d);
    if (power.length > 0) result.power = power;
  } catch (err) {
    if (err instanceof InputError) throw err;
    result.warnings.push(`Power and sensitivity could not be computed for this design (${(err as Error).message}).`);
  }
  if (resolved.reported && resolved.reported.length > 0) {
    progress(0.95, 'reconcile');
    try {
      result.reconciliation = reconcileFor(resolved.reported, result, resolved.alpha);
    } catch (err) {
      if (err instanceof InputError) throw err;
      result.warnings.push(`The reported statistics could not be reconciled (${(err as Error).message}).`);
    }
  }
  result.timings = { parseMs: 0, computeMs: Math.round((now() - start) * 10) / 10 };
  progress(1, 'done');
  return result;
}

/** Parses delimited text and runs the plan on it; parse time is reported in `timings.parseMs`. */
export function rerunFromText(plan: unknown, csvText: string): RerunResult {
  const start = now();
  const table = parseDelimited(csvText);
  const parseMs = Math.round((now() - start) * 10) / 10;
  const result = runPlan(plan, table);
  result.timings = { parseMs, computeMs: result.timings?.computeMs ?? 0 };
  return result;
}
