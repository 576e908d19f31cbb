/**
 * Reported-versus-recomputed reconciliation.
 *
 * Rules (each tested in reconcile.spec.ts):
 * 1. Parse the reporting string (apa/parse.ts). Unreadable text → verdict "unparsed".
 * 2. Recompute p from the reported statistic and df: two-sided for t and z
 *    (the usual reporting convention), upper tail for F and χ².
 * 3. Rounding intervals come from the printed digits (common practice in
 *    consistency checking of published results): a value printed with k
 *    decimals stands for anything within ±0.5·10^−k, so "4.85" is [4.845, 4.855]
 *    and gives a p interval [p(4.855), p(4.845)]. "p = .016" stands for
 *    [.0155, .0165]; "p < c" for [0, c]; "p > c" for [c, 1]; "ns" for [alpha, 1].
 * 4. Internal check of the reported p:
 *    consistent        — p recomputed at the printed statistic lies in the reported p interval;
 *    rounding          — it does not, but some statistic inside the printed rounding
 *                        interval gives a p inside the reported p interval;
 *    decision-changing — the reported p interval lies wholly on one side of alpha and the
 *                        whole recomputed p interval on the other (p < alpha rejects);
 *    inconsistent      — any other disagreement.
 * 5. Comparison with the rerun: the matched test is the one named by `term`
 *    (several rows for one term: the one whose df agrees), otherwise the only test
 *    with the same statistic and df; with several such tests, the one whose value is
 *    closest. Sphericity-corrected df of within terms, regression coefficients (t)
 *    and rank tests with df (χ²) count as candidates too.
 *    The t sign is ignored (it depends on the order of the groups). The rerun value
 *    matches if it lies in the printed rounding interval (consistent), is within one
 *    unit of the last printed digit (rounding), otherwise it is inconsistent, or
 *    decision-changing when the reported decision is known and the rerun p falls
 *    on the other side of alpha.
 * 6. The verdict is the worse of the two checks (consistent < rounding <
 *    inconsistent < decision-changing). With neither a reported p nor a matching
 *    rerun test there is nothing to check, and the verdict stays "unparsed" with
 *    `parsed` filled in and an explanation.
 */
import type { ReconcileRow, ReconcileVerdict, ReportedInput, RerunResult } from './contract';
import { chiSquare, fisherF, normal, studentT } from './dist';
import { formatDf } from './apa/format';
import { parseReported, type ParsedReport, type PrintedNumber, type ReportedStatistic } from './apa/parse';

type Checked = Exclude<ReconcileVerdict, 'unparsed'>;
const ORDER: Checked[] = ['consistent', 'rounding', 'inconsistent', 'decision-changing'];
const worse = (a: Checked, b: Checked): Checked => (ORDER.indexOf(a) >= ORDER.indexOf(b) ? a : b);

/** Half a unit in the last printed digit. */
const halfUnit = (n: PrintedNumber) => 0.5 * Math.pow(10, -n.decimals);
/** Slack for binary representation of printed decimals. */
const FUZZ = 1e-12;

/** p from a statistic: two-sided for t and z, upper tail for F and χ². */
function pOf(statistic: ReportedStatistic, value: number, df?: number, df1?: number, df2?: number): number {
  switch (statistic) {
    case 't':
      return 2 * studentT(df ?? NaN).sf(Math.abs(value));
    case 'z':
      return 2 * normal().sf(Math.abs(value));
    case 'F':
      return fisherF(df1 ?? NaN, df2 ?? NaN).sf(value);
    case 'chi2':
      return chiSquare(df ?? NaN).sf(value);
  }
}

/** Reported p as an interval, or undefined when none was reported. */
function reportedPInterval(r: ParsedReport, alpha: number): [number, number] | undefined {
  if (r.p) {
    const h = halfUnit(r.p);
    if (r.p.op === '<') return [0, r.p.value];
    if (r.p.op === '>') return [r.p.value, 1];
    return [Math.max(0, r.p.value - h), Math.min(1, r.p.value + h)];
  }
  if (r.ns) return [alpha, 1];
  return undefined;
}

/** Reported decision: true = significant, false = not, undefined = interval straddles alpha. */
function reportedDecision(interval: [number, number] | undefined, alpha: number): boolean | undefined {
  if (!interval) return undefined;
  if (interval[1] < alpha || (interval[1] === alpha && interval[0] < alpha)) return true; // "p < .05" at alpha .05
  if (interval[0] >= alpha) return false;
  return undefined;
}

const fmtP = (p: number) => (p < 0.0001 ? p.toExponential(2) : p.toFixed(4).replace(/^0\./, '.'));
const fmtInterval = (i: [number, number]) => `${fmtP(i[0])} to ${fmtP(i[1])}`;

