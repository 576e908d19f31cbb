import { describe, expect, it } from 'vitest';
import type { ReviewRequest } from '../models/index';
import { filedEnginePlan, isPlanDraft, mergePlan } from './rerun-plan';

const request = (plan: unknown, reported: unknown = null) => ({ plan, reported }) as unknown as ReviewRequest;
const draft = {
  designKind: 'between-anova', outcome: 'score', between: [{ column: 'group', levels: [] }], within: [], subject: 'sid', predictors: [],
  alpha: 0.05, comparisons: [{ factor: 'group', method: 'holm' }], submitterCorrection: 'holm',
};

describe('the plan a rerun runs', () => {
  it('maps the filing form draft to the engine plan with the reported results', () => {
    expect(isPlanDraft(draft)).toBe(true);
    expect(filedEnginePlan(request(draft, [{ term: 'group', text: 'F(2, 27) = 4.85, p = .016' }, { text: ' ' }]))).toEqual({
      design: 'anova', outcome: 'score', alpha: 0.05, between: ['group'], comparisons: [{ factor: 'group', method: 'holm' }],
      reported: [{ term: 'group', text: 'F(2, 27) = 4.85, p = .016' }],
    });
  });

  it('keeps an engine plan as stored, adding reported results only when it has none', () => {
    const engine = { design: 'independent', outcome: 'y', between: ['g'] };
    expect(isPlanDraft(engine)).toBe(false);
    expect(filedEnginePlan(request(engine, [{ text: 't(8) = 2.1, p = .07' }]))).toEqual({ ...engine, reported: [{ text: 't(8) = 2.1, p = .07' }] });
    const withOwn = { ...engine, reported: [{ text: 'own' }] };
    expect(filedEnginePlan(request(withOwn, [{ text: 'other' }])).reported).toEqual([{ text: 'own' }]);
  });

  it('answers 422 for a missing or incomplete plan', () => {
    expect(() => filedEnginePlan(request(null))).toThrow(expect.objectContaining({ status: 422, code: 'no-plan' }));
    expect(() => filedEnginePlan(request({ ...draft, outcome: null }))).toThrow(expect.objectContaining({ status: 422, fields: { 'plan.outcome': 'Choose the outcome column.' } }));
  });

  it('merges an override (null removes a field) and names the field at fault', () => {
    const base = filedEnginePlan(request(draft));
    expect(mergePlan(base, { comparisons: [{ factor: 'group', method: 'games-howell' }] }).comparisons).toEqual([{ factor: 'group', method: 'games-howell' }]);
    expect(mergePlan(base, { comparisons: null })).not.toHaveProperty('comparisons');
    expect(() => mergePlan(base, { alpha: 2 })).toThrow(expect.objectContaining({ status: 400, fields: { 'planOverride.alpha': expect.stringMatching(/plan\.alpha must be between 0 and 1/) } }));
    // The override removed the factor its comparisons name: the fault lies in the filed comparisons.
    expect(() => mergePlan(base, { between: ['term'] })).toThrow(expect.objectContaining({ fields: { 'plan.comparisons[0].factor': expect.stringMatching(/'group' is not one of the plan's factors \(term\)/) } }));
  });
});
