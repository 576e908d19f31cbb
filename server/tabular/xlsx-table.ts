/**
 * Reading the first worksheet of an .xlsx workbook into a RawTable (first row
 * is the header). exceljs is loaded only when a workbook is actually read.
 */
import { InputError } from '../../shared/stats/contract';
import type { RawTable } from '../../shared/stats/data/raw-table';

/** The text a cell contributes to the table; numbers keep their shortest round-trip form. */
function cellText(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : 'NaN';
  if (typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'TRUE' : 'FALSE';
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'object') {
    const v = value as { result?: unknown; richText?: { text: string }[]; text?: unknown; error?: string };
    if ('result' in v) return cellText(v.result); // formula: use its cached result
    if (v.richText) return v.richText.map((r) => r.text).join('');
    if (v.error) return v.error; // e.g. #DIV/0!, reported as not a number downstream
    if (v.text !== undefined) return cellText(v.text); // hyperlink
  }
  return String(value);
}

/** Reads the first worksheet of an .xlsx file's bytes. */
export async function readXlsxTable(bytes: Uint8Array): Promise<RawTable> {
  const ExcelJS = (await import('exceljs')).default;
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch (err) {
    throw new InputError('data', `the workbook could not be read as .xlsx (${(err as Error).message}); save it again as .xlsx or export it as CSV`);
  }
  const sheet = workbook.worksheets[0];
  if (!sheet || sheet.rowCount === 0) throw new InputError('data', 'the first worksheet of the workbook is empty: expected a header row naming the columns');
  const headerRow = sheet.getRow(1);
  const width = headerRow.cellCount;
  const header: string[] = [];
  for (let c = 1; c <= width; c++) header.push(cellText(headerRow.getCell(c).value).trim());
  while (header.length > 0 && header[header.length - 1] === '') header.pop();
  if (header.length === 0) throw new InputError('data', 'the first row of the first worksheet is empty: expected a header row naming the columns');
  const columns: string[][] = header.map(() => []);
  for (let r = 2; r <= sheet.rowCount; r++) {
    const row = sheet.getRow(r);
    const cells = header.map((_, c) => cellText(row.getCell(c + 1).value));
    if (cells.every((x) => x.trim() === '')) continue; // blank row
    cells.forEach((x, c) => columns[c].push(x));
  }
  return { header, columns };
}
