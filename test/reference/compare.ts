/**
 * Compares an engine result with the values R computed for the same input
 * (fixtures written by test/reference/r/generate.R). Rows are matched by their
 * identifying fields, then every number the fixture holds is compared:
 * statistics to 1e-6 relative, probabilities to 1e-6 absolute. Mismatches are
 * collected rather than thrown one at a time, so a failing case lists all of
 * them with the input name, field, expected, actual, difference and tolerance.
 */

/** Relative tolerance for statistics, sums of squares, df, estimates and effect sizes. */
export const STAT_REL_TOL = 1e-6;
/** Absolute tolerance for p-values and power. */
export const P_ABS_TOL = 1e-6;

/** Tolerance between the engine's Mauchly p and R's, whose second-order term differs (see Comparison.object). */
export const MAUCHLY_R_P_TOL = 1e-4;

/** Fields holding a probability (compared absolutely). */
const PROBABILITY_FIELDS = new Set(['p', 'pAdjusted', 'power']);
/** Fixture fields that describe a value rather than state one the engine must reproduce. */
const INFORMATIONAL_FIELDS = new Set(['source', 'exact', 'pFirstOrder', 'pTermDf']);

/** One value the engine got wrong or left out. */
export interface Mismatch {
  input: string;
  field: string;
  expected: unknown;
  actual: unknown;
  difference?: number;
  tolerance?: string;
  source?: string;
}

/** Collects mismatches for one fixture. */
export class Comparison {
  readonly mismatches: Mismatch[] = [];
  /** Count of individual values compared, so a case that checks nothing is caught. */
  checked = 0;

  constructor(readonly input: string) {}

  /** Records a value that was expected but is absent from the engine's result. */
  missing(field: string, expected: unknown, source?: string): void {
    this.mismatches.push({ input: this.input, field, expected, actual: undefined, source });
  }

  /** Compares one number: relative for statistics, absolute for probabilities (by field name). */
  number(field: string, expected: number, actual: unknown, source?: string): void {
    this.checked++;
    const key = field.slice(field.lastIndexOf('.') + 1);
    const probability = PROBABILITY_FIELDS.has(key);
    if (typeof actual !== 'number' || !Number.isFinite(actual)) {
      this.mismatches.push({ input: this.input, field, expected, actual, source,
        tolerance: probability ? `${P_ABS_TOL} absolute` : `${STAT_REL_TOL} relative` });
      return;
    }
    const difference = actual - expected;
    const ok = probability
      ? Math.abs(difference) <= P_ABS_TOL
      // A floor of 1e-300 keeps an exact zero comparable without loosening anything else.
      : Math.abs(difference) <= STAT_REL_TOL * Math.max(Math.abs(expected), 1e-300);
    if (!ok) {
      this.mismatches.push({ input: this.input, field, expected, actual, difference, source,
        tolerance: probability ? `${P_ABS_TOL} absolute` : `${STAT_REL_TOL} relative (${(STAT_REL_TOL * Math.abs(expected)).toExponential(2)})` });
    }
  }

