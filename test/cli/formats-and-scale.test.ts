/**
 * The rerun command on the published entry point (npm script), on .xlsx
 * workbooks, and on a million-row file. Expected values are computed here
 * from the generated data with exact integer arithmetic, not copied from a run.
 */
import ExcelJS from 'exceljs';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli, runNpm, tempDir } from './run-cli';

const tmp = tempDir();
afterAll(() => tmp.cleanup());

describe('rerun command entry points and formats', () => {
  it('runs through `npm run --silent rerun` and prints exactly one JSON document', () => {
    const plan = tmp.file('npm.plan.json', JSON.stringify({ design: 'one-sample', outcome: 'y', mu: 1 }));
    const data = tmp.file('npm.csv', 'y\n1\n2\n3\n4\n');
    const run = runNpm(['--plan', plan, '--data', data]);
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    expect(run.stdout.trimEnd().split('\n')).toHaveLength(1);
    const result = JSON.parse(run.stdout);
    expect(result.engine).toBe('1.0.0');
    expect(result.design).toBe('one-sample');
    // Mean of 1..4 is 2.5; estimate is mean − mu = 1.5.
    expect(result.tests[0].estimate).toBe(1.5);
    const bad = runNpm(['--plan', plan, '--data', `${tmp.dir}/absent.csv`]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toBe(`rerun: data file ${tmp.dir}/absent.csv does not exist\n`);
  });

  it('--pretty indents the same document', () => {
    const plan = tmp.file('pretty.plan.json', JSON.stringify({ design: 'one-sample', outcome: 'y' }));
    const data = tmp.file('pretty.csv', 'y\n1\n2\n4\n');
    const flat = JSON.parse(runCli(['--plan', plan, '--data', data]).stdout);
    const pretty = runCli(['--plan', plan, '--data', data, '--pretty']);
    expect(pretty.stdout.split('\n').length).toBeGreaterThan(10);
    const parsed = JSON.parse(pretty.stdout);
    delete parsed.timings;
    delete flat.timings;
    expect(parsed).toEqual(flat);
  });

  it('reads the first worksheet of an .xlsx workbook like the same data as CSV', async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('scores');
    workbook.addWorksheet('notes').addRow(['ignored']);
    const rows: [string, number | null][] = [['a', 1.5], ['a', 2.25], ['a', null], ['b', 3], ['b', 5.5], ['b', 4]];
    sheet.addRow(['group', 'score']);
    rows.forEach((r) => sheet.addRow(r));
    const xlsx = tmp.file('book.xlsx', new Uint8Array(await workbook.xlsx.writeBuffer()));
    const csv = tmp.file('book.csv', `group,score\n${rows.map(([g, y]) => `${g},${y ?? ''}`).join('\n')}\n`);
    const plan = tmp.file('book.plan.json', JSON.stringify({ design: 'independent', outcome: 'score', between: ['group'] }));
    const fromXlsx = runCli(['--plan', plan, '--data', xlsx]);
    expect(fromXlsx.stderr).toBe('');
    const a = JSON.parse(fromXlsx.stdout);
    const b = JSON.parse(runCli(['--plan', plan, '--data', csv]).stdout);
    delete a.timings;
    delete b.timings;
    expect(a).toEqual(b);
    expect(a.excluded).toBe(1);
    expect(a.descriptives[0].mean).toBe(1.875);
  });

  it('rejects a file that claims to be a workbook but is not', () => {
    const plan = tmp.file('fake.plan.json', JSON.stringify({ design: 'one-sample', outcome: 'y' }));
    const fake = tmp.file('fake.xlsx', 'y\n1\n2\n');
    const run = runCli(['--plan', plan, '--data', fake]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^rerun: the workbook could not be read as \.xlsx/);
  });

  it('handles 1,000,000 rows', () => {
    // Two groups with known sums: value = (i mod 1000) / 10, group by i mod 2.
    const parts = ['id,group,score\n'];
    const sum = [0n, 0n];
    for (let i = 0; i < 1_000_000; i++) {
      const v = i % 1000;
      sum[i % 2] += BigInt(v);
      parts.push(`S${i},${i % 2 === 0 ? 'even' : 'odd'},${v / 10}\n`);
    }
    const data = tmp.file('million.csv', parts.join(''));
    const plan = tmp.file('million.plan.json', JSON.stringify({ design: 'independent', outcome: 'score', between: ['group'] }));
    const run = runCli(['--plan', plan, '--data', data]);
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    const result = JSON.parse(run.stdout);
    expect(result.n).toBe(1_000_000);
    // Exact group means: sum / 500000 / 10, compared to 1e-12 relative.
    const expected = sum.map((s) => Number(s) / 500_000 / 10);
    result.descriptives.forEach((c: { mean: number }, k: number) => expect(Math.abs(c.mean - expected[k]) / expected[k]).toBeLessThan(1e-12));
  });
});
