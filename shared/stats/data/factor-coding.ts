/**
 * Coding a categorical column as integers: first over all rows (missing cells
 * marked), then over the rows the analysis uses.
 */
import type { Factor } from '../prepared';
import { isMissingCell } from './decimal-column';

const NUMERIC_LABEL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A categorical column coded over all rows: `codes[r]` indexes `labels`, −1 for a missing cell. */
export interface ScannedFactor {
  codes: Int32Array;
  labels: string[];
  /** Number of missing cells. */
  missing: number;
}

/**
 * Codes every row of a column. Labels are trimmed, so " a" and "a" are one
 * level. Each distinct cell string is looked at once; repeats are a map hit.
 */
export function scanFactorColumn(cells: string[]): ScannedFactor {
  const n = cells.length;
  const codes = new Int32Array(n);
  const byRaw = new Map<string, number>();
  const byLabel = new Map<string, number>();
  const labels: string[] = [];
  let missing = 0;
  // Factors usually have few distinct cell strings: a short linear list of them
  // (compared by identity first, which the parser's string reuse makes common)
  // is cheaper than a hash lookup per row.
  const recentRaw: string[] = [];
  const recentCode: number[] = [];
  for (let r = 0; r < n; r++) {
    const raw = cells[r];
    let code = -2;
    for (let k = 0; k < recentRaw.length; k++) {
      if (recentRaw[k] === raw) {
        code = recentCode[k];
        break;
      }
    }
    if (code === -2) {
      const known = byRaw.get(raw);
      if (known !== undefined) code = known;
      else if (isMissingCell(raw)) code = -1;
      else {
        const label = raw.trim();
        const prior = byLabel.get(label);
        if (prior !== undefined) code = prior;
        else {
          code = labels.length;
          labels.push(label);
          byLabel.set(label, code);
        }
      }
      byRaw.set(raw, code);
      if (recentRaw.length < 16) {
        recentRaw.push(raw);
        recentCode.push(code);
      }
    }
    codes[r] = code;
    if (code < 0) missing++;
  }
  return { codes, labels, missing };
}

/**
 * Codes the used rows. Levels keep their order of first appearance among
 * those rows, except that when every label is a number they are sorted
 * numerically (so 1, 2, 10 rather than 1, 10, 2).
 */
export function codeFactor(name: string, scanned: ScannedFactor, used: Int32Array): Factor {
  const n = used.length;
  const codes = new Int32Array(n);
  const remap = new Int32Array(scanned.labels.length).fill(-1);
  const levels: string[] = [];
  for (let j = 0; j < n; j++) {
    const p = scanned.codes[used[j]];
    let c = remap[p];
    if (c < 0) {
      c = levels.length;
      remap[p] = c;
      levels.push(scanned.labels[p]);
    }
    codes[j] = c;
  }
  if (levels.length > 1 && levels.every((l) => NUMERIC_LABEL.test(l))) {
    const order = levels.map((_, k) => k).sort((a, b) => Number(levels[a]) - Number(levels[b]));
    const sortedCode = new Int32Array(levels.length);
    order.forEach((oldCode, newCode) => (sortedCode[oldCode] = newCode));
    for (let j = 0; j < n; j++) codes[j] = sortedCode[codes[j]];
    return { name, levels: order.map((k) => levels[k]), codes };
  }
  return { name, levels, codes };
}

/** Number of used rows at each level of a factor. */
export function levelCounts(f: Factor): Int32Array {
  const counts = new Int32Array(f.levels.length);
  for (let j = 0; j < f.codes.length; j++) counts[f.codes[j]]++;
  return counts;
}
