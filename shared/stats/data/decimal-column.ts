/**
 * Reading a numeric column exactly: each cell's decimal digits are kept as an
 * integer mantissa and a scale (value = mantissa × 10^−scale), and the column
 * is centred by subtracting a common decimal offset on those integers before
 * anything becomes binary floating point. Values such as 1000000000000.4 then
 * arrive in the engine as exact small remainders (0.1, −0.1, ...), which is
 * what keeps sums of squares accurate on data with a large common part.
 */
import { InputError } from '../contract';

/** Result of scanning one cell. */
export enum CellKind {
  Number = 0,
  Missing = 1,
  NotNumber = 2,
  NotFinite = 3,
}

/** A scanned numeric column before row selection. */
export interface ScannedColumn {
  name: string;
  /** Integer mantissa of each cell (exact when below 2^53, see `big`). */
  mantissa: Float64Array;
  /** Decimal places of each cell (value = mantissa × 10^−scale); may be negative for exponents. */
  scale: Int16Array;
  /** 1 where the cell is missing (empty or NA). */
  missing: Uint8Array;
  /** True when some mantissa needs more than 53 bits: those cells are re-read with BigInt. */
  big: boolean;
  /** The decimal separator that was accepted ("." or ","). */
  separator: '.' | ',';
  /** The cell strings, kept for the BigInt path and for messages. */
  cells: string[];
}

const TWO53 = 9007199254740992;
/** Powers of ten that are exact doubles (10^0 … 10^22). */
const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

let scanMantissa = 0;
let scanScale = 0;
let scanExact = true;

/** True when a cell counts as missing: empty, blanks only, or NA. */
export function isMissingCell(s: string): boolean {
  if (s.length === 0) return true;
  const t = s.length > 2 || s.charCodeAt(0) === 32 ? s.trim() : s;
  return t === '' || t === 'NA';
}

/**
 * Scans one cell as a decimal number (optional sign, digits, one separator,
 * optional exponent; surrounding blanks ignored). Leaves the mantissa and scale
 * in module scratch variables so a million cells allocate nothing.
 */
export function scanCell(s: string, sepCode: number): CellKind {
  let i = 0;
  let end = s.length;
  while (i < end && s.charCodeAt(i) === 32) i++;
  while (end > i && s.charCodeAt(end - 1) === 32) end--;
  if (i === end) return CellKind.Missing;
  let neg = false;
  let c = s.charCodeAt(i);
  if (c === 45 || c === 43) {
    neg = c === 45;
    i++;
  }
  let m = 0;
  let digits = 0;
  let frac = 0;
  let seenSep = false;
  let exact = true;
  for (; i < end; i++) {
    c = s.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      if (digits > 0 || c !== 48 || seenSep) {
        m = m * 10 + (c - 48);
        if (m >= TWO53) exact = false;
      }
      digits++;
      if (seenSep) frac++;
    } else if (c === sepCode && !seenSep) {
      seenSep = true;
    } else break;
  }
  if (digits === 0) return classifyText(s);
  let exp = 0;
  if (i < end) {
    c = s.charCodeAt(i);
    if (c !== 101 && c !== 69) return classifyText(s);
    i++;
    let eneg = false;
    c = s.charCodeAt(i);
    if (c === 45 || c === 43) {
      eneg = c === 45;
      i++;
    }
    let ed = 0;
    for (; i < end; i++) {
      c = s.charCodeAt(i);
      if (c < 48 || c > 57) return classifyText(s);
      exp = exp * 10 + (c - 48);
      ed++;
      if (exp > 400) return CellKind.NotFinite;
    }
    if (ed === 0) return classifyText(s);
    if (eneg) exp = -exp;
  }
  let scale = frac - exp;
  if (scale < 0 && m !== 0) {
    // A positive exponent beyond the fraction digits: scale the mantissa up.
    if (-scale > 22 || m * POW10[-scale] >= TWO53) exact = false;
    else m *= POW10[-scale];
    if (exact) scale = 0;
  }
  if (m === 0) scale = 0;
  scanMantissa = neg ? -m : m;
  scanScale = scale;
  scanExact = exact;
  return CellKind.Number;
}

function classifyText(s: string): CellKind {
  const t = s.trim().toLowerCase().replace(/^[+-]/, '');
  if (t === 'nan' || t === 'inf' || t === 'infinity' || t === '#num!' || t === '#div/0!') return CellKind.NotFinite;
  return isMissingCell(s) ? CellKind.Missing : CellKind.NotNumber;
}

/** Error for a cell that is not a usable number; rows counted as a spreadsheet user would. */
export function badCellError(column: string, dataRow: number, cell: string, kind: CellKind): InputError {
  const where = `row ${dataRow + 2} (line ${dataRow + 2} of the file, counting the header as row 1), column ${column}`;
  const shown = cell.length > 40 ? `${cell.slice(0, 40)}…` : cell;
  const why =
    kind === CellKind.NotFinite
      ? `'${shown}' is not a finite number (NaN and infinite values are not accepted; leave the cell empty or write NA for a missing value)`
      : `'${shown}' is not a number (leave the cell empty or write NA for a missing value)`;
  return new InputError(`row ${dataRow + 2}, column ${column}`, `${where}: ${why}`);
}

/**
 * Scans every cell of a numeric column. A comma is accepted as the decimal
 * separator only when no cell of the column uses a point, so "3,5" in a
 * semicolon-delimited European file reads as 3.5 while "1,234" never silently
 * becomes 1.234 next to points.
 */
