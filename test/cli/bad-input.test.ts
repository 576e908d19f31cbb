/**
 * Every kind of bad input named in the rerun contract gets exit code 2 and a
 * specific one-line message (or, where the analysis can still run correctly,
 * a warning in the result). Expected messages are the ones documented in
 * docs/rerun-contract.md; the numbers asserted are hand-countable from the
 * tiny inputs written here.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { rerunWith, runCli, tempDir } from './run-cli';

const tmp = tempDir();
afterAll(() => tmp.cleanup());

const oneWay = { design: 'anova', outcome: 'score', between: ['group'] };
const twoGroups = { design: 'independent', outcome: 'score', between: ['group'] };
const mixed = { design: 'anova', outcome: 'score', between: ['arm'], within: ['time'], subject: 'id' };

/** Asserts an input error: exit 2, nothing on stdout, one line on stderr matching `message`. */
function expectInputError(run: ReturnType<typeof runCli>, message: RegExp | string): void {
  expect(run.stdout).toBe('');
  expect(run.stderr.startsWith('rerun: ')).toBe(true);
  expect(run.stderr.trimEnd().split('\n')).toHaveLength(1);
  if (typeof message === 'string') expect(run.stderr).toContain(message);
  else expect(run.stderr).toMatch(message);
  expect(run.code).toBe(2);
}

describe('invalid data', () => {
  it('text in a numeric column names the row (header = row 1) and the column', () => {
    const run = rerunWith(tmp, twoGroups, 'group,score\na,1\na,2\nb,abc\nb,4\n', 'text');
    expectInputError(run, "row 4 (line 4 of the file, counting the header as row 1), column score: 'abc' is not a number");
  });

  it('NaN and infinite values are errors, not missing values', () => {
    expectInputError(rerunWith(tmp, twoGroups, 'group,score\na,1\na,NaN\nb,3\nb,4\n', 'nan'), "row 3 (line 3 of the file, counting the header as row 1), column score: 'NaN' is not a finite number");
    expectInputError(rerunWith(tmp, twoGroups, 'group,score\na,1\na,2\nb,3\nb,-Inf\n', 'inf'), "row 5 (line 5 of the file, counting the header as row 1), column score: '-Inf' is not a finite number");
  });

  it('a factor with one level is an error', () => {
    expectInputError(rerunWith(tmp, oneWay, 'group,score\na,1\na,2\na,3\n', 'onelevel'), "between-subjects factor group has only one level ('a')");
  });

  it('a group emptied by missing values leaves the two-group design with one level', () => {
    expectInputError(rerunWith(tmp, twoGroups, 'group,score\na,1\na,2\nb,NA\nb,\n', 'emptied'), 'design "independent" compares exactly two groups, but group has 1 level (a)');
  });

  it('an empty cell in a two-way between design is an error naming the cell', () => {
    const plan = { design: 'anova', outcome: 'score', between: ['f', 'g'] };
    const csv = 'f,g,score\nx,p,1\nx,p,2\nx,q,3\nx,q,5\ny,p,4\ny,p,6\n';
    expectInputError(rerunWith(tmp, plan, csv, 'emptycell'), 'the group f=y, g=q has no observations');
  });

  it('a two-group comparison with a one-observation group is an error', () => {
    expectInputError(rerunWith(tmp, twoGroups, 'group,score\na,1\na,2\na,4\nb,3\n', 'single'), "group 'b' of group has only 1 observation");
  });

  it('a one-way ANOVA with a one-observation group runs with a warning', () => {
    const run = rerunWith(tmp, oneWay, 'group,score\na,1\na,2\na,4\nb,3\nc,5\nc,6\n', 'singleanova');
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    const result = JSON.parse(run.stdout);
    expect(result.warnings.some((w: string) => w.startsWith('The group group=b has only one observation. The F test still runs'))).toBe(true);
    // Residual df = 6 rows − 3 groups.
    expect(result.residual.df).toBe(3);
  });

  it('a mixed design with a one-subject group runs with a warning', () => {
    const csv = 'id,arm,time,score\n1,c,1,3\n1,c,2,4\n2,t,1,5\n2,t,2,7\n3,t,1,2\n3,t,2,5\n4,t,1,4\n4,t,2,4.5\n';
    const run = rerunWith(tmp, mixed, csv, 'onesubject');
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    expect(JSON.parse(run.stdout).warnings).toContain('The group arm=c has only one subject; its results rest on a single person.');
  });

  it('duplicate subject × condition rows are an error naming the subject, cell and rows', () => {
    const csv = 'id,arm,time,score\n1,c,1,3\n1,c,2,4\n2,c,1,5\n2,c,1,6\n2,c,2,7\n3,t,1,2\n3,t,2,5\n';
    expectInputError(rerunWith(tmp, mixed, csv, 'dup'), "subject '2' has more than one row in time=1 (rows 4 and 5, counting the header as row 1)");
  });

  it('a subject in two between-subjects groups is an error', () => {
    const csv = 'id,arm,time,score\n1,c,1,3\n1,t,2,4\n2,c,1,5\n2,c,2,7\n3,t,1,2\n3,t,2,5\n';
    expectInputError(rerunWith(tmp, mixed, csv, 'twogroups'), "subject '1' appears in two between-subjects groups (arm=c in row 2, arm=t in row 3)");
  });

  it('constant data (zero variance) is an error', () => {
    expectInputError(rerunWith(tmp, { design: 'one-sample', outcome: 'score' }, 'score\n5\n5\n5.0\n', 'constant'), 'column score (outcome) has the same value, 5, in every one of the 3 rows used');
    expectInputError(rerunWith(tmp, twoGroups, 'group,score\na,1\na,1\nb,2\nb,2\n', 'constgroups'), 'score is constant within every group of group, so the error variance is zero');
  });

  it('a paired design needs exactly two conditions', () => {
    const plan = { design: 'paired', outcome: 'score', within: ['time'], subject: 'id' };
    expectInputError(rerunWith(tmp, plan, 'id,time,score\n1,a,1\n1,b,2\n1,c,3\n2,a,2\n2,b,2\n2,c,5\n', 'paired3'), 'design "paired" needs exactly two conditions, but time has 3 levels');
  });

  it('a row with the wrong number of fields is an error', () => {
    expectInputError(rerunWith(tmp, twoGroups, 'group,score\na,1\na,2,7\nb,3\nb,4\n', 'fields'), "row 3 (line 3 of the file) has more fields than the header's 2");
  });

  it('a data file with a header and no rows is an error', () => {
    expectInputError(rerunWith(tmp, twoGroups, 'group,score\n', 'norows'), 'the data file has a header but no data rows');
  });
});

