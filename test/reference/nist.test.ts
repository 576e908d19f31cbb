/**
 * NIST Statistical Reference Datasets (StRD), https://www.itl.nist.gov/div898/strd/:
 * all 11 one-way ANOVA sets and the Norris, Longley and Wampler1 linear
 * regression sets, with NIST's certified values (computed by NIST in multiple
 * precision, printed to 15 significant digits), copied unchanged into test/reference/nist/.
 *
 * Each dataset goes through the whole rerun pipeline (runPlan): the CSV text
 * is parsed, the plan resolved, the data prepared with exact decimal
 * centring, and the design's family dispatched, exactly as a rerun does. Accuracy is measured as the log relative
 * error LRE = −log10(|x − c| / |c|) (−log10|x| when c = 0), the measure NIST
 * recommends. Required: ANOVA SS, MS, df, F, R² and residual SD ≥ 12 digits;
 * regression estimates, their SDs, residual SD and R² ≥ 9 digits.
 *
 * Wampler1's polynomial y = B0 + B1 x + … + B5 x^5 is formed before ingestion:
 * x^2 … x^5 are computed from the CSV's integer x as exact integers (BigInt)
 * and written as extra text columns, so the design enters exactly.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { RerunResult } from '../../shared/stats/contract';
import { parseDelimited } from '../../shared/stats/data/raw-table';
import { runPlan } from '../../shared/stats/rerun';

const NIST = join(__dirname, 'nist');

interface Certified {
  printed: string;
  value: number | null;
}

/** Log relative error of x against certified c (NIST's accuracy measure); 15+ means agreement to the printed digits. */
function lre(x: number, c: number): number {
  if (x === c) return Infinity;
  if (c === 0) return -Math.log10(Math.abs(x));
  return -Math.log10(Math.abs(x - c) / Math.abs(c));
}

const achieved: { set: string; quantity: string; lre: number }[] = [];

/** Checks one quantity against its certified value at `digits` and records the LRE. */
function expectLre(set: string, quantity: string, x: number | undefined, c: number, digits: number): void {
  const value = lre(x as number, c);
  achieved.push({ set, quantity, lre: value });
  expect(value, `${set} ${quantity}: got ${x}, certified ${c}, LRE ${value.toFixed(2)} < ${digits}`).toBeGreaterThanOrEqual(digits);
}

/** Runs a plan on CSV text through the engine's front door. */
function rerun(plan: object, csv: string): RerunResult {
  return runPlan(plan, parseDelimited(csv));
}

const anovaCertified = JSON.parse(readFileSync(join(NIST, 'anova/certified.json'), 'utf8')).datasets as Record<string, any>;
const regressionCertified = JSON.parse(readFileSync(join(NIST, 'regression/certified.json'), 'utf8')).datasets as Record<string, any>;

describe('NIST StRD one-way ANOVA (certified values, LRE ≥ 12)', () => {
  for (const [name, cert] of Object.entries(anovaCertified)) {
    it(name, () => {
      const csv = readFileSync(join(NIST, 'anova', cert.file), 'utf8');
      const r = rerun({ design: 'anova', outcome: 'y', between: ['group'] }, csv);
      const between = r.tests.find((t) => t.term === 'group' && t.variant === undefined)!;
      const bt = cert.betweenTreatment;
      const wt = cert.withinTreatment;
      expect(r.n).toBe(cert.observations);
      expect(between.df1).toBe(bt.df.value);
      expect(r.residual!.df).toBe(wt.df.value);
      expectLre(name, 'between SS', between.ss, bt.ss.value, 12);
      expectLre(name, 'between MS', between.ms, bt.ms.value, 12);
      expectLre(name, 'within SS', r.residual!.ss, wt.ss.value, 12);
      expectLre(name, 'within MS', r.residual!.ms, wt.ms.value, 12);
      expectLre(name, 'F', between.value, cert.fStatistic.value, 12);
      // R² of a one-way model is its eta squared.
      expectLre(name, 'R²', between.etaSq, cert.rSquared.value, 12);
      expectLre(name, 'residual SD', Math.sqrt(r.residual!.ms), cert.residualStandardDeviation.value, 12);
    });
  }
});

/** Builds the CSV text for a regression set; Wampler1 gains exact x^2 … x^5 columns. */
function regressionCsv(name: string, file: string): { csv: string; predictors: string[] } {
  const text = readFileSync(join(NIST, 'regression', file), 'utf8').trim();
  const [header, ...lines] = text.split(/\r?\n/);
  const cols = header.split(',');
  if (name !== 'Wampler1') return { csv: text, predictors: cols.slice(1) };
  const powers = ['x2', 'x3', 'x4', 'x5'];
  const rows = lines.map((line) => {
    const [y, x] = line.split(',');
    const bx = BigInt(x);
    return [y, x, ...[2n, 3n, 4n, 5n].map((k) => (bx ** k).toString())].join(',');
  });
  return { csv: [['y', 'x', ...powers].join(','), ...rows].join('\n'), predictors: ['x', ...powers] };
}

describe('NIST StRD linear regression (certified values, LRE ≥ 9)', () => {
  for (const [name, cert] of Object.entries(regressionCertified)) {
    it(name, () => {
      const { csv, predictors } = regressionCsv(name, cert.file);
      const r = rerun({ design: 'regression', outcome: 'y', predictors }, csv);
      const params = cert.parameters as { name: string; estimate: Certified; standardDeviation: Certified }[];
      expect(r.coefficients!.length).toBe(params.length);
      params.forEach((p, k) => {
        expectLre(name, `${p.name} estimate`, r.coefficients![k].estimate, p.estimate.value!, 9);
        expectLre(name, `${p.name} SD`, r.coefficients![k].se, p.standardDeviation.value!, 9);
      });
      expectLre(name, 'residual SD', r.sigma, cert.residualStandardDeviation.value, 9);
      expectLre(name, 'R²', r.rSquared, cert.rSquared.value, 9);
      const model = r.tests.find((t) => t.term === 'model')!;
      expect(model.df1).toBe(cert.anova.regression.df.value);
      expect(r.residual!.df).toBe(cert.anova.residual.df.value);
      expectLre(name, 'regression SS', model.ss, cert.anova.regression.ss.value, 9);
      expectLre(name, 'residual SS', r.residual!.ss, cert.anova.residual.ss.value, 9);
      if (cert.anova.regression.f.value === null) {
        // NIST prints "Infinity" for the exact fit; the engine reports F = Infinity with p = 0.
        expect(model.value).toBe(Infinity);
        expect(model.p).toBe(0);
      } else {
        expectLre(name, 'F', model.value, cert.anova.regression.f.value, 9);
      }
    });
  }
});

afterAll(() => {
  const bySet = new Map<string, number>();
  for (const a of achieved) bySet.set(a.set, Math.min(bySet.get(a.set) ?? Infinity, a.lre));
  const line = [...bySet].map(([s, v]) => `${s} ${Number.isFinite(v) ? v.toFixed(1) : 'exact'}`).join(', ');
  console.log(`NIST minimum LRE per dataset: ${line}`);
});
