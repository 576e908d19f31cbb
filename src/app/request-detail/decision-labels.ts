import type { Decision } from '../../../shared/api/types';
import type { LetterStatus } from '../../../shared/api/workflow';

/** Plain labels for the review decisions. */
export const DECISION_LABELS: Record<Decision, string> = {
  endorse: 'Endorsed',
  'endorse-with-conditions': 'Endorsed with conditions',
  'revise-and-resubmit': 'Revise and resubmit',
  'not-endorsed': 'Not endorsed',
};

/** Plain labels for letter states. */
export const LETTER_STATUS_LABELS: Record<LetterStatus, string> = {
  'awaiting-countersign': 'Awaiting countersignature',
  issued: 'Issued',
  superseded: 'Superseded',
};