export function scanNumericColumn(name: string, cells: string[]): ScannedColumn {
  const n = cells.length;
  const mantissa = new Float64Array(n);
  const scale = new Int16Array(n);
  const missing = new Uint8Array(n);
  let big = false;
  let sepCode = 46;
  for (let r = 0; r < n; r++) {
    const s = cells[r];
    const kind = scanCell(s, sepCode);
    if (kind === CellKind.Number) {
      mantissa[r] = scanMantissa;
      scale[r] = scanScale;
      if (!scanExact) big = true;
    } else if (kind === CellKind.Missing) {
      missing[r] = 1;
    } else if (sepCode === 46 && s.includes(',') && !cells.some((x) => x.includes('.')) && scanCell(s, 44) === CellKind.Number) {
      sepCode = 44;
      r = -1; // restart the column with the comma as separator
      big = false;
      missing.fill(0);
    } else {
      throw badCellError(name, r, s, kind);
    }
  }
  if (sepCode === 44) {
    // "1,234" could be a thousands separator; refuse to guess rather than read 1.234.
    const ambiguous = /^\s*[+-]?[1-9]\d{0,2},\d{3}\s*$/;
    for (let r = 0; r < n; r++) {
      if (ambiguous.test(cells[r])) {
        throw new InputError(
          `row ${r + 2}, column ${name}`,
          `row ${r + 2} (line ${r + 2} of the file, counting the header as row 1), column ${name}: '${cells[r].trim()}' could be read as a decimal comma or as a thousands separator; write numbers without thousands separators, with the decimal separator used consistently`,
        );
      }
    }
  }
  return { name, mantissa, scale, missing, big, separator: sepCode === 44 ? ',' : '.', cells };
}

/** Exact integer mantissa of one cell at a given scale, as a BigInt. */
function bigMantissa(cell: string, separator: string, targetScale: number): bigint {
  let t = cell.trim();
  if (separator === ',') t = t.replace(',', '.');
  const m = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(t);
  if (!m) throw new Error(`internal: cell '${cell}' passed the scan but not the exact reader`);
  const intDigits = m[2] ?? '';
  const fracDigits = m[3] ?? '';
  const exp = m[4] ? Number(m[4]) : 0;
  const scale = fracDigits.length - exp;
  let v = BigInt((intDigits + fracDigits).replace(/^0+(?=\d)/, '') || '0');
  const shift = targetScale - scale;
  v = shift >= 0 ? v * 10n ** BigInt(shift) : v / 10n ** BigInt(-shift);
  return m[1] === '-' ? -v : v;
}

/** A decimal integer count × 10^−scale as the nearest double (the parse is correctly rounded). */
function toDouble(count: bigint, scale: number): number {
  return Number(`${count}e${-scale}`);
}

/** An exactly centred numeric column restricted to the rows used. */
export interface CentredColumn {
  values: Float64Array;
  offset: number;
  /** The offset exactly as a decimal string. */
  offsetText: string;
}

/**
 * Centres the used rows of a scanned column on a common decimal offset: the
 * value of the first used cell. Each remainder is the exact decimal difference
 * rounded once to the nearest double. Fast path: mantissas below 2^53 at a
 * common scale ≤ 22 subtract exactly in doubles, and one division by an exact
 * power of ten is correctly rounded. Otherwise BigInt does the subtraction.
 */
export function centreColumn(col: ScannedColumn, used: Int32Array): CentredColumn {
  const n = used.length;
  const values = new Float64Array(n);
  if (n === 0) return { values, offset: 0, offsetText: '0' };
  let S = -1 << 15;
  for (let j = 0; j < n; j++) {
    const s = col.scale[used[j]];
    if (s > S) S = s;
  }
  if (S < 0) S = 0;
  let fast = !col.big && S <= 22;
  if (fast) {
    for (let j = 0; j < n && fast; j++) {
      const r = used[j];
      const up = S - col.scale[r];
      if (up > 22 || Math.abs(col.mantissa[r]) * POW10[up] >= TWO53) fast = false;
    }
  }
  if (fast) {
    const r0 = used[0];
    const K = col.mantissa[r0] * POW10[S - col.scale[r0]];
    const div = POW10[S];
    for (let j = 0; j < n; j++) {
      const r = used[j];
      // Both integers are below 2^53, so the difference is exact; the division rounds once.
      values[j] = (col.mantissa[r] * POW10[S - col.scale[r]] - K) / div;
    }
    const offsetText = decimalText(BigInt(K), S);
    return { values, offset: toDouble(BigInt(K), S), offsetText };
  }
  const K = bigMantissa(col.cells[used[0]], col.separator, S);
  for (let j = 0; j < n; j++) {
    values[j] = toDouble(bigMantissa(col.cells[used[j]], col.separator, S) - K, S);
  }
  return { values, offset: toDouble(K, S), offsetText: decimalText(K, S) };
}

/** Formats count × 10^−scale as a plain decimal string. */
export function decimalText(count: bigint, scale: number): string {
  const neg = count < 0n;
  let digits = (neg ? -count : count).toString();
  if (scale > 0) {
    digits = digits.padStart(scale + 1, '0');
    digits = `${digits.slice(0, -scale)}.${digits.slice(-scale)}`.replace(/\.?0+$/, '');
  }
  return neg ? `-${digits}` : digits;
}