describe('missing values and file formats that are accepted', () => {
  it('empty cells and NA are excluded, counted and reported in warnings', () => {
    const run = rerunWith(tmp, twoGroups, 'group,score\na,1\na,\na,2\nNA,3\nb,NA\nb,4\nb,6\na,3\n', 'missing');
    expect(run.code).toBe(0);
    const result = JSON.parse(run.stdout);
    expect(result.n).toBe(5);
    expect(result.excluded).toBe(3);
    expect(result.warnings[0]).toBe('3 of 8 rows had a missing value (empty cell or NA) in a column the plan uses and were excluded (2 missing in score, 1 missing in group).');
    // Means of the rows kept: a = (1 + 2 + 3) / 3, b = (4 + 6) / 2.
    expect(result.descriptives.map((c: { mean: number }) => c.mean)).toEqual([2, 5]);
  });

  it('a byte-order mark before the header is ignored', () => {
    const run = rerunWith(tmp, twoGroups, '\uFEFFgroup,score\r\na,1\r\na,2\r\nb,3\r\nb,5\r\n', 'bom');
    expect(run.stderr).toBe('');
    expect(JSON.parse(run.stdout).descriptives[1].mean).toBe(4);
  });

  it('a semicolon-delimited file with decimal commas is read, with a warning', () => {
    const run = rerunWith(tmp, twoGroups, 'group;score\na;1,5\na;2,5\nb;3\nb;5,5\n', 'semicolon');
    expect(run.stderr).toBe('');
    const result = JSON.parse(run.stdout);
    expect(result.descriptives.map((c: { mean: number }) => c.mean)).toEqual([2, 4.25]);
    expect(result.warnings).toContain("Column score uses a comma as the decimal separator; values such as '3,5' were read as 3.5.");
  });

  it('quoted fields keep delimiters, quotes and line breaks inside labels', () => {
    const csv = 'group,score\n"Vale, north",1\n"Vale, north",2\n"the ""east"" site",3\n"the ""east""\nsite",9\n"the ""east"" site",5\n';
    const run = rerunWith(tmp, twoGroups, csv, 'quoted');
    expect(run.stderr).toContain('group has 3 levels (Vale, north, the "east" site, the "east"\nsite)'.replace('\n', ' '));
    const ok = rerunWith(tmp, twoGroups, 'group,score\n"Vale, north",1\n"Vale, north",2\n"the ""east"" site",3\n"the ""east"" site",5\n', 'quoted2');
    expect(JSON.parse(ok.stdout).descriptives.map((c: { levels: { group: string } }) => c.levels.group)).toEqual(['Vale, north', 'the "east" site']);
  });
});

describe('invalid plans and files', () => {
  it('an unknown design names the allowed designs', () => {
    expectInputError(rerunWith(tmp, { design: 'manova', outcome: 'score' }, 'score\n1\n2\n', 'design'), 'plan.design must be one of one-sample, independent, paired, anova, regression');
  });

  it('a plan that is not valid JSON is an error', () => {
    expectInputError(rerunWith(tmp, '{"design": "anova", outcome: score}', 'score\n1\n2\n', 'json'), /plan file .*json\.plan\.json is not valid JSON/);
  });

  it('a column the data lack is an error listing the columns the file has', () => {
    const plan = { design: 'anova', outcome: 'scroe', between: ['group'] };
    expectInputError(rerunWith(tmp, plan, 'group,score\na,1\n', 'column'), "column 'scroe' named in plan.outcome is not in the data; the file has columns: 'group', 'score'");
  });

  it('an unknown plan field is an error naming it', () => {
    expectInputError(rerunWith(tmp, { ...oneWay, betwen: ['x'] }, 'group,score\na,1\n', 'field'), 'plan.betwen is not a plan field');
  });

  it('a missing data file or plan file is an error', () => {
    const plan = tmp.file('ok.plan.json', JSON.stringify(twoGroups));
    expectInputError(runCli(['--plan', plan, '--data', `${tmp.dir}/nowhere.csv`]), `data file ${tmp.dir}/nowhere.csv does not exist`);
    expectInputError(runCli(['--plan', `${tmp.dir}/nowhere.json`, '--data', plan]), `plan file ${tmp.dir}/nowhere.json does not exist`);
    expectInputError(runCli(['--plan', plan]), 'missing --data DATA.csv');
  });

  it('--help prints usage and exits 0', () => {
    const run = runCli(['--help']);
    expect(run.code).toBe(0);
    expect(run.stdout).toContain('--plan FILE');
  });
});
