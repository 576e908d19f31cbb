import { describe, expect, it } from 'vitest';
import { InputError } from './contract';
import { rerunFromText, runPlan } from './rerun';
import { parseDelimited } from './data/raw-table';
import { ENGINE_VERSION } from './version';

// Means and counts below are hand-computed from the four-row tables in each test.
describe('runPlan / rerunFromText', () => {
  const csv = 'group,score\na,1\na,3\nb,4\nb,8\n';
  const plan = { design: 'independent', outcome: 'score', between: ['group'] };

  it('returns one result with engine version, counts, timings and the family output', () => {
    const r = rerunFromText(plan, csv);
    expect(r.engine).toBe(ENGINE_VERSION);
    expect(r.design).toBe('independent');
    expect(r.n).toBe(4);
    expect(r.excluded).toBe(0);
    expect(r.alpha).toBe(0.05);
    expect(r.descriptives.map((c) => c.mean)).toEqual([2, 6]);
    expect(r.tests.map((t) => t.variant)).toEqual(['student', 'welch']);
    expect(r.timings!.parseMs).toBeGreaterThanOrEqual(0);
    expect(r.timings!.computeMs).toBeGreaterThan(0);
    expect(Array.isArray(r.warnings)).toBe(true);
  });

  it('reports progress from 0 to 1 in order', () => {
    const seen: [number, string][] = [];
    runPlan(plan, parseDelimited(csv), { onProgress: (f, stage) => seen.push([f, stage]) });
    expect(seen[0]).toEqual([0, 'validate']);
    expect(seen[seen.length - 1]).toEqual([1, 'done']);
    for (let i = 1; i < seen.length; i++) expect(seen[i][0]).toBeGreaterThan(seen[i - 1][0]);
  });

  it('throws InputError naming the plan field', () => {
    try {
      rerunFromText({ ...plan, design: 'anova2' }, csv);
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).field).toBe('plan.design');
    }
  });

  it('adds the rows dropped at preparation to the subjects a within family drops', () => {
    // Subject 3 lacks "post" (dropped by the family); one row has a missing outcome (dropped at preparation).
    const r = rerunFromText({ design: 'paired', outcome: 'y', within: ['t'], subject: 'id' }, 'id,t,y\n1,pre,1\n1,post,2\n2,pre,2\n2,post,5\n3,pre,4\n4,pre,3\n4,post,NA\n5,pre,1\n5,post,1.5\n');
    expect(r.excluded).toBe(1 + 2);
    expect(r.warnings[0]).toContain('1 of 9 rows had a missing value');
  });
});
