import { describe, expect, it } from 'vitest';
import { resolvePlan } from '../plan-schema';
import { prepareData } from './prepare';
import { parseDelimited } from './raw-table';

const prep = (plan: unknown, csv: string) => prepareData(resolvePlan(plan), parseDelimited(csv));

// Expected values are counted by hand from the small tables written in each test.
describe('prepareData', () => {
  it('orders levels by first appearance, or numerically when every label is a number', () => {
    const d = prep({ design: 'anova', outcome: 'y', between: ['g', 'dose'] }, 'g,dose,y\nb,10,1\na,2,2\nb,2,3\na,10,4\nb,1,5\na,1,6\nb,10,7\na,2,9\n');
    expect(d.between[0].levels).toEqual(['b', 'a']);
    expect(d.between[1].levels).toEqual(['1', '2', '10']);
    expect(Array.from(d.between[1].codes)).toEqual([2, 1, 1, 2, 0, 0, 2, 1]);
  });

  it('drops rows with a missing value listwise, counts them and keeps spreadsheet row numbers', () => {
    const d = prep({ design: 'anova', outcome: 'y', between: ['g'] }, 'g,y\na,1\n,2\na,NA\nb,4\nb, \nb,6\na,7\n');
    expect(d.n).toBe(4);
    expect(d.excluded).toBe(3);
    // Spreadsheet rows: the header is row 1.
    expect(Array.from(d.rowNumbers)).toEqual([2, 5, 7, 8]);
    expect(d.warnings[0]).toContain('3 of 7 rows had a missing value');
    expect(d.warnings[0]).toContain('2 missing in y, 1 missing in g');
    // Centred on the first used value (1): 1, 4, 6, 7 → 0, 3, 5, 6.
    expect(d.outcome.offset).toBe(1);
    expect(Array.from(d.outcome.values)).toEqual([0, 3, 5, 6]);
  });

  it('trims labels so " a" and "a" are one level', () => {
    const d = prep({ design: 'independent', outcome: 'y', between: ['g'] }, 'g,y\na,1\n a ,2\nb,3\nb,5\n');
    expect(d.between[0].levels).toEqual(['a', 'b']);
  });

  it('names the plan field and lists the columns when a column is missing', () => {
    expect(() => prep({ design: 'anova', outcome: 'Y', between: ['g'] }, 'g,y\na,1\n')).toThrow(
      "column 'Y' named in plan.outcome is not in the data (did you mean 'y'? names are case-sensitive); the file has columns: 'g', 'y'",
    );
  });

  it('codes the subject only for designs that use one', () => {
    const d = prep({ design: 'paired', outcome: 'y', within: ['t'], subject: 'id' }, 'id,t,y\n1,pre,1\n1,post,2\n2,pre,3\n2,post,5\n');
    expect(d.subject?.levels).toEqual(['1', '2']);
    expect(d.within[0].levels).toEqual(['pre', 'post']);
  });
});
