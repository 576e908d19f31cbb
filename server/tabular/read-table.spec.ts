import { describe, expect, it } from 'vitest';
import { InputError } from '../../shared/stats/contract';
import { decodeText, detectFormat, readTableBytes } from './read-table';

// Byte values are the published encodings: UTF-8 (RFC 3629) and Windows-1252 (0xE9 = é).
describe('reading data bytes', () => {
  it('decodes UTF-8, and falls back to Windows-1252 for older spreadsheet exports', () => {
    expect(decodeText(new Uint8Array([0x63, 0x61, 0x66, 0xc3, 0xa9]))).toBe('café');
    expect(decodeText(new Uint8Array([0x63, 0x61, 0x66, 0xe9]))).toBe('café');
  });

  it('tells a workbook from text by its zip signature, and refuses old .xls files', () => {
    expect(detectFormat(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0]))).toBe('xlsx');
    expect(detectFormat(new TextEncoder().encode('a,b\n1,2\n'), 'data.csv')).toBe('delimited');
    expect(() => detectFormat(new Uint8Array([0xd0, 0xcf, 0x11, 0xe0]), 'old.xls')).toThrow(InputError);
    expect(() => detectFormat(new Uint8Array([0xd0, 0xcf, 0x11, 0xe0]), 'old.xls')).toThrow(/old binary \.xls workbook/);
  });

  it('reads delimited bytes with a byte-order mark into a table', async () => {
    const bytes = new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode('g;y\r\na;1,5\r\n')]);
    expect(await readTableBytes(bytes, 'x.csv')).toEqual({ header: ['g', 'y'], columns: [['a'], ['1,5']] });
  });
});