function label(r: ParsedReport): string {
  const v = r.value!;
  const val = v.value.toFixed(v.decimals);
  if (r.statistic === 'F') return `F(${formatDf(r.df1!.value)}, ${formatDf(r.df2!.value)}) = ${val}`;
  if (r.statistic === 'z') return `z = ${val}`;
  return `${r.statistic === 'chi2' ? 'χ²' : 't'}(${formatDf(r.df!.value)}) = ${val}`;
}

interface Candidate {
  term: string;
  statistic: ReportedStatistic;
  value: number;
  p: number;
  df?: number;
  df1?: number;
  df2?: number;
  note?: string;
}

function candidates(result: RerunResult): Candidate[] {
  const out: Candidate[] = [];
  for (const t of result.tests) {
    out.push({ term: t.term, statistic: t.statistic, value: t.value, p: t.p, df: t.df, df1: t.df1, df2: t.df2, note: t.variant });
    if (t.corrections) {
      for (const [key, c] of Object.entries(t.corrections)) {
        out.push({ term: t.term, statistic: 'F', value: t.value, p: c.p, df1: c.df1, df2: c.df2, note: `${key.toUpperCase()} correction` });
      }
    }
  }
  for (const c of result.coefficients ?? []) {
    out.push({ term: c.term, statistic: 't', value: c.value, p: c.p, df: c.df, note: 'regression coefficient' });
  }
  for (const n of result.nonparametric ?? []) {
    if (n.df !== undefined) out.push({ term: n.term, statistic: 'chi2', value: n.value, p: n.p, df: n.df, note: n.method });
  }
  return out;
}

const dfAgrees = (printed: PrintedNumber | undefined, actual: number | undefined) =>
  printed !== undefined && actual !== undefined && Math.abs(printed.value - actual) <= Math.max(halfUnit(printed), 0.005) + FUZZ;

function dfMatches(r: ParsedReport, c: Candidate): boolean {
  if (r.statistic === 'F') return dfAgrees(r.df1, c.df1) && dfAgrees(r.df2, c.df2);
  if (r.statistic === 'z') return true;
  return dfAgrees(r.df, c.df);
}

function findMatch(r: ParsedReport, term: string | undefined, result: RerunResult): { match?: Candidate; note: string } {
  const sameStat = candidates(result).filter((c) => c.statistic === r.statistic);
  const closest = (cs: Candidate[]) =>
    cs.reduce((best, c) => (Math.abs(Math.abs(c.value) - Math.abs(r.value!.value)) < Math.abs(Math.abs(best.value) - Math.abs(r.value!.value)) ? c : best));
  if (term !== undefined) {
    const byTerm = sameStat.filter((c) => c.term === term);
    if (byTerm.length === 0) return { note: `The rerun has no ${r.statistic === 'chi2' ? 'χ²' : r.statistic} test for "${term}".` };
    const withDf = byTerm.filter((c) => dfMatches(r, c));
    if (withDf.length > 0) return { match: closest(withDf), note: '' };
    return { match: byTerm.find((c) => c.note === undefined || c.note === 'student' || c.note === 'paired') ?? byTerm[0], note: 'The reported df differ from the rerun\'s.' };
  }
  const withDf = sameStat.filter((c) => dfMatches(r, c));
  if (withDf.length === 0) return { note: 'No rerun test has the same statistic and df, so the value could not be compared with the rerun.' };
  return { match: closest(withDf), note: withDf.length > 1 ? 'Several rerun tests have these df; the closest value was used.' : '' };
}

function internalCheck(r: ParsedReport, alpha: number, pAt: (v: number) => number): { verdict?: Checked; text: string; pRange: [number, number] } {
  const v = Math.abs(r.value!.value);
  const h = halfUnit(r.value!);
  const pRange: [number, number] = [pAt(v + h), pAt(Math.max(0, v - h))];
  const pHere = pAt(v);
  const interval = reportedPInterval(r, alpha);
  const reportedText = r.p ? `p ${r.p.op} ${r.p.value.toFixed(r.p.decimals).replace(/^0\./, '.')}` : r.ns ? '"ns"' : '';
  if (!interval) return { text: `No p was reported; ${label(r)} gives p = ${fmtP(pHere)}.`, pRange };
  const base = `${label(r)} gives p = ${fmtP(pHere)} (p ${fmtInterval(pRange)} for statistics that round to the printed ${r.value!.value.toFixed(r.value!.decimals)}); reported ${reportedText}.`;
  if (pHere >= interval[0] - FUZZ && pHere <= interval[1] + FUZZ) return { verdict: 'consistent', text: `${base} These agree.`, pRange };
  if (pRange[0] <= interval[1] + FUZZ && pRange[1] >= interval[0] - FUZZ) {
    return { verdict: 'rounding', text: `${base} They agree once the rounding of the printed statistic is allowed for.`, pRange };
  }
  const decided = reportedDecision(interval, alpha);
  const recomputedSide = pRange[1] < alpha ? true : pRange[0] >= alpha ? false : undefined;
  let oneSided = '';
  if (r.statistic === 't' || r.statistic === 'z') {
    if (pHere / 2 >= interval[0] - FUZZ && pHere / 2 <= interval[1] + FUZZ) oneSided = ' The reported p matches a one-sided test.';
  }
  if (decided !== undefined && recomputedSide !== undefined && decided !== recomputedSide) {
    return {
      verdict: 'decision-changing',
      text: `${base} They disagree, and on different sides of alpha = ${alpha}: the report calls the result ${decided ? 'significant' : 'not significant'}, the recomputed p says ${recomputedSide ? 'significant' : 'not significant'}.${oneSided}`,
      pRange,
    };
  }
  return { verdict: 'inconsistent', text: `${base} They disagree beyond rounding.${oneSided}`, pRange };
}

