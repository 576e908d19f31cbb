/**
 * The subject × within-cell table behind repeated-measures and mixed ANOVA:
 * one value per subject and combination of within levels, subjects with a
 * missing cell dropped listwise, each kept subject tagged with its between cell.
 */
import { InputError } from './contract';
import type { Factor, PreparedData } from './prepared';

/** Complete-case subject table. */
export interface SubjectTable {
  /** Levels per within factor, plan order. */
  withinSizes: number[];
  /** Levels per between factor, plan order. */
  betweenSizes: number[];
  /** Within cells per subject (product of withinSizes); first factor varies slowest. */
  m: number;
  /** Between cells (product of betweenSizes); first factor varies slowest. */
  g: number;
  /** Complete subjects kept. */
  n: number;
  /** Labels of the kept subjects, table order. */
  subjectIds: string[];
  /** n × m centred outcome values, row-major. */
  y: Float64Array;
  /** Between cell of each kept subject. */
  cellOf: Int32Array;
  /** Kept subjects per between cell. */
  cellCounts: Float64Array;
  /** Labels of subjects dropped for a missing within cell. */
  dropped: string[];
}

/** Mixed-radix index of one row's levels over a list of factors (first factor slowest). */
function cellIndex(factors: Factor[], row: number): number {
  let idx = 0;
  for (const f of factors) idx = idx * f.levels.length + f.codes[row];
  return idx;
}

/** "time = t1, task = B" for a cell index over the given factors. */
export function describeCell(factors: Factor[], idx: number): string {
  const parts: string[] = [];
  for (let j = factors.length - 1; j >= 0; j--) {
    const k = factors[j].levels.length;
    parts.unshift(`${factors[j].name} = ${factors[j].levels[idx % k]}`);
    idx = Math.floor(idx / k);
  }
  return parts.join(', ');
}

/**
 * Build the table. Throws InputError for a subject with two rows in one within
 * cell, a subject found in two between cells, or an empty between cell.
 */
export function buildSubjectTable(d: PreparedData): SubjectTable {
  const subject = d.subject;
  if (!subject) throw new InputError('plan.subject', 'A within-subjects design needs a subject column ("subject" in the plan).');
  const within = d.within;
  const between = d.between;
  const withinSizes = within.map((f) => f.levels.length);
  const betweenSizes = between.map((f) => f.levels.length);
  const m = withinSizes.reduce((a, b) => a * b, 1);
  const g = betweenSizes.reduce((a, b) => a * b, 1);
  const S = subject.levels.length;
  const values = new Float64Array(S * m).fill(Number.NaN);
  const firstRow = new Int32Array(S * m).fill(-1);
  const groupOf = new Int32Array(S).fill(-1);
  const groupRow = new Int32Array(S).fill(-1);
  const y = d.outcome.values;
  for (let r = 0; r < d.n; r++) {
    const s = subject.codes[r];
    const w = cellIndex(within, r);
    const slot = s * m + w;
    if (firstRow[slot] >= 0)
      throw new InputError(
        `row ${d.rowNumbers[r]}`,
        `Subject "${subject.levels[s]}" has more than one row for ${describeCell(within, w)} ` +
          `(rows ${d.rowNumbers[firstRow[slot]]} and ${d.rowNumbers[r]}, counting the header as row 1); give one value per subject and cell.`,
      );
    firstRow[slot] = r;
    values[slot] = y[r];
    const b = cellIndex(between, r);
    if (groupOf[s] < 0) {
      groupOf[s] = b;
      groupRow[s] = r;
    } else if (groupOf[s] !== b) {
      throw new InputError(
        `row ${d.rowNumbers[r]}`,
        `Subject "${subject.levels[s]}" appears in ${describeCell(between, groupOf[s])} (row ${d.rowNumbers[groupRow[s]]}) ` +
          `and in ${describeCell(between, b)} (row ${d.rowNumbers[r]}, counting the header as row 1); a subject belongs to one between-subjects group.`,
      );
    }
  }
  const keep: number[] = [];
  const dropped: number[] = [];
  for (let s = 0; s < S; s++) {
    if (groupOf[s] < 0) continue; // subject label with no usable rows at all
    let complete = true;
    for (let w = 0; w < m && complete; w++) if (firstRow[s * m + w] < 0) complete = false;
    (complete ? keep : dropped).push(s);
  }
  const n = keep.length;
  const table = new Float64Array(n * m);
  const cellOf = new Int32Array(n);
  const cellCounts = new Float64Array(g);
  keep.forEach((s, i) => {
    table.set(values.subarray(s * m, s * m + m), i * m);
    cellOf[i] = groupOf[s];
    cellCounts[groupOf[s]]++;
  });
  for (let c = 0; c < g; c++)
    if (cellCounts[c] === 0)
      throw new InputError(
        between.length ? `column ${between.map((f) => f.name).join(', ')}` : `column ${subject.name}`,
        between.length
          ? `No subject with all ${m} within-subjects cells is in ${describeCell(between, c)}; every between-subjects group needs complete subjects.`
          : `No subject has a value in all ${m} within-subjects cells, so the repeated-measures analysis cannot run.`,
      );
  if (n - g < 1)
    throw new InputError(
      `column ${subject.name}`,
      `Only ${n} complete subject(s) across ${g} between-subjects group(s): the subject error term needs more subjects than groups.`,
    );
  return {
    withinSizes,
    betweenSizes,
    m,
    g,
    n,
    subjectIds: keep.map((s) => subject.levels[s]),
    y: table,
    cellOf,
    cellCounts,
    dropped: dropped.map((s) => subject.levels[s]),
  };
}
