/** Unit checks of upload sniffing, column profiles and wide → long reshaping (no database). */
import { describe, expect, it } from 'vitest';
import { parseDelimited } from '../../shared/stats/data/raw-table';
import { checkTableShape, profileColumn } from './dataset-profile';
import { checkReshape, csvField, wideToLongCsv } from './dataset-reshape';
import { sniffUpload } from './dataset-sniff';

const status = (f: () => unknown): number | null => {
  try {
    f();
    return null;
  } catch (err) {
    return (err as { status: number }).status;
  }
};

describe('sniffUpload', () => {
  it('accepts UTF-8 text even when its first letters match a short binary signature', () => {
    expect(sniffUpload(Buffer.from('BMI,score\n22.1,3\n'))).toBe('csv');
    expect(sniffUpload(Buffer.from('MZ_code,score\nA,3\n'))).toBe('csv');
  });
  it('tells an .xlsx from other ZIP containers by the workbook entry', () => {
    const zip = (entry: string) => Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(26), Buffer.from(entry)]);
    expect(sniffUpload(zip('xl/workbook.xml'))).toBe('xlsx');
    expect(() => sniffUpload(zip('word/document.xml'))).toThrow(/Word document/);
    expect(() => sniffUpload(zip('data/readme.txt'))).toThrow(/ZIP archive that is not an .xlsx/);
  });
  it('refuses UTF-16 text and empty files with their own statuses', () => {
    expect(status(() => sniffUpload(Buffer.from('\ufeffa,b\n', 'utf16le')))).toBe(415);
    expect(status(() => sniffUpload(Buffer.alloc(0)))).toBe(422);
  });
});

describe('profileColumn', () => {
  it('reads a decimal-comma column as numeric and counts empty cells and NA as missing', () => {
    const p = profileColumn('score', ['3,5', '4,25', 'NA', '', '10']);
    expect(p).toMatchObject({ kind: 'numeric', missing: 2, distinct: 3, min: 3.5, max: 10 });
  });
  it('calls all-distinct text identifier-like only with enough rows', () => {
    expect(profileColumn('code', ['A1', 'A2', 'A3', 'A4', 'A5']).kind).toBe('identifier-like');
    expect(profileColumn('code', ['A1', 'A2']).kind).toBe('categorical');
    expect(profileColumn('blank', ['', 'NA']).kind).toBe('empty');
  });
  it('refuses a header that repeats a name regardless of case', () => {
    expect(() => checkTableShape(parseDelimited('a,B,b\n1,2,3\n'))).toThrow(/Columns 2 and 3 are both named "b"/);
  });
});

describe('wide → long', () => {
  const wide = parseDelimited('id,group,t1,t2\nS1,"a, b",1.5,2\nS2,c,NA,4\n');
  const body = { subjectColumn: 'id', measureColumns: ['t1', 't2'], factorName: 'time', valueName: 'y', levels: ['pre', 'post'], keepColumns: ['group'] };
  it('writes one row per subject and occasion, quoting cells that need it', () => {
    const long = parseDelimited(wideToLongCsv(wide, body));
    expect(long.header).toEqual(['id', 'group', 'time', 'y']);
    expect(long.columns).toEqual([['S1', 'S1', 'S2', 'S2'], ['a, b', 'a, b', 'c', 'c'], ['pre', 'post', 'pre', 'post'], ['1.5', '2', 'NA', '4']]);
    expect(csvField(' x')).toBe('" x"');
  });
  it('refuses a repeated subject and a non-numeric measure column', () => {
    const profiles = wide.header.map((h, i) => profileColumn(h, wide.columns[i]));
    expect(() => checkReshape(wide, profiles, { ...body, measureColumns: ['group', 't2'], keepColumns: [] })).toThrow(/"group" is not numeric/);
    const twice = parseDelimited('id,t1,t2\nS1,1,2\nS1,3,4\n');
    expect(() => checkReshape(twice, twice.header.map((h, i) => profileColumn(h, twice.columns[i])), { ...body, keepColumns: [] })).toThrow(/appears in rows 2 and 3/);
  });
});
