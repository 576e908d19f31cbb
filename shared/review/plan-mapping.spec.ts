import { describe, it, expect } from 'vitest';
import { toEnginePlan, planProblems, emptyPlanDraft } from './plan-mapping';
import { planProblem } from '../stats/plan-schema';

describe('plan mapping', () => {
  it('maps a mixed design to an engine anova plan with subject and reported strings', () => {
    const draft = { ...emptyPlanDraft(), designKind: 'mixed' as const, outcome: 'score', subject: 'student', between: [{ column: 'group', levels: [] }], within: [{ column: 'midterm', levels: [] }], comparisons: [{ factor: 'midterm', method: 'holm' as const }] };
    expect(planProblems(draft)).toEqual({});
    const plan = toEnginePlan(draft, [{ text: 'F(2, 98) = 3.9, p = .02' }, { text: ' ' }]);
    expect(plan).toEqual({ design: 'anova', outcome: 'score', alpha: 0.05, between: ['group'], within: ['midterm'], subject: 'student', comparisons: [{ factor: 'midterm', method: 'holm' }], reported: [{ text: 'F(2, 98) = 3.9, p = .02' }] });
    // The engine's own plan validation accepts the mapped plan.
    expect(planProblem(plan)).toBeNull();
  });

  it('names the missing pieces of each design kind', () => {
    expect(planProblems(emptyPlanDraft())).toEqual({ 'plan.designKind': 'Choose the kind of design.' });
    const paired = planProblems({ ...emptyPlanDraft(), designKind: 'paired', outcome: 'y' });
    expect(Object.keys(paired).sort()).toEqual(['plan.subject', 'plan.within']);
    const comp = planProblems({ ...emptyPlanDraft(), designKind: 'between-anova', outcome: 'y', between: [{ column: 'a', levels: [] }], comparisons: [{ factor: 'b', method: 'tukey' }] });
    expect(comp['plan.comparisons.0']).toContain('"b"');
  });

  it('drops the subject for between-only designs and keeps mu/sigma for one sample', () => {
    const p = toEnginePlan({ ...emptyPlanDraft(0.01), designKind: 'one-sample', outcome: 'y', subject: 's', mu: 3, sigma: 1.5 });
    expect(p).toEqual({ design: 'one-sample', outcome: 'y', alpha: 0.01, mu: 3, sigma: 1.5 });
  });
});
