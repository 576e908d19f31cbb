import type { RequestDetail } from '../../../shared/api/types';

/** One thing a person might do with a request, and why they can or cannot do it now. */
export interface RequestAction {
  key: keyof RequestDetail['can'];
  label: string;
  icon: string;
  allowed: boolean;
  /** Why not, in plain words (empty when allowed). */
  reason: string;
}

// The server decides each permission; these sentences state the office rule behind it.
const ACTIONS: { key: keyof RequestDetail['can']; label: string; icon: string; rule: string }[] = [
  { key: 'edit', label: 'Edit the request', icon: 'edit', rule: 'The submitter edits a request while it is a draft or returned for revision.' },
  { key: 'assign', label: 'Assign a reviewer', icon: 'person_add', rule: 'The office head assigns filed requests before their review starts.' },
  { key: 'review', label: 'Review: rerun and checklist', icon: 'fact_check', rule: 'The assigned reviewer reviews a request once it is assigned.' },
  { key: 'decide', label: 'Record a decision', icon: 'gavel', rule: 'The assigned reviewer records the decision at the end of the review.' },
  { key: 'withdraw', label: 'Withdraw the request', icon: 'do_not_disturb_on', rule: 'The submitter can withdraw a request until it is decided.' },
];

/** Lists the request's actions with the rule explaining each one that is greyed out. */
export function describeActions(r: RequestDetail): RequestAction[] {
  return ACTIONS.map(({ key, label, icon, rule }) => {
    const allowed = r.can?.[key] === true;
    return { key, label, icon, allowed, reason: allowed ? '' : rule };
  });
}
