import { describe, expect, it } from 'vitest';
import type { AnalysisPlan } from '../../shared/stats/contract';
import { independenceFlags, subjectColumn } from './independence';

const table = (header: string[], rows: string[][]) => ({ header, columns: header.map((_, j) => rows.map((r) => r[j]!)) });

describe('independence flags', () => {
  const between: AnalysisPlan = { design: 'independent', outcome: 'score', between: ['group'] };

  it('says nothing for clean between-subjects data', () => {
    const t = table(['student_id', 'group', 'score'], [['S1', 'a', '1'], ['S2', 'a', '2'], ['S3', 'b', '3']]);
    expect(independenceFlags(t, between)).toEqual([]);
  });

  it('flags a subject in two between-groups and repeated ids in a between-only design', () => {
    const t = table(['student_id', 'group', 'score'], [['S1', 'a', '1'], ['S1', 'b', '2'], ['S3', 'b', '3'], ['S4', 'a', '4'], ['S4', 'a', '5']]);
    const flags = independenceFlags(t, between);
    expect(flags).toHaveLength(2);
    expect(flags[0]).toMatch(/1 subject id\(s\).*'group'.*S1 in a and b/);
    expect(flags[1]).toMatch(/2 subject id\(s\).*S1 ×2, S4 ×2/);
  });

  it('accepts repeated ids when the design has a within factor, but still flags group crossing', () => {
    const mixed: AnalysisPlan = { design: 'anova', outcome: 'score', between: ['group'], within: ['time'], subject: 'pid' };
    const t = table(['pid', 'group', 'time', 'score'], [['P1', 'a', '1', '1'], ['P1', 'a', '2', '2'], ['P2', 'b', '1', '3'], ['P2', 'a', '2', '4']]);
    const flags = independenceFlags(t, mixed);
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatch(/P2 in b and a/);
  });

  it('uses the draft subject column, else an obvious id column, else none', () => {
    const t = table(['code', 'participant_id', 'score'], [['x', 'p', '1']]);
    expect(subjectColumn(t, between, 'code')).toBe('code');
    expect(subjectColumn(t, between, null)).toBe('participant_id');
    expect(subjectColumn(table(['g', 'score'], [['a', '1']]), between, null)).toBeNull();
  });
});
