/**
 * Turns what the database holds about a decided request into the letter engine's
 * LetterInput. Pure (no database): the letters service gathers the rows, the seed and the
 * demo-letter script call it with their own, so all three print the same letter.
 */
import type { PlanDraft } from '../../shared/api/workflow';
import { CRITERIA, type Criterion, type Decision, type DesignKind, type Verdict } from '../../shared/api/types';
import type { AutoFinding } from '../../shared/review/checklist-findings';
import { toEnginePlan } from '../../shared/review/plan-mapping';
import type { AnalysisPlan, ComparisonMethod, RerunResult } from '../../shared/stats/contract';
import type { LetterChecklistEntry, LetterFactor, LetterInput, LetterPerson, LetterPlanSummary, Letterhead } from '../letters/index';

/** Words for comparison procedures as the plan section prints them. */
const METHOD_LABELS: Record<ComparisonMethod, string> = {
  tukey: 'Tukey HSD',
  'games-howell': 'Games–Howell',
  bonferroni: 'Bonferroni',
  holm: 'Holm',
  bh: 'Benjamini–Hochberg',
};

type Loose = Record<string, unknown>;
const text = (v: unknown): string | null => (typeof v === 'string' && v.trim() !== '' ? v.trim() : null);
const texts = (v: unknown): string[] => (Array.isArray(v) ? v.map(text).filter((s): s is string => s !== null) : []);

/** Two to four capitals for the office mark: the reference prefix when it is short, else initials. */
function logoFor(settings: Loose, institution: string, officeName: string): string {
  const given = text((settings['letterhead'] as Loose | undefined)?.['logoText']);
  if (given) return given.slice(0, 4).toUpperCase();
  const prefix = text(settings['referencePrefix']);
  if (prefix && /^[A-Za-z]{2,4}$/.test(prefix)) return prefix.toUpperCase();
  const words = (institution || officeName).split(/\s+/).filter((w) => /^[A-Z]/.test(w));
  return (words.map((w) => w[0]).join('').slice(0, 3) || 'OF').toUpperCase();
}

/**
 * The letterhead from the office settings. Reads both the first settings layout
 * ({institution, office, address, email, phone}) and the office-settings form's layout
 * ({unit, institution, addressLines, email, phone, website}); missing parts fall back to
 * the office name, so an office that never filled in its letterhead still gets a letter.
 */
export function letterheadFrom(officeName: string, settings: unknown): Letterhead {
  const s = (settings ?? {}) as Loose;
  const lh = (s['letterhead'] ?? {}) as Loose;
  const institution = text(lh['institution']) ?? '';
  const name = text(lh['office']) ?? text(lh['unit']) ?? text(s['name']) ?? officeName;
  const addressLines = texts(lh['addressLines']);
  if (!addressLines.length && text(lh['address'])) addressLines.push(...text(lh['address'])!.split(/\s*\n\s*/));
  const contactLines = [text(lh['email']), text(lh['phone']), text(lh['website'])].filter((x): x is string => x !== null);
  return { officeName: name, unit: institution, addressLines, contactLines, logoText: logoFor(s, institution, name) };
}

/** Whether the office requires the head's countersignature (default: no). */
export function countersignRequired(settings: unknown): boolean {
  return (settings as Loose | null)?.['countersignRequired'] === true;
}

/** True when a stored plan is the filing form's PlanDraft rather than an engine plan. */
export function isPlanDraft(plan: unknown): plan is PlanDraft {
  return typeof plan === 'object' && plan !== null && 'designKind' in plan && Array.isArray((plan as Loose)['between']);
}

/** The engine plan of a stored request plan (PlanDraft or engine shape), or null when it has none usable. */
export function enginePlanOf(plan: unknown, reported: { term?: string; text: string }[] = []): AnalysisPlan | null {
  if (isPlanDraft(plan)) {
    try {
      return toEnginePlan(plan, reported);
    } catch {
      return null;
    }
  }
  if (typeof plan === 'object' && plan !== null && typeof (plan as Loose)['design'] === 'string') {
    const p = { ...(plan as AnalysisPlan) };
    if (!p.reported && reported.length) p.reported = reported;
    return p;
  }
  return null;
}

/** The submitter's design kind for an engine plan (used when the request does not say). */
export function designKindOf(plan: AnalysisPlan): DesignKind {
  switch (plan.design) {
    case 'one-sample': return 'one-sample';
    case 'independent': return 'two-independent';
    case 'paired': return 'paired';
    case 'regression': return 'regression';
    default: {
      const within = plan.within?.length ?? 0;
      const between = plan.between?.length ?? 0;
      if (within && between) return 'mixed';
      return within ? 'repeated-measures' : 'between-anova';
    }
  }
}

