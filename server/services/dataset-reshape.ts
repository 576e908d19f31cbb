/**
 * Reshaping a wide repeated-measures table (one row per subject, one column per
 * occasion) into the long layout the engine reads (one row per subject and occasion).
 */
import type { ColumnProfile } from '../../shared/api/workflow';
import type { RawTable } from '../../shared/stats/data/raw-table';
import type { ReshapeInput } from '../../shared/api/filing-schemas';
import { HttpError } from '../middleware/errors';

const invalid = (field: string, message: string) => new HttpError(422, 'validation', message, { [field]: message });

/** Quotes a CSV field when it holds a delimiter, quote or line break (RFC 4180). */
export function csvField(s: string): string {
  return /[",\r\n]/.test(s) || s !== s.trim() ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Checks the reshape against the table's columns; throws 422 naming the field. */
export function checkReshape(t: RawTable, profiles: ColumnProfile[], b: ReshapeInput): void {
  const has = (c: string) => t.header.includes(c);
  if (!has(b.subjectColumn)) throw invalid('subjectColumn', `Column "${b.subjectColumn}" is not in the data (columns: ${t.header.join(', ')}).`);
  b.measureColumns.forEach((c, i) => {
    if (!has(c)) throw invalid(`measureColumns.${i}`, `Column "${c}" is not in the data (columns: ${t.header.join(', ')}).`);
    if (c === b.subjectColumn) throw invalid(`measureColumns.${i}`, `"${c}" is the subject column; it cannot also be a measure column.`);
    const p = profiles.find((x) => x.name === c);
    if (p && p.kind !== 'numeric') throw invalid(`measureColumns.${i}`, `Column "${c}" is not numeric (values such as ${p.examples.slice(0, 3).map((e) => `"${e}"`).join(', ')}); measure columns must hold numbers.`);
  });
  (b.keepColumns ?? []).forEach((c, i) => {
    if (!has(c)) throw invalid(`keepColumns.${i}`, `Column "${c}" is not in the data (columns: ${t.header.join(', ')}).`);
    if (b.measureColumns.includes(c) || c === b.subjectColumn) throw invalid(`keepColumns.${i}`, `Column "${c}" is already used as the subject or a measure column.`);
  });
  const out = [b.subjectColumn, ...(b.keepColumns ?? [])];
  if (out.includes(b.factorName)) throw invalid('factorName', `The new factor column "${b.factorName}" would clash with a column that is kept; choose another name.`);
  if (out.includes(b.valueName)) throw invalid('valueName', `The new outcome column "${b.valueName}" would clash with a column that is kept; choose another name.`);
  const subjects = t.columns[t.header.indexOf(b.subjectColumn)] ?? [];
  const seen = new Map<string, number>();
  subjects.forEach((s, r) => {
    const k = s.trim();
    if (k === '' || k === 'NA') throw invalid('subjectColumn', `Row ${r + 2} has no value in the subject column "${b.subjectColumn}".`);
    const first = seen.get(k);
    if (first !== undefined) throw invalid('subjectColumn', `Subject "${k}" appears in rows ${first + 2} and ${r + 2}; a wide table has one row per subject.`);
    seen.set(k, r);
  });
}

/** The long table as CSV text: subject, kept columns, the new factor, the new outcome. */
export function wideToLongCsv(t: RawTable, b: ReshapeInput): string {
  const col = (name: string) => t.columns[t.header.indexOf(name)] ?? [];
  const subject = col(b.subjectColumn);
  const kept = (b.keepColumns ?? []).map(col);
  const measures = b.measureColumns.map(col);
  const levels = b.levels ?? b.measureColumns;
  const lines = [[b.subjectColumn, ...(b.keepColumns ?? []), b.factorName, b.valueName].map(csvField).join(',')];
  for (let r = 0; r < subject.length; r++) {
    const lead = [subject[r], ...kept.map((k) => k[r] ?? '')].map(csvField);
    measures.forEach((m, i) => lines.push([...lead, csvField(levels[i]), csvField((m[r] ?? '').trim())].join(',')));
  }
  return `${lines.join('\r\n')}\r\n`;
}
