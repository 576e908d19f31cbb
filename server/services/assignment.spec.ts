/** The conflict-of-interest rule, expertise matching and the candidate ranking. */
import { describe, expect, it } from 'vitest';
import { conflictReason, expertiseMatches, rankCandidates, type ConflictContext } from './assignment';

const ctx: ConflictContext = {
  submitterId: 'sub', submitterDepartmentId: 'ssa', requestDepartmentId: 'eng', declinedWithConflict: new Set(['old']),
  departmentNames: new Map([['ssa', 'Student Success and Advising'], ['eng', 'English and Writing']]),
};

describe('conflictReason', () => {
  it('bars the submitter, their department, the request department and an earlier conflict decline', () => {
    expect(conflictReason({ id: 'sub', name: 'Dana', departmentId: 'oie' }, ctx)).toMatch(/Dana filed this request/);
    expect(conflictReason({ id: 'r1', name: 'Sam', departmentId: 'ssa' }, ctx)).toMatch(/submitter's department \(Student Success and Advising\)/);
    expect(conflictReason({ id: 'r2', name: 'Lee', departmentId: 'eng' }, ctx)).toMatch(/department the request comes from \(English and Writing\)/);
    expect(conflictReason({ id: 'old', name: 'Kit', departmentId: 'oie' }, ctx)).toMatch(/declined this request earlier/);
  });
  it('lets a reviewer from another department through, and a missing department is not a match', () => {
    expect(conflictReason({ id: 'r3', name: 'Ali', departmentId: 'oie' }, ctx)).toBeNull();
    expect(conflictReason({ id: 'r4', name: 'Bo', departmentId: null }, { ...ctx, submitterDepartmentId: null, requestDepartmentId: null })).toBeNull();
  });
});

describe('expertiseMatches', () => {
  it('accepts design kinds, their labels and free words that name them', () => {
    expect(expertiseMatches(['repeated measures'], 'repeated-measures')).toBe(true);
    expect(expertiseMatches(['between-anova'], 'between-anova')).toBe(true);
    expect(expertiseMatches(['ANOVA'], 'between-anova')).toBe(true);
    expect(expertiseMatches(['Regression'], 'regression')).toBe(true);
  });
  it('rejects other designs, partial words and a request without a design', () => {
    expect(expertiseMatches(['regression'], 'paired')).toBe(false);
    expect(expertiseMatches(['rep'], 'repeated-measures')).toBe(false);
    expect(expertiseMatches(['regression'], null)).toBe(false);
  });
});

describe('rankCandidates', () => {
  const c = (id: string, openCount: number, expertiseMatch: boolean, conflict: string | null = null) => ({ reviewer: { id, name: id, email: `${id}@x.test` }, openCount, expertiseMatch, expertise: [], conflict });
  it('suggests the least-loaded expert without conflict', () => {
    const ranked = rankCandidates([c('a', 0, false), c('b', 3, true), c('c', 1, true), c('d', 0, true, 'same department')]);
    expect(ranked.map((x) => x.reviewer.id)).toEqual(['c', 'b', 'a', 'd']);
    expect(ranked.filter((x) => x.suggested).map((x) => x.reviewer.id)).toEqual(['c']);
  });
  it('falls back to the lowest load when nobody matches, and suggests nobody when all conflict', () => {
    expect(rankCandidates([c('a', 2, false), c('b', 1, false)]).find((x) => x.suggested)?.reviewer.id).toBe('b');
    expect(rankCandidates([c('a', 0, true, 'x')]).some((x) => x.suggested)).toBe(false);
  });
});
