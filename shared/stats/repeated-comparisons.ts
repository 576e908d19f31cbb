/**
 * Requested pairwise comparisons in repeated-measures and mixed designs.
 * Between factors: subject means per level, tested against the between-subjects
 * error (the subject-mean stratum's error, rescaled from the contrast scale to
 * the mean scale). Within factors: paired comparisons of subject-level marginal
 * means, pooled over any between groups.
 */
import type { ComparisonRow } from './contract';
import { InputError } from './contract';
import { compareBetween, compareWithin, withinComparisonNote } from './comparisons';
import type { PreparedData } from './prepared';
import type { SubjectTable } from './repeated-table';
import type { Stratum } from './split-plot';

/** Mean of each subject over the within cells whose level of within factor j is `level`. */
function withinMarginal(t: SubjectTable, j: number, level: number): Float64Array {
  const sizes = t.withinSizes;
  const stride = sizes.slice(j + 1).reduce((a, b) => a * b, 1);
  const cells: number[] = [];
  for (let w = 0; w < t.m; w++) if (Math.floor(w / stride) % sizes[j] === level) cells.push(w);
  const out = new Float64Array(t.n);
  for (let s = 0; s < t.n; s++) {
    let sum = 0;
    for (const w of cells) sum += t.y[s * t.m + w];
    out[s] = sum / cells.length;
  }
  return out;
}

/** Level index of between factor j for between cell c. */
function betweenLevel(t: SubjectTable, j: number, c: number): number {
  const stride = t.betweenSizes.slice(j + 1).reduce((a, b) => a * b, 1);
  return Math.floor(c / stride) % t.betweenSizes[j];
}

/** Comparison rows for every request in the plan, plus notes for `warnings`. */
export function repeatedComparisons(
  d: PreparedData,
  t: SubjectTable,
  subjectStratum: Stratum,
  alpha: number,
): { rows: ComparisonRow[]; notes: string[] } {
  const warnings: string[] = [];
  const comparisons: ComparisonRow[] = [];
  for (const req of d.plan.comparisons) {
    const bj = d.between.findIndex((f) => f.name === req.factor);
    const wj = d.within.findIndex((f) => f.name === req.factor);
    if (bj >= 0) {
      const f = d.between[bj];
      const k = f.levels.length;
      const sums = new Float64Array(k);
      const counts = new Float64Array(k);
      const subjMean = new Float64Array(t.n);
      for (let s = 0; s < t.n; s++) {
        let sum = 0;
        for (let w = 0; w < t.m; w++) sum += t.y[s * t.m + w];
        subjMean[s] = sum / t.m;
        const l = betweenLevel(t, bj, t.cellOf[s]);
        sums[l] += subjMean[s];
        counts[l]++;
      }
      const ss = new Float64Array(k);
      for (let s = 0; s < t.n; s++) {
        const l = betweenLevel(t, bj, t.cellOf[s]);
        ss[l] += (subjMean[s] - sums[l] / counts[l]) ** 2;
      }
      const groups = f.levels.map((level, l) => ({
        level,
        n: counts[l],
        mean: sums[l] / counts[l] + d.outcome.offset,
        variance: counts[l] > 1 ? ss[l] / (counts[l] - 1) : Number.NaN,
      }));
      // The subject-mean stratum's contrast is √m × the subject mean, so divide by m for the mean scale.
      const error = { ms: subjectStratum.error.data[0] / subjectStratum.modelErrorDf / t.m, df: subjectStratum.modelErrorDf };
      comparisons.push(...compareBetween(f.name, groups, req.method, error, alpha));
      if (d.between.length > 1)
        warnings.push(
          `Comparisons on "${f.name}" compare the plain means of the subjects' averages at each level (pooled over the other ` +
            `between-subjects factors, weighted by subjects), tested against the between-subjects error of the full model.`,
        );
    } else if (wj >= 0) {
      const f = d.within[wj];
      const scores = f.levels.map((_, l) => withinMarginal(t, wj, l));
      comparisons.push(...compareWithin(f.name, f.levels, scores, req.method, alpha));
      const note = withinComparisonNote(f.name, req.method);
      if (note) warnings.push(note);
    } else {
      throw new InputError('plan.comparisons', `Comparisons were requested for "${req.factor}", which is not a between- or within-subjects factor of this plan.`);
    }
  }
  return { rows: comparisons, notes: warnings };
}
