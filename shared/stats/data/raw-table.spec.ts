import { describe, expect, it } from 'vitest';
import { InputError } from '../contract';
import { detectDelimiter, parseDelimited } from './raw-table';

// Expected tables below are the RFC 4180 reading of each input (quoting rules of RFC 4180, sections 2.5–2.7).
describe('parseDelimited', () => {
  it('reads a plain comma-separated file column by column', () => {
    expect(parseDelimited('g,y\na,1\nb,2\n')).toEqual({ header: ['g', 'y'], columns: [['a', 'b'], ['1', '2']] });
  });

  it('drops a UTF-8 byte-order mark and trims header names', () => {
    const t = parseDelimited('\uFEFF group , y\r\na,1\r\n');
    expect(t.header).toEqual(['group', 'y']);
    expect(t.columns[0]).toEqual(['a']);
  });

  it('detects semicolon and tab delimiters from the header line', () => {
    expect(detectDelimiter('a;b;c\n1,5;2;3')).toBe(';');
    expect(detectDelimiter('a\tb\n1\t2')).toBe('\t');
    expect(detectDelimiter('a,b;c,d\n')).toBe(',');
    expect(parseDelimited('g;y\na;3,5\n').columns[1]).toEqual(['3,5']);
  });

  it('handles quoted fields with delimiters, doubled quotes and line breaks inside (RFC 4180 §2.6–2.7)', () => {
    const t = parseDelimited('name,note\n"Vale, H.","said ""hi""\nthen left"\nx,y\n');
    expect(t.columns[0]).toEqual(['Vale, H.', 'x']);
    expect(t.columns[1]).toEqual(['said "hi"\nthen left', 'y']);
  });

  it('accepts CRLF, LF and lone CR line ends, skips blank lines and a missing final newline', () => {
    expect(parseDelimited('a,b\r\n1,2\r\n\r\n3,4').columns).toEqual([['1', '3'], ['2', '4']]);
    expect(parseDelimited('a,b\r1,2\r3,4\r').columns).toEqual([['1', '3'], ['2', '4']]);
  });

  it('keeps empty cells, including a trailing empty field', () => {
    expect(parseDelimited('a,b,c\n1,,\n').columns).toEqual([['1'], [''], ['']]);
  });

  it('rejects a row with too few or too many fields, naming the row as a spreadsheet counts it', () => {
    expect(() => parseDelimited('a,b\n1,2\n3\n')).toThrow(/row 3 \(line 3 of the file\) has 1 fields but the header has 2/);
    expect(() => parseDelimited('a,b\n1,2,9\n')).toThrow(/row 2 \(line 2 of the file\) has more fields than the header's 2/);
    // Padding with empty trailing fields is tolerated.
    expect(parseDelimited('a,b\n1,2,,\n').columns).toEqual([['1'], ['2']]);
  });

  it('rejects an unclosed quote and an empty file with InputError', () => {
    expect(() => parseDelimited('a,b\n"1,2\n')).toThrow(InputError);
    expect(() => parseDelimited('a,b\n"1,2\n')).toThrow(/quote that is never closed/);
    expect(() => parseDelimited('')).toThrow(/empty/);
  });

  it('reads 10^6 rows × 3 columns in well under a second', () => {
    const parts = ['g,h,y\n'];
    for (let i = 0; i < 1_000_000; i++) parts.push(`g${i % 3},h${i % 4},${(i % 997) / 10}\n`);
    const text = parts.join('');
    // CPU time rather than wall time: the shared test machine may be busy with other work.
    const start = process.cpuUsage();
    const t = parseDelimited(text);
    const used = process.cpuUsage(start);
    const ms = (used.user + used.system) / 1000;
    expect(t.columns[2].length).toBe(1_000_000);
    expect(t.columns[2][999_999]).toBe(String((999_999 % 997) / 10));
    // Budget stated generously (1.5 s of CPU, all threads including the garbage collector's); typical is 0.3–0.5 s.
    expect(ms).toBeLessThan(1500);
  });
});
