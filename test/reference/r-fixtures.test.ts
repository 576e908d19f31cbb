/**
 * Housekeeping for the R reference fixtures: every fixture file is covered by
 * a test file, records its provenance, and its CSV parses to the row count R used.
 */
import { describe, expect, it } from 'vitest';
import { parseDelimited } from '../../shared/stats/data/raw-table';
import {
  BETWEEN_FIXTURES, INDEPENDENT_FIXTURES, ONE_SAMPLE_FIXTURES, PAIRED_FIXTURES, REGRESSION_FIXTURES, WITHIN_FIXTURES,
} from './fixture-lists';
import { fixtureNames, loadFixture } from './r-fixtures';

const covered = [...ONE_SAMPLE_FIXTURES, ...INDEPENDENT_FIXTURES, ...PAIRED_FIXTURES, ...BETWEEN_FIXTURES, ...WITHIN_FIXTURES, ...REGRESSION_FIXTURES];

describe('R reference fixtures', () => {
  it('every fixture file is checked by a test file, and every listed fixture exists', () => {
    expect([...covered].sort()).toEqual(fixtureNames());
  });

  it.each(fixtureNames())('%s records R version, packages, seed and calls', (name) => {
    const fx = loadFixture(name);
    expect(fx.provenance.r).toMatch(/^R version \d+\.\d+\.\d+/);
    expect(Object.keys(fx.provenance.packages)).toEqual(expect.arrayContaining(['stats', 'car', 'afex', 'emmeans', 'jsonlite']));
    expect(Number.isInteger(fx.provenance.seed)).toBe(true);
    expect(fx.provenance.calls.length).toBeGreaterThan(0);
  });

  it.each(fixtureNames())('%s CSV has the rows R read', (name) => {
    const fx = loadFixture(name);
    const table = parseDelimited(fx.csv);
    const rows = fx.csv.trimEnd().split('\n').length - 1;
    expect(table.columns[0]?.length).toBe(rows);
  });
});