function rerunCheck(r: ParsedReport, m: Candidate, alpha: number): { verdict: Checked; text: string } {
  const printed = Math.abs(r.value!.value);
  const ours = Math.abs(m.value);
  const h = halfUnit(r.value!);
  const what = `The rerun gives ${m.statistic === 'chi2' ? 'χ²' : m.statistic} = ${m.value.toFixed(Math.max(2, r.value!.decimals + 1))}, p = ${fmtP(m.p)}${m.note ? ` (${m.note})` : ''}`;
  const sign = r.statistic === 't' && Math.sign(m.value) * Math.sign(r.value!.value) < 0 ? ' The sign differs, which only reflects the order of the groups.' : '';
  const diff = Math.abs(ours - printed);
  if (diff <= h + FUZZ * Math.max(1, printed)) return { verdict: 'consistent', text: `${what}, which rounds to the reported value.${sign}` };
  if (diff <= 2 * h + FUZZ * Math.max(1, printed)) return { verdict: 'rounding', text: `${what}, within one unit of the last reported digit.${sign}` };
  const decided = reportedDecision(reportedPInterval(r, alpha), alpha);
  if (decided !== undefined && decided !== m.p < alpha) {
    return { verdict: 'decision-changing', text: `${what}, which differs from the report and ${m.p < alpha ? 'is' : 'is not'} significant at alpha = ${alpha}, unlike the report.${sign}` };
  }
  return { verdict: 'inconsistent', text: `${what}, which differs from the reported value.${sign}` };
}

/** Reconciles one reported string with the rerun. */
function reconcileOne(input: ReportedInput, result: RerunResult, alpha: number): ReconcileRow {
  const row: ReconcileRow = { text: input.text, term: input.term, verdict: 'unparsed', explanation: '' };
  const parsed = parseReported(input.text);
  if (!parsed.ok) {
    row.explanation = `Could not read the reported result: ${parsed.message}.`;
    return row;
  }
  const r = parsed.report;
  if (!r.statistic || !r.value) {
    row.explanation = 'Only a p value was reported; without the statistic and its df there is nothing to recompute.';
    return row;
  }
  row.parsed = {
    statistic: r.statistic,
    value: r.value.value,
    ...(r.df ? { df: r.df.value } : {}),
    ...(r.df1 ? { df1: r.df1.value } : {}),
    ...(r.df2 ? { df2: r.df2.value } : {}),
    ...(r.p ? { p: { op: r.p.op, value: r.p.value } } : {}),
  };
  const pAt = (v: number) => pOf(r.statistic!, v, r.df?.value, r.df1?.value, r.df2?.value);
  row.pFromReported = pAt(r.value.value);
  const internal = internalCheck(r, alpha, pAt);
  const { match, note } = findMatch(r, input.term, result);
  const parts = [internal.text];
  let verdict: Checked | undefined = internal.verdict;
  if (match) {
    row.rerunValue = match.value;
    row.rerunP = match.p;
    if (row.term === undefined) row.term = match.term;
    const rc = rerunCheck(r, match, alpha);
    parts.push(rc.text);
    verdict = verdict ? worse(verdict, rc.verdict) : rc.verdict;
  }
  if (note) parts.push(note);
  row.verdict = verdict ?? 'unparsed';
  if (!verdict) parts.push('There is nothing to check it against.');
  row.explanation = parts.join(' ');
  return row;
}

/** Reconciles every reported statistic with the rerun at the plan's alpha. */
export function reconcile(reported: ReportedInput[], result: RerunResult, alpha: number): ReconcileRow[] {
  return reported.map((input) => reconcileOne(input, result, alpha));
}
