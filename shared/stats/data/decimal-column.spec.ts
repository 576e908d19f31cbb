import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CellKind, centreColumn, decimalText, scanCell, scanNumericColumn } from './decimal-column';
import { parseDelimited } from './raw-table';

const all = (n: number) => Int32Array.from({ length: n }, (_, i) => i);

/** Reference: the exact decimal difference a − b computed independently with BigInt at 40 places, as the nearest double. */
function exactDifference(a: string, b: string): number {
  const toBig = (s: string) => {
    const [i, f = ''] = s.trim().split('.');
    return BigInt(i + f.padEnd(40, '0')) * (s.trim().startsWith('-') && BigInt(i + f.padEnd(40, '0')) > 0n ? -1n : 1n);
  };
  return Number(`${toBig(a) - toBig(b)}e-40`);
}

describe('scanCell', () => {
  it('classifies numbers, missing values and text', () => {
    expect(scanCell('12.5', 46)).toBe(CellKind.Number);
    expect(scanCell(' -0.25 ', 46)).toBe(CellKind.Number);
    expect(scanCell('1e-3', 46)).toBe(CellKind.Number);
    expect(scanCell('', 46)).toBe(CellKind.Missing);
    expect(scanCell('  ', 46)).toBe(CellKind.Missing);
    expect(scanCell('NA', 46)).toBe(CellKind.Missing);
    expect(scanCell('abc', 46)).toBe(CellKind.NotNumber);
    expect(scanCell('1.2.3', 46)).toBe(CellKind.NotNumber);
    expect(scanCell('12kg', 46)).toBe(CellKind.NotNumber);
    expect(scanCell('NaN', 46)).toBe(CellKind.NotFinite);
    expect(scanCell('-Inf', 46)).toBe(CellKind.NotFinite);
    expect(scanCell('Infinity', 46)).toBe(CellKind.NotFinite);
    expect(scanCell('1e999', 46)).toBe(CellKind.NotFinite);
  });
});

describe('scanNumericColumn', () => {
  it('names the row (header = row 1) and column of a non-number', () => {
    expect(() => scanNumericColumn('score', ['1', '2', 'abc'])).toThrow("row 4 (line 4 of the file, counting the header as row 1), column score: 'abc' is not a number");
  });
  it('rejects NaN and infinite values with their own message', () => {
    expect(() => scanNumericColumn('score', ['1', 'NaN'])).toThrow(/row 3 .*column score: 'NaN' is not a finite number/);
    expect(() => scanNumericColumn('score', ['Inf'])).toThrow(/row 2 .*not a finite number/);
  });
  it('reads decimal commas only when the column has no decimal points', () => {
    const c = scanNumericColumn('y', ['3,5', '4', '']);
    expect(c.separator).toBe(',');
    expect(Array.from(centreColumn(c, Int32Array.of(0, 1)).values)).toEqual([0, 0.5]);
    expect(() => scanNumericColumn('y', ['3.5', '4,5'])).toThrow(/row 3 .*'4,5' is not a number/);
    // Three digits after a short integer part may be a thousands separator: refused, not guessed.
    expect(() => scanNumericColumn('y', ['3,5', '1,234'])).toThrow(/row 3 .*'1,234' could be read as a decimal comma or as a thousands separator/);
    expect(Array.from(centreColumn(scanNumericColumn('y', ['0,125', '2,5']), Int32Array.of(0, 1)).values)).toEqual([0, 2.375]);
  });
});

describe('centreColumn', () => {
  it('subtracts the first used value exactly and reports the offset', () => {
    const c = scanNumericColumn('y', ['0.3', '0.1', '0.2', '1e2', '-2.5E-1']);
    const out = centreColumn(c, all(5));
    expect(out.offsetText).toBe('0.3');
    // Exact decimal differences, each rounded once: 0.1 − 0.3 = −0.2 exactly in decimal.
    expect(Array.from(out.values)).toEqual([0, -0.2, -0.1, 99.7, -0.55]);
  });

  it('uses BigInt when the digits exceed 2^53 and still rounds the exact difference once', () => {
    const cells = ['123456789012345678.25', '123456789012345679.5'];
    const c = scanNumericColumn('y', cells);
    expect(c.big).toBe(true);
    const out = centreColumn(c, all(2));
    expect(out.values[1]).toBe(1.25);
    expect(out.offsetText).toBe('123456789012345678.25');
  });

  it('formats decimal offsets', () => {
    expect(decimalText(-5n, 3)).toBe('-0.005');
    expect(decimalText(10000000000004n, 1)).toBe('1000000000000.4');
  });

  // Source: NIST StRD one-way ANOVA dataset SmLs09 (higher difficulty), values as published, test/reference/nist/anova/SmLs09.csv.
  it('centres NIST SmLs09 to exactly the decimal differences', () => {
    const text = readFileSync(new URL('../../../test/reference/nist/anova/SmLs09.csv', import.meta.url), 'utf8');
    const t = parseDelimited(text);
    const y = t.columns[t.header.indexOf('y')];
    expect(y.length).toBe(18009);
    const out = centreColumn(scanNumericColumn('y', y), all(y.length));
    expect(out.offsetText).toBe(y[0]);
    expect(out.offset).toBe(Number(y[0]));
    let mismatches = 0;
    for (let i = 0; i < y.length; i++) if (out.values[i] !== exactDifference(y[i], y[0])) mismatches++;
    expect(mismatches).toBe(0);
    // A plain double subtraction is not exact here, which is why centring works on the digits.
    expect(Number('1000000000000.5') - Number('1000000000000.4')).not.toBe(0.1);
    expect(out.values[2]).toBe(0.1);
  });
});
