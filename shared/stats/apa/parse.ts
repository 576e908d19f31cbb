/**
 * Parsing of reported results as submitters type them: "F(2, 27) = 4.85, p = .016",
 * "t(31.4) = 2.2, p = .035", "χ²(3) = 7.9", "z = 1.96, p = .05", "p < .001", "ns".
 * Accepts unicode minus and dashes, comma decimal separators (with ";" between
 * df: "F(2; 27) = 4,85"), "chi2", "chi^2", "X2", "χ2", extra spaces, and
 * "(3, N = 120)" after chi-square. The number of printed decimals is kept, since
 * the reconciliation derives its rounding intervals from it.
 */

/** Kinds of reported statistic. */
export type ReportedStatistic = 't' | 'z' | 'F' | 'chi2';

/** A number as printed: value and count of decimals after the separator. */
export interface PrintedNumber {
  value: number;
  decimals: number;
}

/** A reported p: comparison operator and printed value. */
export interface ReportedP extends PrintedNumber {
  op: '=' | '<' | '>';
}

/** The parts recognised in a reporting string. */
export interface ParsedReport {
  statistic?: ReportedStatistic;
  /** df for t (may be fractional) and chi-square. */
  df?: PrintedNumber;
  df1?: PrintedNumber;
  df2?: PrintedNumber;
  value?: PrintedNumber;
  p?: ReportedP;
  /** "ns" / "n.s." was written instead of a p value. */
  ns?: boolean;
}

/** Result of {@link parseReported}: the parts, or a message saying what could not be read. */
export type ParseOutcome = { ok: true; report: ParsedReport } | { ok: false; message: string };

const NUM = String.raw`[-+]?\s*(?:\d+(?:[.,]\d+)?|[.,]\d+)`;
const STAT_RE = new RegExp(
  String.raw`(?:^|[^a-z])(chi\s*-?\s*squared?|chi\s*\^?\s*2|χ\s*\^?\s*2|χ|x\s*\^?\s*2|t|f|z)\s*(?:\(([^)]*)\))?\s*(=|<|>)\s*(${NUM})`,
  'i',
);
const P_RE = new RegExp(String.raw`(?:^|[^a-z])p\s*(<=|>=|≤|≥|=|<|>)\s*(${NUM})`, 'i');
const NS_RE = /(?:^|[^a-z])n\.?\s?s\.?(?![a-z])/i;

/** Reads a printed number, treating "," as a decimal separator. */
export function readPrinted(raw: string): PrintedNumber | undefined {
  const s = raw.replace(/\s+/g, '').replace(',', '.');
  if (!/^[-+]?(\d+(\.\d+)?|\.\d+)$/.test(s)) return undefined;
  const dot = s.indexOf('.');
  return { value: Number(s), decimals: dot < 0 ? 0 : s.length - dot - 1 };
}

/** Canonical text: NFKC (so ² becomes 2), unicode minus and dashes to "-". */
function normalise(text: string): string {
  return text.normalize('NFKC').replace(/[\u2212\u2012\u2013\u2014\uFE63\uFF0D]/g, '-');
}

function statisticOf(word: string): ReportedStatistic {
  const w = word.toLowerCase().replace(/\s+/g, '');
  if (w === 't') return 't';
  if (w === 'z') return 'z';
  if (w === 'f') return 'F';
  return 'chi2';
}

/** Splits "2, 27", "2; 27", "2,27" or "31,4" (t) into df numbers. */
function readDfs(inside: string, statistic: ReportedStatistic): PrintedNumber[] | string {
  const cleaned = inside.replace(/\bn\s*=\s*\d+/i, '').replace(/[,;]\s*$/, '').trim();
  let parts: string[];
  if (cleaned.includes(';')) parts = cleaned.split(';');
  else if (statistic === 'F') parts = cleaned.split(/\s*,\s*/);
  else parts = [cleaned.replace(/\s*,\s*$/, '')];
  const dfs = parts.map((p) => readPrinted(p.trim()));
  if (dfs.some((d) => d === undefined || !(d.value > 0))) return `could not read the degrees of freedom "(${inside})"`;
  return dfs as PrintedNumber[];
}

/** Parses one reporting string; never throws. */
export function parseReported(text: string): ParseOutcome {
  if (typeof text !== 'string' || text.trim() === '') return { ok: false, message: 'the reported result is empty' };
  const s = normalise(text);
  const report: ParsedReport = {};
  const m = STAT_RE.exec(s);
  let rest = s;
  if (m) {
    const statistic = statisticOf(m[1]);
    report.statistic = statistic;
    const value = readPrinted(m[4]);
    if (!value) return { ok: false, message: `could not read the value of ${statistic} in "${text}"` };
    if (m[3] !== '=') return { ok: false, message: `the statistic must be given with "=", not "${m[3]}", in "${text}"` };
    report.value = value;
    if (m[2] !== undefined) {
      const dfs = readDfs(m[2], statistic);
      if (typeof dfs === 'string') return { ok: false, message: `${dfs} in "${text}"` };
      if (statistic === 'F') {
        if (dfs.length !== 2) return { ok: false, message: `F needs two degrees of freedom, e.g. "F(2, 27)", in "${text}"` };
        [report.df1, report.df2] = dfs;
      } else if (statistic === 'z') {
        return { ok: false, message: `z takes no degrees of freedom in "${text}"` };
      } else {
        if (dfs.length !== 1) return { ok: false, message: `${statistic} needs one degree-of-freedom value in "${text}"` };
        report.df = dfs[0];
      }
    } else if (statistic !== 'z') {
      return { ok: false, message: `${statistic === 'chi2' ? 'chi-square' : statistic} needs degrees of freedom in parentheses, e.g. "${statistic === 'F' ? 'F(2, 27)' : statistic === 't' ? 't(28)' : 'χ²(3)'}", in "${text}"` };
    }
    rest = s.slice(m.index + m[0].length);
  }
  const pm = P_RE.exec(rest);
  if (pm) {
    const p = readPrinted(pm[2]);
    if (!p || p.value < 0 || p.value > 1) return { ok: false, message: `p must be a number between 0 and 1 in "${text}"` };
    const op = pm[1] === '<=' || pm[1] === '≤' ? '<' : pm[1] === '>=' || pm[1] === '≥' ? '>' : (pm[1] as ReportedP['op']);
    report.p = { op, ...p };
  } else if (NS_RE.test(rest)) {
    report.ns = true;
  }
  if (!report.statistic && !report.p && !report.ns) {
    return { ok: false, message: `no statistic (t, F, z, χ²) or p value found in "${text}"` };
  }
  return { ok: true, report };
}
