/**
 * APA-style text for results: "F(2, 27) = 4.85, p = .016, ηp² = .26".
 * Conventions (APA Publication Manual, 7th ed., section 6.36; common practice):
 * statistics to 2 decimals, p to 3 decimals without a leading zero and
 * "p < .001" below .001, quantities bounded by 1 (η², ω², p) without a leading
 * zero, unbounded ones (d, b, differences) with one, fractional df to at most 2 decimals.
 * Used by the review screen and the signed letter; `ascii: true` avoids Greek
 * letters and superscripts for fonts that lack them.
 */
import type { CoefficientRow, ComparisonMethod, ComparisonRow, TestRow } from '../contract';

/** Formatting options. */
export interface FormatOptions {
  /** Plain ASCII output ("partial eta^2" instead of "ηp²"). Default false. */
  ascii?: boolean;
  /** Confidence level of intervals (default 0.95). */
  level?: number;
}

/** Fixed decimals without "-0.00"; hyphen-minus for negatives so every font can show it. */
export function formatNumber(x: number, decimals = 2): string {
  if (!Number.isFinite(x)) return Number.isNaN(x) ? 'n/a' : x > 0 ? '∞' : '-∞';
  const s = x.toFixed(decimals);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

/** A number in [−1, 1] without its leading zero (".26", "-.04"). */
export function formatBounded(x: number, decimals = 2): string {
  return formatNumber(x, decimals).replace(/^(-?)0\./, '$1.');
}

/** Degrees of freedom: integers as such, fractional ones to at most 2 decimals ("31.42", "31.4"). */
export function formatDf(df: number): string {
  if (Number.isInteger(df)) return String(df);
  return formatNumber(df, 2).replace(/\.?0+$/, '');
}

/** "p = .016", "p < .001", "p > .999". */
export function formatP(p: number): string {
  if (!Number.isFinite(p) || p < 0 || p > 1) return 'p = n/a';
  if (p < 0.001) return 'p < .001';
  if (p >= 0.9995) return 'p > .999';
  return `p = ${formatBounded(p, 3)}`;
}

function effectSizes(row: TestRow, opts: FormatOptions): string[] {
  const out: string[] = [];
  if (row.partialEtaSq !== undefined) out.push(`${opts.ascii ? 'partial eta^2' : 'ηp²'} = ${formatBounded(row.partialEtaSq)}`);
  else if (row.generalizedEtaSq !== undefined) out.push(`${opts.ascii ? 'generalized eta^2' : 'ηG²'} = ${formatBounded(row.generalizedEtaSq)}`);
  if (row.statistic === 't') {
    if (row.dz !== undefined) out.push(`${opts.ascii ? 'd_z' : 'dz'} = ${formatNumber(row.dz)}`);
    else if (row.cohensD !== undefined) out.push(`d = ${formatNumber(row.cohensD)}`);
  }
  return out;
}

/** One test row as APA text: "t(28) = -2.10, p = .045, d = -0.77". */
export function formatTest(row: TestRow, opts: FormatOptions = {}): string {
  let head: string;
  if (row.statistic === 'F') head = `F(${formatDf(row.df1 ?? NaN)}, ${formatDf(row.df2 ?? NaN)})`;
  else if (row.statistic === 't') head = `t(${formatDf(row.df ?? NaN)})`;
  else head = 'z';
  return [`${head} = ${formatNumber(row.value)}`, formatP(row.p), ...effectSizes(row, opts)].join(', ');
}

const METHOD_LABEL: Record<ComparisonMethod, string> = {
  tukey: 'Tukey HSD',
  'games-howell': 'Games–Howell',
  bonferroni: 'Bonferroni',
  holm: 'Holm',
  bh: 'Benjamini–Hochberg',
};

function ci(lower: number, upper: number, opts: FormatOptions): string {
  const level = Math.round((opts.level ?? 0.95) * 1000) / 10;
  return `${level}% CI [${formatNumber(lower)}, ${formatNumber(upper)}]`;
}

/** A pairwise comparison: "A vs B: difference = 1.23, 95% CI [0.45, 2.01], t(27) = 3.10, adjusted p = .012 (Holm)". */
export function formatComparison(row: ComparisonRow, opts: FormatOptions = {}): string {
  const adjusted = formatP(row.pAdjusted).replace(/^p/, 'adjusted p');
  return (
    `${row.a} vs ${row.b}: difference = ${formatNumber(row.estimate)}, ${ci(row.ciLower, row.ciUpper, opts)}, ` +
    `t(${formatDf(row.df)}) = ${formatNumber(row.statistic)}, ${adjusted} (${METHOD_LABEL[row.method]})`
  );
}

/** A regression coefficient: "b = 1.23, SE = 0.45, t(27) = 2.73, p = .011, 95% CI [0.31, 2.15]". */
export function formatCoefficient(row: CoefficientRow, opts: FormatOptions = {}): string {
  return (
    `b = ${formatNumber(row.estimate)}, SE = ${formatNumber(row.se)}, t(${formatDf(row.df)}) = ${formatNumber(row.value)}, ` +
    `${formatP(row.p)}, ${ci(row.ciLower, row.ciUpper, opts)}`
  );
}
