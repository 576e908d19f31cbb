/** Parsing of APA-style reporting strings (our own rules; no numeric reference needed). */
import { describe, expect, it } from 'vitest';
import { parseReported } from './parse';

const ok = (text: string) => {
  const r = parseReported(text);
  if (!r.ok) throw new Error(r.message);
  return r.report;
};

describe('parseReported', () => {
  it('F with two df and p', () => {
    expect(ok('F(2, 27) = 4.85, p = .016')).toEqual({
      statistic: 'F', df1: { value: 2, decimals: 0 }, df2: { value: 27, decimals: 0 }, value: { value: 4.85, decimals: 2 }, p: { op: '=', value: 0.016, decimals: 3 },
    });
  });
  it('t with negative value, "<" p, unicode minus', () => {
    expect(ok('t(28) = −2.10, p < .05')).toMatchObject({ statistic: 't', df: { value: 28 }, value: { value: -2.1, decimals: 2 }, p: { op: '<', value: 0.05 } });
  });
  it('fractional Welch df', () => expect(ok('t(31.4) = 2.2, p = .035').df).toEqual({ value: 31.4, decimals: 1 }));
  it('chi-square spellings', () => {
    for (const s of ['χ²(3) = 7.9, p = .048', 'chi2(3)=7.9', 'chi^2(3) = 7.9', 'X2(3, N = 120) = 7.9', 'chi-square(3) = 7.9']) {
      expect(ok(s), s).toMatchObject({ statistic: 'chi2', df: { value: 3 }, value: { value: 7.9, decimals: 1 } });
    }
  });
  it('z without df', () => expect(ok('z = 1.96, p = .05')).toMatchObject({ statistic: 'z', value: { value: 1.96 }, p: { value: 0.05, decimals: 2 } }));
  it('p alone', () => expect(ok('p < .001')).toEqual({ p: { op: '<', value: 0.001, decimals: 3 } }));
  it('comma decimals with semicolon df separator', () => {
    expect(ok('F(2; 27) = 4,85; p = 0,016')).toMatchObject({ df1: { value: 2 }, df2: { value: 27 }, value: { value: 4.85, decimals: 2 }, p: { value: 0.016, decimals: 3 } });
  });
  it('"ns" and "n.s." and spaces', () => {
    expect(ok('F ( 1 , 38 ) = 0.2 , ns').ns).toBe(true);
    expect(ok('t(19) = 1.1, n.s.').ns).toBe(true);
  });
  it('"≤" reads as "<"', () => expect(ok('t(9) = 3.2, p ≤ .01').p?.op).toBe('<'));
  it('bad input gets a specific message', () => {
    const msg = (s: string) => {
      const r = parseReported(s);
      return r.ok ? '' : r.message;
    };
    expect(msg('')).toMatch(/empty/);
    expect(msg('F(2) = 3.1')).toMatch(/two degrees of freedom/);
    expect(msg('t = 2.1')).toMatch(/degrees of freedom/);
    expect(msg('t(x) = 2.1')).toMatch(/could not read the degrees of freedom/);
    expect(msg('t(10) = 2.1, p = 1.5')).toMatch(/between 0 and 1/);
    expect(msg('the groups differed')).toMatch(/no statistic/);
  });
});
