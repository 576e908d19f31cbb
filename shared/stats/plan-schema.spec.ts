import { describe, expect, it } from 'vitest';
import { InputError } from './contract';
import { planProblem, resolvePlan } from './plan-schema';

// Expected messages are the contract's own wording (docs/rerun-contract.md, "The analysis plan").
describe('plan validation', () => {
  const cases: [unknown, string, string][] = [
    [null, 'plan', 'the plan must be a JSON object'],
    [{ design: 'manova', outcome: 'y' }, 'plan.design', 'plan.design must be one of one-sample, independent, paired, anova, regression'],
    [{ design: 'anova', outcome: 'y' }, 'plan.between', 'plan.between or plan.within must name at least one factor column'],
    [{ design: 'anova', outcome: 'y', between: 'g' }, 'plan.between', 'plan.between must be a list of column names'],
    [{ design: 'anova', outcome: 'y', between: ['g'], alpha: 2 }, 'plan.alpha', 'plan.alpha must be between 0 and 1'],
    [{ design: 'anova', outcome: 'y', between: ['g'], betwen: ['h'] }, 'plan.betwen', 'plan.betwen is not a plan field'],
    [{ design: 'anova', outcome: 'y', between: ['g'], comparisons: [{ factor: 'g', method: 'scheffe' }] }, 'plan.comparisons[0].method', 'plan.comparisons[0].method must be one of tukey'],
    [{ design: 'anova', outcome: 'y', between: ['g'], comparisons: [{ factor: 'h', method: 'holm' }] }, 'plan.comparisons[0].factor', "plan.comparisons[0].factor 'h' is not one of the plan's factors (g)"],
    [{ design: 'anova', outcome: 'y', within: ['t'] }, 'plan.subject', 'plan.subject is required when plan.within is given'],
    [{ design: 'paired', outcome: 'y', within: ['t'] }, 'plan.subject', 'plan.subject is required for design "paired"'],
    [{ design: 'independent', outcome: 'y', between: ['a', 'b'] }, 'plan.between', 'plan.between must name exactly one grouping column'],
    [{ design: 'anova', outcome: 'y', between: ['y'] }, 'plan.between', "plan.between names column 'y', which is already used as plan.outcome"],
    [{ design: 'anova', outcome: 3, between: ['g'] }, 'plan.outcome', 'plan.outcome must be a column name'],
    [{ design: 'anova', outcome: 'y', between: [''] }, 'plan.between[0]', 'plan.between[0] must not be empty'],
    [{ design: 'anova', outcome: 'y', between: ['g'], ssType: 1 }, 'plan.ssType', 'plan.ssType must be 2 or 3'],
    [{ design: 'regression', outcome: 'y' }, 'plan.predictors', 'plan.predictors must name at least one numeric predictor'],
    [{ design: 'anova', outcome: 'y', between: ['g'], mu: 3 }, 'plan.mu', 'plan.mu is only used by design "one-sample"'],
    [{ design: 'one-sample', outcome: 'y', sigma: 0 }, 'plan.sigma', 'plan.sigma must be greater than 0'],
  ];
  for (const [plan, field, message] of cases) {
    it(`rejects ${JSON.stringify(plan)} at ${field}`, () => {
      const problem = planProblem(plan);
      expect(problem).toBeInstanceOf(InputError);
      expect(problem!.field).toBe(field);
      expect(problem!.message).toContain(message);
      expect(() => resolvePlan(plan)).toThrow(InputError);
    });
  }

  it('fills in defaults', () => {
    expect(resolvePlan({ design: 'one-sample', outcome: 'y' })).toEqual({
      design: 'one-sample', outcome: 'y', alpha: 0.05, ssType: 3, between: [], within: [], predictors: [], comparisons: [], mu: 0,
    });
    const p = resolvePlan({ design: 'anova', outcome: 'y', between: ['g'], within: ['t'], subject: 'id', ssType: 2, alpha: 0.01 });
    expect(p.ssType).toBe(2);
    expect(p.alpha).toBe(0.01);
    expect(p.mu).toBeUndefined();
  });
});
