/**
 * Cell descriptives and model residuals of a repeated-measures table.
 */
import type { CellDescriptives } from './contract';
import { studentT } from './dist/index';
import type { PreparedData } from './prepared';
import type { SubjectTable } from './repeated-table';

/** Descriptives of every between × within cell over the complete subjects. */
export function cellDescriptives(d: PreparedData, t: SubjectTable, alpha: number): CellDescriptives[] {
  const out: CellDescriptives[] = [];
  for (let c = 0; c < t.g; c++) {
    const members: number[] = [];
    for (let s = 0; s < t.n; s++) if (t.cellOf[s] === c) members.push(s);
    const k = members.length;
    for (let w = 0; w < t.m; w++) {
      let mean = 0;
      for (const s of members) mean += t.y[s * t.m + w];
      mean /= k;
      let ss = 0;
      for (const s of members) ss += (t.y[s * t.m + w] - mean) ** 2;
      const sd = k > 1 ? Math.sqrt(ss / (k - 1)) : Number.NaN;
      const se = sd / Math.sqrt(k);
      const half = k > 1 ? studentT(k - 1).quantile(1 - alpha / 2) * se : Number.NaN;
      const levels: Record<string, string> = {};
      let rest = c;
      const bl: [string, string][] = [];
      for (let j = d.between.length - 1; j >= 0; j--) {
        const f = d.between[j];
        bl.unshift([f.name, f.levels[rest % f.levels.length]]);
        rest = Math.floor(rest / f.levels.length);
      }
      rest = w;
      const wl: [string, string][] = [];
      for (let j = d.within.length - 1; j >= 0; j--) {
        const f = d.within[j];
        wl.unshift([f.name, f.levels[rest % f.levels.length]]);
        rest = Math.floor(rest / f.levels.length);
      }
      for (const [name, level] of [...bl, ...wl]) levels[name] = level;
      const centre = mean + d.outcome.offset;
      out.push({ levels, n: k, mean: centre, sd, se, ciLower: centre - half, ciUpper: centre + half });
    }
  }
  return out;
}

/**
 * Residuals of the split-plot model, y − subject mean − cell×within mean + cell mean:
 * what is left after the subject and all fixed effects are removed.
 */
export function splitPlotResiduals(t: SubjectTable): Float64Array {
  const { n, m, g } = t;
  const cellMeans = new Float64Array(g * m);
  for (let s = 0; s < n; s++) for (let w = 0; w < m; w++) cellMeans[t.cellOf[s] * m + w] += t.y[s * m + w];
  for (let c = 0; c < g; c++) for (let w = 0; w < m; w++) cellMeans[c * m + w] /= t.cellCounts[c];
  const cellGrand = new Float64Array(g);
  for (let c = 0; c < g; c++) {
    for (let w = 0; w < m; w++) cellGrand[c] += cellMeans[c * m + w];
    cellGrand[c] /= m;
  }
  const out = new Float64Array(n * m);
  for (let s = 0; s < n; s++) {
    let subj = 0;
    for (let w = 0; w < m; w++) subj += t.y[s * m + w];
    subj /= m;
    const c = t.cellOf[s];
    for (let w = 0; w < m; w++) out[s * m + w] = t.y[s * m + w] - subj - cellMeans[c * m + w] + cellGrand[c];
  }
  return out;
}

