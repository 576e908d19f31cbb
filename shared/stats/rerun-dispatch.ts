/**
 * Which analysis family handles which design, and the post-analysis steps
 * (power, reconciliation) each rerun gets.
 */
import type { PowerRow, ReconcileRow, ReportedInput, RerunResult } from './contract';
import type { PreparedData } from './prepared';
import { analyseIndependent, analyseOneSample, analysePaired } from './t-tests';
import { analyseRepeated } from './repeated-anova';
import { analyseBetween } from './between-anova';
import { analyseRegression } from './regression';
import { computePower } from './power';
import { reconcile } from './reconcile';

/** Runs the analysis family that the plan's design selects. */
export function analyseFamily(d: PreparedData): Partial<RerunResult> {
  switch (d.plan.design) {
    case 'one-sample':
      return analyseOneSample(d);
    case 'independent':
      return analyseIndependent(d);
    case 'paired':
      return analysePaired(d);
    case 'anova':
      return d.within.length > 0 ? analyseRepeated(d) : analyseBetween(d);
    case 'regression':
      return analyseRegression(d);
  }
}

/** Power and sensitivity rows for the result's tests. */
export function powerFor(result: RerunResult, d: PreparedData): PowerRow[] {
  return computePower(result, d);
}

/** Reconciliation rows for the reported statistics. */
export function reconcileFor(reported: ReportedInput[], result: RerunResult, alpha: number): ReconcileRow[] {
  return reconcile(reported, result, alpha);
}