  /**
   * Compares every field of an expected object with the actual one: numbers by
   * tolerance, strings and booleans exactly, nested objects recursively, null
   * as "null or absent".
   */
  object(path: string, expected: Record<string, unknown>, actual: unknown, source?: string): void {
    const rowSource = typeof expected['source'] === 'string' ? (expected['source'] as string) : source;
    if (actual === null || typeof actual !== 'object') {
      this.missing(path, expected, rowSource);
      return;
    }
    const got = actual as Record<string, unknown>;
    if (typeof expected['pTermDf'] === 'number' && typeof expected['p'] === 'number') {
      // Mauchly's p: R's mauchly.test puts 3 × (number of within cells) where Anderson's
      // second-order series (Anderson 1958, ch. 10, the moment series of -2ρ log W) has
      // 3 × (term df); the two differ only for terms with 3 or more df. The engine follows
      // the published series, checked at full tolerance against pTermDf (the same series,
      // computed in R by formula); R's own p must agree to 1e-4, a tolerance named here
      // for this one field.
      const rP = expected['p'];
      const gotP = got['p'];
      this.checked++;
      if (typeof gotP !== 'number' || Math.abs(gotP - rP) > MAUCHLY_R_P_TOL) {
        this.mismatches.push({ input: this.input, field: `${path}.p (R mauchly.test)`, expected: rP, actual: gotP, tolerance: `${MAUCHLY_R_P_TOL} absolute`, source: rowSource });
      }
      expected = { ...expected, p: expected['pTermDf'] };
    }
    for (const [key, value] of Object.entries(expected)) {
      if (INFORMATIONAL_FIELDS.has(key)) continue;
      const field = `${path}.${key}`;
      if (value === null) {
        this.checked++;
        if (got[key] !== null && got[key] !== undefined) this.mismatches.push({ input: this.input, field, expected: null, actual: got[key], source: rowSource });
      } else if (typeof value === 'number') {
        this.number(field, value, got[key], rowSource);
      } else if (Array.isArray(value)) {
        this.checked++;
        if (JSON.stringify(value) !== JSON.stringify(got[key])) this.mismatches.push({ input: this.input, field, expected: value, actual: got[key], source: rowSource });
      } else if (typeof value === 'object') {
        this.object(field, value as Record<string, unknown>, got[key], rowSource);
      } else {
        this.checked++;
        if (got[key] !== value) this.mismatches.push({ input: this.input, field, expected: value, actual: got[key], source: rowSource });
      }
    }
  }

  /**
   * Matches each expected row to the actual row with the same key and compares
   * it. `adapt` may rewrite the expected row for the matched actual row (for
   * example when a pair is listed the other way round).
   */
  rows<T extends Record<string, unknown>>(
    section: string,
    expected: T[],
    actual: readonly unknown[] | undefined,
    key: (row: Record<string, unknown>) => string,
    adapt: (exp: T, act: Record<string, unknown>) => T = (e) => e,
  ): void {
    const pool = (actual ?? []) as Record<string, unknown>[];
    for (const exp of expected) {
      const k = key(exp);
      const match = pool.find((row) => key(row) === k);
      const label = `${section}[${k}]`;
      if (!match) {
        this.missing(label, `row ${k}`, typeof exp['source'] === 'string' ? (exp['source'] as string) : undefined);
        continue;
      }
      this.object(label, adapt(exp, match), match);
    }
  }

  /** A readable report of every mismatch, one per line. */
  report(): string {
    return this.mismatches
      .map((m) => {
        const parts = [`input ${m.input}`, `field ${m.field}`, `expected ${fmt(m.expected)}`, `actual ${fmt(m.actual)}`];
        if (m.difference !== undefined) parts.push(`difference ${m.difference.toExponential(3)}`);
        if (m.tolerance) parts.push(`tolerance ${m.tolerance}`);
        if (m.source) parts.push(`source R ${m.source}`);
        return parts.join('; ');
      })
      .join('\n');
  }
}

function fmt(v: unknown): string {
  if (v === undefined) return '(missing)';
  if (typeof v === 'number') return String(v);
  return JSON.stringify(v);
}

/** Key of an unordered pair, so "a vs b" and "b vs a" meet. */
export function pairKey(factor: unknown, method: unknown, a: unknown, b: unknown): string {
  const [x, y] = [String(a), String(b)].sort();
  return `${String(factor)} ${String(method)} ${x}|${y}`;
}

/**
 * Rewrites an expected comparison for an actual row listed the other way
 * round (b − a instead of a − b): estimate, statistic and interval change sign.
 */
export function orientPair<T extends Record<string, unknown>>(exp: T, act: Record<string, unknown>): T {
  if (act['a'] === exp['a']) return exp;
  const flip = (v: unknown): unknown => (typeof v === 'number' ? -v : v);
  return { ...exp, a: exp['b'], b: exp['a'], estimate: flip(exp['estimate']), statistic: flip(exp['statistic']),
    ciLower: flip(exp['ciUpper']), ciUpper: flip(exp['ciLower']) };
}
