import type { VerificationView } from '../../../shared/api/workflow';

/** How each verification outcome is shown: a headline, a tone and an icon. */
export const OUTCOMES: Record<VerificationView['status'], { title: string; tone: 'good' | 'warn' | 'bad' | 'none'; icon: string }> = {
  'valid-current': { title: 'Valid and current', tone: 'good', icon: 'verified' },
  'valid-superseded': { title: 'Valid but superseded', tone: 'warn', icon: 'history' },
  altered: { title: 'Altered — do not rely on this copy', tone: 'bad', icon: 'gpp_bad' },
  'unknown-code': { title: 'Unknown code', tone: 'none', icon: 'help' },
  'not-a-pdf': { title: 'Not a PDF', tone: 'none', icon: 'description' },
};

/** The headline for an outcome, naming the newer letter when there is one. */
export function outcomeTitle(v: VerificationView): string {
  if (v.status === 'valid-superseded' && v.letter?.supersededBy) return `Valid but superseded by ${v.letter.supersededBy}`;
  return OUTCOMES[v.status].title;
}

/** What a recommendation covers, said on every result. */
export const SCOPE_CAUTION =
  'A recommendation from the office covers statistical method only. It is not ethics-board approval, nor legal, clinical or policy advice; ' +
  'local rules and the institution’s review board prevail.';
