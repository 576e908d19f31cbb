import type { ParsedReport, ReportedStatistic } from '../../../shared/stats/apa/parse';

/** The parts of a result entered field by field. */
export interface ReportedParts {
  test: ReportedStatistic;
  df1: string;
  df2: string;
  value: string;
  pOp: '=' | '<';
  p: string;
  effectName: string;
  effectValue: string;
}

/** Empty builder parts. */
export function emptyParts(): ReportedParts {
  return { test: 'F', df1: '', df2: '', value: '', pOp: '=', p: '', effectName: '', effectValue: '' };
}

const STAT_SYMBOL: Record<ReportedStatistic, string> = { F: 'F', t: 't', z: 'z', chi2: 'χ²' };

/** Strips a leading zero from a p or effect value as reporting style does ("0.020" → ".020"). */
function noLeadingZero(v: string): string {
  return v.trim().replace(/^0(?=[.,])/, '').replace(/^-0(?=[.,])/, '-');
}

/** Composes a reporting string from the builder's fields, e.g. "F(2, 87) = 4.10, p = .020, η²p = .09". */
export function composeReported(x: ReportedParts): string {
  const sym = STAT_SYMBOL[x.test];
  let df = '';
  if (x.test === 'F') df = x.df1.trim() || x.df2.trim() ? `(${x.df1.trim()}, ${x.df2.trim()})` : '';
  else if (x.test !== 'z') df = x.df1.trim() ? `(${x.df1.trim()})` : '';
  const parts = [`${sym}${df} = ${x.value.trim()}`];
  if (x.p.trim()) parts.push(`p ${x.pOp} ${noLeadingZero(x.p)}`);
  if (x.effectName.trim() && x.effectValue.trim()) parts.push(`${x.effectName.trim()} = ${x.effectValue.trim()}`);
  return parts.join(', ');
}

const fmt = (n: { value: number; decimals: number }) => n.value.toFixed(n.decimals);

/** Says in words what the parser read, so the person can see it understood them. */
export function describeParsed(r: ParsedReport): string {
  const bits: string[] = [];
  if (r.statistic) {
    const name = r.statistic === 'chi2' ? 'chi-square' : r.statistic;
    let df = '';
    if (r.df1 && r.df2) df = ` with ${fmt(r.df1)} and ${fmt(r.df2)} degrees of freedom`;
    else if (r.df) df = ` with ${fmt(r.df)} degrees of freedom`;
    if (r.value) bits.push(`${name} = ${fmt(r.value)}${df}`);
  }
  if (r.p) bits.push(`p ${r.p.op} ${fmt(r.p)}`);
  else if (r.ns) bits.push('marked not significant');
  if (!r.p && !r.ns) bits.push('no p value');
  return `Read as: ${bits.join('; ')}.`;
}
