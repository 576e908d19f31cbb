/**
 * The interval behind Cohen's d and Hedges' g: the noncentrality values that put the observed t
 * at the 1 − alpha/2 and alpha/2 quantiles of the noncentral t, and Hedges' small-sample factor J.
 * Source: R 4.2.2, uniroot on pt(t, df, ncp) and lgamma, written by test/reference/effect-size/generate-ci.R.
 * Tolerance: 1e-6 relative (the suite's tolerance for statistics).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { hedgesCorrection, ncpInterval } from '../../shared/stats/effect-sizes';

interface Case { t: number; df: number; alpha: number; ncpLower: number; ncpUpper: number; hedgesJ: number }
const fixture = JSON.parse(readFileSync(join(__dirname, 'effect-size', 'ci.json'), 'utf8')) as { tool: string; cases: Case[] };
const close = (actual: number, expected: number) => Math.abs(actual - expected) <= 1e-6 * Math.max(Math.abs(expected), 1e-3);

describe(`noncentrality interval and Hedges J against ${fixture.tool}`, () => {
  for (const c of fixture.cases) {
    it(`t = ${c.t}, df = ${c.df}, alpha = ${c.alpha}`, () => {
      const [lo, hi] = ncpInterval(c.t, c.df, c.alpha);
      // source: R uniroot(function(n) pt(t, df, n) - (1 - alpha/2)) and (... - alpha/2)
      expect(close(lo, c.ncpLower), `lower: expected ${c.ncpLower}, got ${lo}`).toBe(true);
      expect(close(hi, c.ncpUpper), `upper: expected ${c.ncpUpper}, got ${hi}`).toBe(true);
      // source: R exp(lgamma(df/2) - lgamma((df-1)/2)) / sqrt(df/2)
      expect(close(hedgesCorrection(c.df), c.hedgesJ), `J: expected ${c.hedgesJ}, got ${hedgesCorrection(c.df)}`).toBe(true);
    });
  }
});
