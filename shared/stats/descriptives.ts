/**
 * Cell descriptives: n, mean, SD, SE and a t-based confidence interval at
 * 1 − alpha for each combination of factor levels.
 *
 * Values arrive centred on an exact decimal offset; spreads are computed on the
 * centred values (shift-invariant) and the offset is added back to the mean and
 * the interval bounds only at the end.
 */
import type { CellDescriptives } from './contract';
import { studentT } from './dist';
import type { Factor } from './prepared';

/** Sufficient statistics of one cell, on the centred scale. */
export interface CellSummary {
  /** Level index per factor. */
  levels: number[];
  n: number;
  /** Mean of the centred values. */
  mean: number;
  /** Sum of squared deviations from the cell mean. */
  ss: number;
}

/**
 * Groups rows into the cells of the given factors (mixed-radix cell code) and
 * computes n, mean and SS per cell by two passes. Returns the cell index of
 * each row too (−1 never occurs: every row has a code for every factor).
 */
export function summariseCells(values: ArrayLike<number>, factors: Factor[]): { cells: CellSummary[]; cellOfRow: Int32Array; cellIndexByCode: Int32Array } {
  const n = values.length;
  const radices = factors.map((f) => f.levels.length);
  const total = radices.reduce((a, b) => a * b, 1);
  const strides = radices.map((_, f) => radices.slice(f + 1).reduce((a, b) => a * b, 1));
  const codeArrays = factors.map((f) => f.codes);
  const k = factors.length;
  const code = new Int32Array(n);
  const count = new Float64Array(total);
  const sum = new Float64Array(total);
  // One pass: cell code (mixed radix, first factor slowest), counts and sums.
  for (let i = 0; i < n; i++) {
    let c = 0;
    for (let f = 0; f < k; f++) c += codeArrays[f][i] * strides[f];
    code[i] = c;
    count[c]++;
    sum[c] += values[i];
  }
  const mean = new Float64Array(total);
  for (let c = 0; c < total; c++) mean[c] = count[c] > 0 ? sum[c] / count[c] : NaN;
  const dev = new Float64Array(total);
  const ss = new Float64Array(total);
  for (let i = 0; i < n; i++) {
    const c = code[i];
    const e = values[i] - mean[c];
    dev[c] += e;
    ss[c] += e * e;
  }
  const cellIndexByCode = new Int32Array(total).fill(-1);
  const cells: CellSummary[] = [];
  for (let c = 0; c < total; c++) {
    if (count[c] === 0) continue;
    const levels: number[] = new Array(factors.length);
    let rest = c;
    for (let f = factors.length - 1; f >= 0; f--) {
      levels[f] = rest % radices[f];
      rest = Math.floor(rest / radices[f]);
    }
    const m = count[c];
    const s = ss[c] - (dev[c] * dev[c]) / m;
    cellIndexByCode[c] = cells.length;
    cells.push({ levels, n: m, mean: mean[c] + dev[c] / m, ss: s < 0 ? 0 : s });
  }
  // With every combination observed the code already is the cell index.
  let cellOfRow = code;
  if (cells.length < total) {
    cellOfRow = new Int32Array(n);
    for (let i = 0; i < n; i++) cellOfRow[i] = cellIndexByCode[code[i]];
  }
  return { cells, cellOfRow, cellIndexByCode };
}

/** Turns a cell summary into the public descriptives row (offset added back to mean and CI). */
export function describeCell(cell: Pick<CellSummary, 'n' | 'mean' | 'ss'>, levels: Record<string, string>, offset: number, alpha: number): CellDescriptives {
  const { n } = cell;
  const sd = n > 1 ? Math.sqrt(cell.ss / (n - 1)) : NaN;
  const se = sd / Math.sqrt(n);
  const half = n > 1 ? studentT(n - 1).quantile(1 - alpha / 2) * se : NaN;
  const mean = offset + cell.mean;
  return { levels, n, mean, sd, se, ciLower: offset + (cell.mean - half), ciUpper: offset + (cell.mean + half) };
}

/** Descriptives for every non-empty cell of `factors`, in level order of the factors. */
export function cellDescriptives(values: ArrayLike<number>, offset: number, factors: Factor[], alpha: number): CellDescriptives[] {
  const { cells } = summariseCells(values, factors);
  return cells.map((c) => describeCell(c, levelRecord(factors, c.levels), offset, alpha));
}

/** Factor name → level label for one cell. */
export function levelRecord(factors: Factor[], levels: number[]): Record<string, string> {
  const out: Record<string, string> = {};
  factors.forEach((f, i) => (out[f.name] = f.levels[levels[i]]));
  return out;
}
