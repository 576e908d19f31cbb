import { describe, expect, it } from 'vitest';
import type { PlanDraft } from '../../shared/api/workflow';
import type { RerunResult } from '../../shared/stats/contract';
import { checklistEntries, countersignRequired, designKindOf, enginePlanOf, letterheadFrom, planSummary } from './letter-compose';

const result = (levels: Record<string, string>[]): RerunResult => ({
  engine: '1.0.0', design: 'anova', n: 10, excluded: 0, alpha: 0.05, tests: [], warnings: [],
  descriptives: levels.map((l) => ({ levels: l, n: 5, mean: 1, sd: 1, se: 1, ciLower: 0, ciUpper: 2 })),
});

describe('letterheadFrom', () => {
  it('reads the first settings layout (office, single address text)', () => {
    const lh = letterheadFrom('Fallback office', {
      referencePrefix: 'HV',
      letterhead: { institution: 'Harrow Vale Community College', office: 'Office of Institutional Effectiveness', address: 'Founders Hall\n1 Orchard Row', email: 'oie@demo.test' },
    });
    expect(lh).toEqual({
      officeName: 'Office of Institutional Effectiveness', unit: 'Harrow Vale Community College', addressLines: ['Founders Hall', '1 Orchard Row'],
      contactLines: ['oie@demo.test'], logoText: 'HV',
    });
  });

  it('reads the settings form layout (unit, address lines, website) and makes initials when no prefix fits', () => {
    const lh = letterheadFrom('x', { letterhead: { unit: 'Research Office', institution: 'Kestrel Bay Institute', addressLines: ['Dock Road'], email: 'ro@kb.test', phone: '', website: 'kb.test' } });
    expect(lh).toMatchObject({ officeName: 'Research Office', unit: 'Kestrel Bay Institute', addressLines: ['Dock Road'], contactLines: ['ro@kb.test', 'kb.test'], logoText: 'KBI' });
  });

  it('falls back to the office name when no letterhead was ever set', () => {
    expect(letterheadFrom('Office of Planning', {})).toMatchObject({ officeName: 'Office of Planning', unit: '', addressLines: [], contactLines: [] });
  });
});

describe('countersignRequired', () => {
  it('is off unless the setting is exactly true', () => {
    expect(countersignRequired({})).toBe(false);
    expect(countersignRequired(null)).toBe(false);
    expect(countersignRequired({ countersignRequired: 'yes' })).toBe(false);
    expect(countersignRequired({ countersignRequired: true })).toBe(true);
  });
});

describe('plans', () => {
  const draft: PlanDraft = {
    designKind: 'mixed', outcome: 'score', between: [{ column: 'group', levels: ['tutored', 'comparison'] }], within: [{ column: 'midterm', levels: ['1', '2', '3'] }],
    subject: 'student_id', predictors: [], alpha: 0.05, comparisons: [{ factor: 'midterm', method: 'holm' }], submitterCorrection: 'holm',
  };

  it('reads a filing-form draft and an engine plan alike', () => {
    expect(enginePlanOf(draft)).toMatchObject({ design: 'anova', between: ['group'], within: ['midterm'], subject: 'student_id' });
    expect(enginePlanOf({ design: 'paired', outcome: 'essay', within: ['essay_no'], subject: 'student_id' }, [{ text: 't(29) = 2.41, p = .022' }]))
      .toMatchObject({ design: 'paired', reported: [{ text: 't(29) = 2.41, p = .022' }] });
    expect(enginePlanOf({ designKind: null, between: [] })).toBeNull();
    expect(enginePlanOf('nonsense')).toBeNull();
  });

  it('names the design kind of an engine plan', () => {
    expect(designKindOf({ design: 'anova', outcome: 'y', between: ['a'], within: ['b'] })).toBe('mixed');
    expect(designKindOf({ design: 'anova', outcome: 'y', within: ['b'] })).toBe('repeated-measures');
    expect(designKindOf({ design: 'anova', outcome: 'y', between: ['a'] })).toBe('between-anova');
    expect(designKindOf({ design: 'independent', outcome: 'y', between: ['a'] })).toBe('two-independent');
  });

  it('lists levels in the order of the rerun, falling back to the draft, and words the comparisons', () => {
    const plan = enginePlanOf(draft)!;
    const s = planSummary(null, draft, plan, result([{ group: 'comparison', midterm: '1' }, { group: 'tutored', midterm: '1' }]));
    expect(s.designKind).toBe('mixed');
    expect(s.factors).toEqual([
      { name: 'group', kind: 'between', levels: ['comparison', 'tutored'] },
      { name: 'midterm', kind: 'within', levels: ['1'] },
    ]);
    expect(s.comparisons).toEqual(['midterm: Holm']);
    expect(planSummary(null, draft, plan, result([])).factors[0].levels).toEqual(['tutored', 'comparison']);
  });
});

describe('checklistEntries', () => {
  it('keeps decided entries in criterion order with the finding summary', () => {
    const rows = checklistEntries([
      { criterion: 'outliers', verdict: 'met', note: 'none', autoFinding: { summary: 'No standardized residual beyond ±3.' } },
      { criterion: 'sphericity', verdict: null, note: '', autoFinding: null },
      { criterion: 'independence', verdict: 'concern', note: 'two classes', autoFinding: null },
    ]);
    expect(rows).toEqual([
      { criterion: 'independence', verdict: 'concern', reviewerNote: 'two classes', automaticFinding: null },
      { criterion: 'outliers', verdict: 'met', reviewerNote: 'none', automaticFinding: 'No standardized residual beyond ±3.' },
    ]);
  });
});
