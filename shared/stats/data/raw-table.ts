/**
 * The uniform shape of a data file before any plan is applied, and the reader
 * for delimited text. Cells stay strings here: numbers are converted later, per
 * column, so that decimal centring can work on the digits as written.
 */
import { InputError } from '../contract';

/** A parsed table: header names and column-major cell strings (header row excluded). */
export interface RawTable {
  header: string[];
  columns: string[][];
}

const QUOTE = 34;
const LF = 10;
const CR = 13;
const CACHE_MASK = 8191;

/** Picks the delimiter that occurs most often in the header line (outside quotes); comma on a tie. */
export function detectDelimiter(text: string, start = 0): string {
  const counts = new Map<number, number>([[44, 0], [59, 0], [9, 0]]);
  let inQuotes = false;
  for (let i = start; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === QUOTE) inQuotes = !inQuotes;
    else if (!inQuotes && (c === LF || c === CR)) break;
    else if (!inQuotes && counts.has(c)) counts.set(c, counts.get(c)! + 1);
  }
  let best = 44;
  for (const code of [59, 9]) if (counts.get(code)! > counts.get(best)!) best = code;
  return String.fromCharCode(best);
}

/** Row label used in messages: the header is row 1, so data row i (0-based) is row i + 2. */
function rowLabel(dataRow: number, line: number): string {
  return `row ${dataRow + 2} (line ${line} of the file)`;
}

/**
 * Parses comma-, semicolon- or tab-delimited text (detected from the header
 * line) with RFC 4180 quoting, a leading byte-order mark, CRLF, LF or CR line
 * ends, and blank lines ignored. The first non-blank line is the header.
 * Cells are written straight into per-column arrays: no per-row objects, which
 * keeps a million-row file to a few hundred milliseconds.
 */
export function parseDelimited(text: string): RawTable {
  let pos = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  const delimiter = detectDelimiter(text, pos).charCodeAt(0);
  const len = text.length;
  // The header is read into `columns` as a single pseudo-row first, then moved out.
  let header: string[] = [];
  let haveHeader = false;
  let columns: string[][] = [[]];
  let caches: string[][] = [];
  let width = 1 << 30;
  let col = 0;
  let line = 1;
  let rowLine = 1;
  let dataRows = 0;
  let rowBlank = true;

  const put = (value: string): void => {
    if (value !== '') rowBlank = false;
    if (!haveHeader) {
      header.push(value.trim());
    } else if (col < width) {
      columns[col].push(value);
    } else if (value.trim() !== '') {
      // Extra trailing fields are accepted only when empty (some spreadsheets pad rows).
      throw new InputError(
        `row ${dataRows + 2}`,
        `${rowLabel(dataRows, rowLine)} has more fields than the header's ${width}; check for an extra delimiter or an unquoted ${String.fromCharCode(delimiter) === '\t' ? 'tab' : `'${String.fromCharCode(delimiter)}'`} inside a value`,
      );
    }
    col++;
  };

  const endRow = (): void => {
    if (!haveHeader) {
      if (col === 1 && rowBlank) {
        header = [];
      } else {
        haveHeader = true;
        width = header.length;
        columns = header.map(() => []);
        caches = header.map(() => new Array<string>(CACHE_MASK + 1).fill(''));
      }
    } else if (col === 1 && rowBlank && width > 1) {
      columns[0].pop(); // a blank line
    } else {
      if (col < width) {
        throw new InputError(
          `row ${dataRows + 2}`,
          `${rowLabel(dataRows, rowLine)} has ${col} fields but the header has ${width}; check for a missing delimiter or an unclosed quote`,
        );
      }
      dataRows++;
    }
    col = 0;
    rowBlank = true;
  };

  while (pos < len) {
    const c = text.charCodeAt(pos);
    if (c === QUOTE) {
      // Quoted field: "" is an escaped quote; delimiters and line breaks inside are literal.
      let value = '';
      let segStart = pos + 1;
      for (;;) {
        const q = text.indexOf('"', segStart);
        if (q < 0) {
          throw new InputError(`row ${dataRows + 2}`, `${rowLabel(dataRows, rowLine)} has a quote that is never closed`);
        }
        for (let k = segStart; k < q; k++) if (text.charCodeAt(k) === LF) line++;
        if (text.charCodeAt(q + 1) === QUOTE) {
          value += text.slice(segStart, q + 1);
          segStart = q + 2;
          continue;
        }
        value += text.slice(segStart, q);
        pos = q + 1;
        break;
      }
      let e = pos;
      while (e < len) {
        const d = text.charCodeAt(e);
        if (d === delimiter || d === LF || d === CR) break;
        e++;
      }
      // Spaces after the closing quote are dropped; any other trailing text is kept verbatim.
      const tail = text.slice(pos, e);
      put(tail.trim() === '' ? value : value + tail);
      rowBlank = false;
      pos = e;
    } else {
      let e = pos;
      let h = 0;
      while (e < len) {
        const d = text.charCodeAt(e);
        if (d === delimiter || d === LF || d === CR) break;
        h = (h * 31 + d) | 0;
        e++;
      }
      if (haveHeader && col < width) {
        // Hot path: cells repeat a lot (factor labels, rounded scores), so a small
        // per-column cache hands back an existing string instead of allocating one.
        const size = e - pos;
        if (size > 0) rowBlank = false;
        const cache = caches[col];
        const slot = (h ^ (h >>> 11)) & CACHE_MASK;
        const hit = cache[slot];
        let value: string | undefined;
        if (hit.length === size) {
          value = hit;
          for (let k = 0; k < size; k++) {
            if (hit.charCodeAt(k) !== text.charCodeAt(pos + k)) {
              value = undefined;
              break;
            }
          }
        }
        if (value === undefined) {
          value = text.slice(pos, e);
          cache[slot] = value;
        }
        columns[col++].push(value);
      } else {
        put(text.slice(pos, e));
      }
      pos = e;
    }
    if (pos >= len) break;
    const d = text.charCodeAt(pos);
    if (d === delimiter) {
      pos++;
      if (pos >= len) put('');
      continue;
    }
    pos += d === CR && text.charCodeAt(pos + 1) === LF ? 2 : 1;
    line++;
    endRow();
    rowLine = line;
  }
  if (col > 0) endRow();
  if (!haveHeader) throw new InputError('data', 'the data file is empty: expected a header row naming the columns');
  return { header, columns };
}
