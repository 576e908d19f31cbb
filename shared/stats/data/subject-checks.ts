/**
 * Integrity checks for designs with a subject column: each subject has at
 * most one row per within-subjects cell, and stays in one between-subjects
 * group. Either fault would make a repeated-measures answer silently wrong.
 */
import { InputError } from '../contract';
import type { Factor, PreparedData } from '../prepared';

/** Cell index of each row over a list of factors (mixed radix, first factor slowest). */
export function cellIndex(factors: Factor[], n: number): { index: Int32Array; count: number } {
  const index = new Int32Array(n);
  let count = 1;
  for (const f of factors) {
    const k = f.levels.length;
    for (let j = 0; j < n; j++) index[j] = index[j] * k + f.codes[j];
    count *= k;
  }
  return { index, count };
}

/** Describes a cell as "a=x, b=y" for messages. */
export function cellLabel(factors: Factor[], cell: number): string {
  const parts: string[] = [];
  for (let i = factors.length - 1; i >= 0; i--) {
    const k = factors[i].levels.length;
    parts.unshift(`${factors[i].name}=${factors[i].levels[cell % k]}`);
    cell = Math.floor(cell / k);
  }
  return parts.join(', ');
}

/** Spreadsheet row (header = row 1) of used row j. */
function sheetRow(d: PreparedData, j: number): number {
  return d.rowNumbers[j];
}

/**
 * Throws an InputError when a subject has two rows in the same
 * within-subjects cell, or appears in two between-subjects groups.
 * Does nothing when the data have no subject column.
 */
export function checkSubjects(d: PreparedData): void {
  const subject = d.subject;
  if (!subject) return;
  const n = d.n;
  const nSubj = subject.levels.length;
  const within = cellIndex(d.within, n);
  const between = cellIndex(d.between, n);
  // First row of each subject × within cell; -1 when unseen.
  const useArray = nSubj * within.count <= 50_000_000;
  const firstArr = useArray ? new Int32Array(nSubj * within.count).fill(-1) : null;
  const firstMap = useArray ? null : new Map<number, number>();
  const groupRow = new Int32Array(nSubj).fill(-1);
  for (let j = 0; j < n; j++) {
    const s = subject.codes[j];
    const key = s * within.count + within.index[j];
    const prior = firstArr ? firstArr[key] : (firstMap!.get(key) ?? -1);
    if (prior >= 0) {
      const cell = d.within.length > 0 ? ` in ${cellLabel(d.within, within.index[j])}` : '';
      throw new InputError(
        `column ${subject.name}`,
        `subject '${subject.levels[s]}' has more than one row${cell} (rows ${sheetRow(d, prior)} and ${sheetRow(d, j)}, counting the header as row 1); each subject needs exactly one row per condition: average or remove the duplicates first`,
      );
    }
    if (firstArr) firstArr[key] = j;
    else firstMap!.set(key, j);
    const g = groupRow[s];
    if (g < 0) groupRow[s] = j;
    else if (between.index[g] !== between.index[j]) {
      throw new InputError(
        `column ${subject.name}`,
        `subject '${subject.levels[s]}' appears in two between-subjects groups (${cellLabel(d.between, between.index[g])} in row ${sheetRow(d, g)}, ${cellLabel(d.between, between.index[j])} in row ${sheetRow(d, j)}); a subject must belong to a single group`,
      );
    }
  }
}
