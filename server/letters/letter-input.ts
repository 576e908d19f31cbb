/**
 * Everything a recommendation letter says, gathered by the workflow before rendering.
 * The letter engine never reads the database: routes build a LetterInput and pass it in.
 */
import type { Criterion, Decision, DesignKind, Verdict } from '../../shared/api/types';
import type { RerunResult } from '../../shared/stats/contract';

/** Office letterhead, from the office settings. */
export interface Letterhead {
  /** e.g. "Office of Institutional Effectiveness". */
  officeName: string;
  /** Parent institution or unit, e.g. "Harrow Vale Community College". */
  unit: string;
  addressLines: string[];
  /** Telephone, e-mail or web address lines shown at the right. */
  contactLines: string[];
  /** Two to four letters drawn as the office mark, e.g. "HV". */
  logoText: string;
}

/** A person named on the letter. */
export interface LetterPerson {
  name: string;
  email: string;
  /** Job title shown under the name, e.g. "Methods reviewer". */
  role?: string;
}

/** One factor of the plan with its levels in display order. */
export interface LetterFactor {
  name: string;
  levels: string[];
  kind: 'between' | 'within';
}

/** The analysis plan in words. */
export interface LetterPlanSummary {
  designKind: DesignKind;
  outcome: string;
  factors: LetterFactor[];
  subject?: string | null;
  alpha: number;
  /** Planned comparisons, e.g. "advising format: Tukey HSD". */
  comparisons: string[];
}

/** One checklist criterion as decided by the reviewer. */
export interface LetterChecklistEntry {
  criterion: Criterion;
  verdict: Verdict;
  reviewerNote: string;
  /** One-line summary of the automatic finding from the rerun. */
  automaticFinding?: string | null;
}

/** All content of one letter version. */
export interface LetterInput {
  letterhead: Letterhead;
  request: { id: string; reference: string; title: string; purpose: string };
  submitter: LetterPerson;
  reviewer: LetterPerson;
  /** Office head who countersigned, when the office requires it. */
  countersigner?: LetterPerson | null;
  /** ISO 8601 dates. */
  dates: { filed: string; decided: string; signed: string };
  dataset: { filename: string; sha256: string; rows: number };
  plan: LetterPlanSummary;
  rerun: { engineVersion: string; rerunId: string; dataHash: string; result: RerunResult };
  checklist: LetterChecklistEntry[];
  decision: Decision;
  /** Conditions attached to the decision (endorse with conditions) or required changes. */
  conditions: string[];
  /** Reviewer's closing summary in a few sentences (optional). */
  summary?: string | null;
  verification: { code: string; url: string };
  /** 1 for the first letter of a request; each superseding letter adds one. */
  version: number;
  /** Verification code of the letter this one replaces. */
  supersedes?: string | null;
}
