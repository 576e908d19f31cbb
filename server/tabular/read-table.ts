/**
 * Turning uploaded or on-disk bytes into a RawTable: delimited text (UTF-8,
 * with a Windows-1252 fallback) or an .xlsx workbook, told apart by content.
 */
import { readFile } from 'node:fs/promises';
import { InputError } from '../../shared/stats/contract';
import { parseDelimited, type RawTable } from '../../shared/stats/data/raw-table';
import { readXlsxTable } from './xlsx-table';

/** Kinds of data file the reader accepts. */
export type TableFormat = 'delimited' | 'xlsx';

/** Guesses the format from the first bytes (a zip container is a workbook) and the file name. */
export function detectFormat(bytes: Uint8Array, name = ''): TableFormat {
  const zip = bytes.length >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04;
  const ole = bytes.length >= 4 && bytes[0] === 0xd0 && bytes[1] === 0xcf && bytes[2] === 0x11 && bytes[3] === 0xe0;
  if (ole || /\.xls$/i.test(name)) {
    throw new InputError('data', `${name || 'the data file'} is an old binary .xls workbook; save it as .xlsx or export it as CSV`);
  }
  if (zip || /\.xlsx$/i.test(name)) return 'xlsx';
  return 'delimited';
}

/** Decodes text as UTF-8, falling back to Windows-1252 (older spreadsheet exports) when it is not valid UTF-8. */
export function decodeText(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
  } catch {
    return new TextDecoder('windows-1252').decode(bytes);
  }
}

/** Reads a table from bytes; `name` (a file name) helps tell formats apart. */
export async function readTableBytes(bytes: Uint8Array, name = ''): Promise<RawTable> {
  if (detectFormat(bytes, name) === 'xlsx') return readXlsxTable(bytes);
  return parseDelimited(decodeText(bytes));
}

/** Reads a table from a file path; a missing or unreadable file is an InputError. */
export async function readTableFile(path: string): Promise<RawTable> {
  let bytes: Uint8Array;
  try {
    bytes = await readFile(path);
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'does not exist' : code === 'EISDIR' ? 'is a folder, not a file' : code === 'EACCES' ? 'cannot be read (permission denied)' : `cannot be read (${code ?? (err as Error).message})`;
    throw new InputError('--data', `data file ${path} ${why}`);
  }
  return readTableBytes(bytes, path);
}
