/**
 * Deciding what an uploaded file is from its bytes, never from its name: an .xlsx
 * workbook (a ZIP container holding xl/workbook.xml) or UTF-8 delimited text. Anything
 * else is refused with 415 naming what the bytes look like.
 */
import { HttpError } from '../middleware/errors';

/** Formats the filing form accepts. */
export type UploadFormat = 'csv' | 'xlsx';

const startsWith = (b: Uint8Array, sig: number[], at = 0) => b.length >= at + sig.length && sig.every((x, i) => b[at + i] === x);
const ascii = (s: string) => [...s].map((c) => c.charCodeAt(0));

/** Binary signatures we recognise, for a message that says what the file is. */
const SIGNATURES: { sig: number[]; at?: number; what: string }[] = [
  { sig: ascii('%PDF'), what: 'a PDF document' },
  { sig: [0x89, 0x50, 0x4e, 0x47], what: 'a PNG image' },
  { sig: [0xff, 0xd8, 0xff], what: 'a JPEG image' },
  { sig: ascii('GIF8'), what: 'a GIF image' },
  { sig: ascii('RIFF'), what: 'a RIFF media file (e.g. WebP image or WAV audio)' },
  { sig: ascii('BM'), what: 'a bitmap image' },
  { sig: [0x49, 0x49, 0x2a, 0x00], what: 'a TIFF image' },
  { sig: [0x4d, 0x4d, 0x00, 0x2a], what: 'a TIFF image' },
  { sig: ascii('MZ'), what: 'a Windows program' },
  { sig: [0x7f, 0x45, 0x4c, 0x46], what: 'a Linux program' },
  { sig: [0xcf, 0xfa, 0xed, 0xfe], what: 'a macOS program' },
  { sig: [0x1f, 0x8b], what: 'a gzip archive' },
  { sig: ascii('7z'), what: 'a 7-Zip archive' },
  { sig: ascii('Rar!'), what: 'a RAR archive' },
  { sig: ascii('SQLite format 3'), what: 'an SQLite database' },
  { sig: [0xd0, 0xcf, 0x11, 0xe0], what: 'an old binary Office file (.xls from Excel 97–2003, or .doc)' },
  { sig: ascii('ftyp'), at: 4, what: 'a video or image file (MP4, MOV or HEIC)' },
];

function contains(bytes: Uint8Array, needle: string): boolean {
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).includes(needle, 0, 'latin1');
}

const unsupported = (what: string) =>
  new HttpError(415, 'unsupported-type', `The file looks like ${what}, not a data table. Upload a CSV (UTF-8 text) or an .xlsx workbook.`, { file: `The file looks like ${what}.` });

/**
 * Returns the format of an upload or throws: 422 for an empty file, 415 for anything
 * that is neither an .xlsx workbook nor UTF-8 text without NUL bytes.
 */
export function sniffUpload(bytes: Uint8Array): UploadFormat {
  if (bytes.length === 0) throw new HttpError(422, 'invalid-data', 'The file is empty: expected a header row naming the columns and at least one data row.', { file: 'The file is empty.' });
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04])) {
    // The entry names of a ZIP are stored uncompressed in its headers.
    if (contains(bytes, 'xl/workbook.xml')) return 'xlsx';
    if (contains(bytes, 'word/document.xml')) throw unsupported('a Word document (.docx)');
    if (contains(bytes, 'ppt/presentation.xml')) throw unsupported('a PowerPoint presentation (.pptx)');
    if (contains(bytes, 'content.xml') && contains(bytes, 'mimetype')) throw unsupported('an OpenDocument file; save it as .xlsx or CSV');
    throw unsupported('a ZIP archive that is not an .xlsx workbook');
  }
  if (startsWith(bytes, ascii('%PDF-'))) throw unsupported('a PDF document');
  if (startsWith(bytes, [0xff, 0xfe]) || startsWith(bytes, [0xfe, 0xff])) {
    throw unsupported('UTF-16 text (a "Unicode text" export); save it as "CSV UTF-8"');
  }
  let text = !bytes.includes(0);
  if (text) {
    try {
      new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      text = false;
    }
  }
  if (text) return 'csv';
  // Short signatures such as "BM" are only trusted on binary content, so a CSV whose header starts "BMI," is fine.
  for (const s of SIGNATURES) if (startsWith(bytes, s.sig, s.at ?? 0)) throw unsupported(s.what);
  if (bytes.includes(0)) throw unsupported('a binary file (it contains NUL bytes)');
  throw unsupported('text in an encoding other than UTF-8; save it as "CSV UTF-8"');
  return 'csv';
}