/** Levels of a factor in the order the rerun lists its cells. */
function levelsInResult(result: RerunResult, factor: string): string[] {
  return [...new Set(result.descriptives.map((d) => d.levels[factor]).filter((v): v is string => v !== undefined))];
}

/** The plan in words: design kind, outcome, factors with levels, subject, alpha and comparisons. */
export function planSummary(designKind: DesignKind | null, storedPlan: unknown, plan: AnalysisPlan, result: RerunResult): LetterPlanSummary {
  const draft = isPlanDraft(storedPlan) ? storedPlan : null;
  const declared = (kind: 'between' | 'within', name: string) => (kind === 'between' ? draft?.between : draft?.within)?.find((f) => f.column === name)?.levels ?? [];
  const factor = (kind: 'between' | 'within') => (name: string): LetterFactor => {
    const fromData = levelsInResult(result, name);
    return { name, kind, levels: fromData.length ? fromData : declared(kind, name) };
  };
  return {
    designKind: designKind ?? draft?.designKind ?? designKindOf(plan),
    outcome: plan.outcome,
    factors: [...(plan.between ?? []).map(factor('between')), ...(plan.within ?? []).map(factor('within'))],
    subject: plan.subject ?? null,
    alpha: plan.alpha ?? result.alpha,
    comparisons: (plan.comparisons ?? []).map((c) => `${c.factor}: ${METHOD_LABELS[c.method] ?? c.method}`),
  };
}

/** A stored checklist entry as the composer needs it. */
export interface ChecklistPart {
  criterion: Criterion;
  verdict: Verdict | null;
  note: string;
  autoFinding: Partial<AutoFinding> | Record<string, unknown> | null;
}

/** Decided checklist entries in the office's criterion order; undecided ones are left off the letter. */
export function checklistEntries(rows: ChecklistPart[]): LetterChecklistEntry[] {
  return rows
    .filter((r) => r.verdict !== null && (CRITERIA as readonly string[]).includes(r.criterion))
    .sort((a, b) => CRITERIA.indexOf(a.criterion) - CRITERIA.indexOf(b.criterion))
    .map((r) => ({ criterion: r.criterion, verdict: r.verdict!, reviewerNote: r.note, automaticFinding: text((r.autoFinding as Loose | null)?.['summary']) }));
}

/** Everything a letter is composed from. */
export interface LetterParts {
  office: { name: string; settings: unknown };
  request: { id: string; reference: string; title: string; purpose: string; designKind: DesignKind | null; plan: unknown; filedAt: Date | null; createdAt: Date };
  submitter: { name: string; email: string };
  signer: LetterPerson;
  countersigner: LetterPerson | null;
  dataset: { filename: string; sha256: string; rows: number };
  rerun: { id: string; engineVersion: string | null; dataSha256: string | null; planSnapshot: unknown; result: RerunResult };
  checklist: ChecklistPart[];
  decision: { decision: Decision; conditions: string[]; rationale: string; decidedAt: Date };
  verification: { code: string; url: string };
  version: number;
  supersedes: string | null;
  signedAt: Date;
}

/** Assembles the LetterInput; throws when the rerun's plan snapshot cannot be read as a plan. */
export function composeLetterInput(p: LetterParts): LetterInput {
  const plan = enginePlanOf(p.rerun.planSnapshot) ?? enginePlanOf(p.request.plan);
  if (!plan) throw new Error(`The rerun ${p.rerun.id} of ${p.request.reference} has no readable analysis plan.`);
  return {
    letterhead: letterheadFrom(p.office.name, p.office.settings),
    request: { id: p.request.id, reference: p.request.reference, title: p.request.title, purpose: p.request.purpose },
    submitter: { name: p.submitter.name, email: p.submitter.email },
    reviewer: p.signer,
    countersigner: p.countersigner,
    dates: { filed: (p.request.filedAt ?? p.request.createdAt).toISOString(), decided: p.decision.decidedAt.toISOString(), signed: p.signedAt.toISOString() },
    dataset: { ...p.dataset },
    plan: planSummary(p.request.designKind, p.request.plan, plan, p.rerun.result),
    rerun: { engineVersion: p.rerun.engineVersion ?? p.rerun.result.engine, rerunId: p.rerun.id, dataHash: p.rerun.dataSha256 ?? p.dataset.sha256, result: p.rerun.result },
    checklist: checklistEntries(p.checklist),
    decision: p.decision.decision,
    conditions: [...p.decision.conditions],
    summary: text(p.decision.rationale),
    verification: { ...p.verification },
    version: p.version,
    supersedes: p.supersedes,
  };
}

/** Public verification address printed on a letter. */
export function verifyUrlFor(publicUrl: string, code: string): string {
  return `${publicUrl.replace(/\/+$/, '')}/verify/${code}`;
}
