/**
 * What the filing form shows about an uploaded table: structural checks with specific
 * messages (no data rows, blank or repeated column names), a profile of each column,
 * and the first rows for the preview.
 */
import type { ColumnProfile } from '../../shared/api/workflow';
import { isMissingCell, scanNumericColumn } from '../../shared/stats/data/decimal-column';
import type { RawTable } from '../../shared/stats/data/raw-table';
import { HttpError } from '../middleware/errors';

/** Rows shown in the preview table. */
export const PREVIEW_ROWS = 20;

const invalid = (message: string, field = 'file') => new HttpError(422, 'invalid-data', message, { [field]: message });

/** Throws 422 when the table cannot be used: no data rows, a blank column name, or a name used twice. */
export function checkTableShape(t: RawTable): void {
  t.header.forEach((name, i) => {
    if (name.trim() === '') throw invalid(`Column ${i + 1} has no name in the header row (row 1); give every column a name.`);
  });
  const seen = new Map<string, number>();
  t.header.forEach((name, i) => {
    const key = name.trim().toLowerCase();
    const first = seen.get(key);
    if (first !== undefined) throw invalid(`Columns ${first + 1} and ${i + 1} are both named "${name.trim()}"; give each column its own name.`);
    seen.set(key, i);
  });
  if ((t.columns[0]?.length ?? 0) === 0) throw invalid('The file has a header row but no data rows.');
}

/** Number of data rows. */
export const rowCount = (t: RawTable): number => t.columns[0]?.length ?? 0;

function numericValue(cell: string, separator: '.' | ','): number {
  const s = cell.trim();
  return Number(separator === ',' ? s.replace(',', '.') : s);
}

/**
 * Profiles one column: numeric when every non-missing cell reads as a number the way the
 * engine reads it; identifier-like when text values are all different (one per row);
 * otherwise categorical. Missing counts empty cells and NA, as the engine does.
 */
export function profileColumn(name: string, cells: string[]): ColumnProfile {
  const present = cells.filter((c) => !isMissingCell(c)).map((c) => c.trim());
  const missing = cells.length - present.length;
  const distinctSet = new Set(present);
  const examples = [...distinctSet].slice(0, 5);
  const base = { name, missing, distinct: distinctSet.size, examples };
  if (present.length === 0) return { ...base, kind: 'empty' };
  let separator: '.' | ',' | null = null;
  try {
    separator = scanNumericColumn(name, cells).separator;
  } catch {
    separator = null;
  }
  if (separator) {
    let min = Infinity;
    let max = -Infinity;
    for (const c of present) {
      const v = numericValue(c, separator);
      if (v < min) min = v;
      if (v > max) max = v;
    }
    return { ...base, kind: 'numeric', min, max };
  }
  // Codes such as student numbers: every row has its own value (and there are enough rows to tell).
  if (present.length >= 5 && distinctSet.size === present.length) return { ...base, kind: 'identifier-like' };
  return { ...base, kind: 'categorical' };
}

/** Profiles every column of a table. */
export function profileTable(t: RawTable): ColumnProfile[] {
  return t.header.map((name, i) => profileColumn(name, t.columns[i] ?? []));
}

/** The first rows as cell strings in column order. */
export function previewRows(t: RawTable, n = PREVIEW_ROWS): string[][] {
  const rows: string[][] = [];
  for (let r = 0; r < Math.min(n, rowCount(t)); r++) rows.push(t.header.map((_, c) => t.columns[c]?.[r] ?? ''));
  return rows;
}
