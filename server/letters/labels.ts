/**
 * Words the letter prints for the product's coded values (decisions, verdicts,
 * criteria, design kinds) and the date formats it uses.
 */
import type { Decision, DesignKind } from '../../shared/api/types';

export { CRITERION_LABELS, VERDICT_LABELS } from '../../shared/api/labels';

/** Decision headline as printed in the decision panel. */
export const DECISION_HEADLINES: Record<Decision, string> = {
  endorse: 'Endorsed',
  'endorse-with-conditions': 'Endorsed with conditions',
  'revise-and-resubmit': 'Revise and resubmit',
  'not-endorsed': 'Not endorsed',
};

/** The sentence under the headline that says what the decision means. */
export const DECISION_SENTENCES: Record<Decision, string> = {
  endorse: 'The office endorses the statistical method of this analysis as filed.',
  'endorse-with-conditions': 'The office endorses the statistical method of this analysis, provided the conditions below are met in what is reported.',
  'revise-and-resubmit': 'The office cannot endorse the analysis yet. The changes below are needed before the request is reviewed again.',
  'not-endorsed': 'The office does not endorse the statistical method of this analysis, for the reasons below.',
};

/** Heading of the list that follows the decision. */
export const CONDITION_HEADINGS: Record<Decision, string> = {
  endorse: 'Remarks',
  'endorse-with-conditions': 'Conditions',
  'revise-and-resubmit': 'Required changes',
  'not-endorsed': 'Reasons',
};

/** Design kinds in words. */
export const DESIGN_LABELS: Record<DesignKind, string> = {
  'one-sample': 'One sample',
  'two-independent': 'Two independent groups',
  paired: 'Paired measurements',
  'between-anova': 'Between-subjects analysis of variance',
  'repeated-measures': 'Repeated measures',
  mixed: 'Mixed design (between and within factors)',
  regression: 'Linear regression',
};

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** "4 November 2026" in UTC, independent of the server's locale data. */
export function longDate(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}

/** "4 November 2026, 14:05 UTC". */
export function longDateTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const hh = String(d.getUTCHours()).padStart(2, '0');
  const mm = String(d.getUTCMinutes()).padStart(2, '0');
  return `${longDate(iso)}, ${hh}:${mm} UTC`;
}
