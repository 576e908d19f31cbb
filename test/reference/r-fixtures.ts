/**
 * Loads the R reference fixtures (test/reference/fixtures/*.json, written by
 * test/reference/r/generate.R), reruns each through the engine's front door,
 * and compares one section of the result at a time.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect } from 'vitest';
import type { RerunResult } from '../../shared/stats/contract';
import { parseDelimited } from '../../shared/stats/data/raw-table';
import { runPlan } from '../../shared/stats/rerun';
import { Comparison, orientPair, pairKey } from './compare';

/** Folder of the R fixtures. */
export const FIXTURE_DIR = join(__dirname, 'fixtures');

type Row = Record<string, unknown>;

/** One fixture: input data, plan, R's values and how they were produced. */
export interface RFixture {
  name: string;
  description: string;
  provenance: { r: string; packages: Record<string, string>; seed: number; calls: string[] };
  plan: Row;
  csv: string;
  expected: {
    n?: number;
    subjects?: number;
    excluded?: number;
    descriptives?: Row[];
    tests?: Row[];
    residual?: Row;
    assumptions?: Row;
    nonparametric?: Row[];
    comparisons?: Row[];
    coefficients?: Row[];
    rSquared?: number;
    adjRSquared?: number;
    sigma?: number;
    simpleEffects?: Row[];
    power?: Row[];
  };
}

/** Names of all fixture files (without .json). */
export function fixtureNames(): string[] {
  return readdirSync(FIXTURE_DIR).filter((f) => f.endsWith('.json')).map((f) => f.slice(0, -5)).sort();
}

/** Reads one fixture. */
export function loadFixture(name: string): RFixture {
  return JSON.parse(readFileSync(join(FIXTURE_DIR, `${name}.json`), 'utf8')) as RFixture;
}

const results = new Map<string, RerunResult>();

/** The engine's result for a fixture, computed once per test file. */
export function rerunFixture(fx: RFixture): RerunResult {
  let r = results.get(fx.name);
  if (!r) {
    r = runPlan(fx.plan, parseDelimited(fx.csv));
    results.set(fx.name, r);
  }
  return r;
}

/** Fails with the full mismatch report; also fails if nothing was compared. */
export function expectAgreement(c: Comparison): void {
  expect(c.checked, `input ${c.input}: no values compared`).toBeGreaterThan(0);
  expect(c.mismatches.length, `\n${c.report()}\n`).toBe(0);
}

const testKey = (r: Row): string => `${String(r['term'])} ${String(r['statistic'])}${r['variant'] ? ` ${String(r['variant'])}` : ''}`;

/** Runs `check` on a fresh Comparison for the fixture and asserts agreement. */
function section(fx: RFixture, check: (c: Comparison, r: RerunResult) => void): void {
  const c = new Comparison(fx.name);
  check(c, rerunFixture(fx));
  expectAgreement(c);
}

/** Test rows matched by term, statistic and variant. */
export function checkTests(fx: RFixture): void {
  section(fx, (c, r) => c.rows('tests', fx.expected.tests ?? [], r.tests, testKey));
}

/** Counts: rows used, subjects used and excluded subjects. */
export function checkCounts(fx: RFixture): void {
  section(fx, (c, r) => {
    const got = r as unknown as Row;
    for (const k of ['n', 'subjects', 'excluded'] as const) {
      const v = fx.expected[k];
      if (v !== undefined) c.number(k, v, got[k]);
    }
  });
}

/** Cell n, mean and SD matched by factor levels. */
export function checkDescriptives(fx: RFixture): void {
  section(fx, (c, r) => c.rows('descriptives', fx.expected.descriptives ?? [], r.descriptives, (row) => JSON.stringify(row['levels'])));
}

/** Residual row of a between-subjects ANOVA. */
export function checkResidual(fx: RFixture): void {
  section(fx, (c, r) => c.object('residual', fx.expected.residual ?? {}, r.residual));
}

/** Levene, Brown–Forsythe and Shapiro–Wilk. */
export function checkAssumptions(fx: RFixture): void {
  section(fx, (c, r) => c.object('assumptions', fx.expected.assumptions ?? {}, r.assumptions));
}

/** Rank-based tests matched by term and method. */
export function checkNonparametric(fx: RFixture): void {
  section(fx, (c, r) => c.rows('nonparametric', fx.expected.nonparametric ?? [], r.nonparametric, (row) => `${String(row['term'])} ${String(row['method'])}`));
}

/** Pairwise comparisons matched by factor, method and unordered pair. */
export function checkComparisons(fx: RFixture): void {
  section(fx, (c, r) => c.rows('comparisons', fx.expected.comparisons ?? [], r.comparisons,
    (row) => pairKey(row['factor'], row['method'], row['a'], row['b']), orientPair));
}

/** Regression coefficients (by term) and fit statistics. */
export function checkRegression(fx: RFixture): void {
  section(fx, (c, r) => {
    c.rows('coefficients', fx.expected.coefficients ?? [], r.coefficients, (row) => String(row['term']));
    for (const k of ['rSquared', 'adjRSquared', 'sigma'] as const) {
      const v = fx.expected[k];
      if (v !== undefined) c.number(k, v, r[k], 'summary(lm)');
    }
  });
}

/** Simple effects matched by factor and conditioning level. */
export function checkSimpleEffects(fx: RFixture): void {
  section(fx, (c, r) => c.rows('simpleEffects', fx.expected.simpleEffects ?? [], r.simpleEffects,
    (row) => {
      const at = row['at'] as Row | undefined;
      return `${String(row['factor'])} at ${String(at?.['factor'])}=${String(at?.['level'])}`;
    }));
}

/**
 * Power rows matched by term. The observed effect is compared in absolute
 * value: its sign only records which group was listed first and does not
 * enter power.
 */
export function checkPower(fx: RFixture): void {
  section(fx, (c, r) => c.rows('power', fx.expected.power ?? [], r.power, (row) => String(row['term']),
    (exp, act) => (typeof act['observed'] === 'number' && typeof exp['observed'] === 'number'
      ? { ...exp, observed: Math.sign(act['observed']) * Math.abs(exp['observed']) }
      : exp)));
}
