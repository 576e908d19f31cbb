/**
 * The review checklist: one entry per criterion, each with the automatic finding from the
 * latest completed rerun and the reviewer's verdict and note (optimistic locking per entry).
 */
import type { Request } from 'express';
import { UniqueConstraintError } from 'sequelize';
import { CRITERIA, type Criterion, type PersonRef } from '../../shared/api/types';
import type { ChecklistEntryView } from '../../shared/api/workflow';
import { autoFindings, type AutoFinding, type FindingContext } from '../../shared/review/checklist-findings';
import type { AnalysisPlan, RerunResult } from '../../shared/stats/contract';
import { readTableBytes } from '../tabular/index';
import { forbidden, staleVersion, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { ChecklistEntry, Dataset, User, type Rerun, type ReviewRequest } from '../models/index';
import { audit } from './audit';
import { readerName } from './datasets';
import { independenceFlags } from './independence';
import { iso } from './paging';
import { activeAssignment } from './request-access';
import { planDraftOf } from './rerun-plan';
import { latestDoneRerun } from './reruns';

/** Independence flags per (data hash, plan): the data never change under a hash, so they are computed once. */
const flagCache = new Map<string, string[]>();
const FLAG_CACHE_SIZE = 50;

async function flagsFor(rerun: Rerun, draftSubject: string | null): Promise<string[]> {
  const plan = rerun.planSnapshot as unknown as AnalysisPlan;
  const key = `${rerun.dataSha256}|${JSON.stringify([plan.design, plan.subject, plan.between, plan.within, draftSubject])}`;
  const cached = flagCache.get(key);
  if (cached) return cached;
  const ds = rerun.datasetId ? await Dataset.scope('withBytes').findByPk(rerun.datasetId) : null;
  let flags: string[] = [];
  if (ds) {
    try {
      flags = independenceFlags(await readTableBytes(new Uint8Array(ds.bytes), readerName(ds.format ?? null, ds.filename)), plan, draftSubject);
    } catch {
      // The rerun read this file successfully; a failure here only means no data-based flags.
      flags = [];
    }
  }
  if (flagCache.size >= FLAG_CACHE_SIZE) flagCache.delete(flagCache.keys().next().value!);
  flagCache.set(key, flags);
  return flags;
}

/** The context the automatic findings need beyond the result: the plan draft, sampling notes and data flags. */
export async function findingContext(r: ReviewRequest, rerun: Rerun): Promise<FindingContext> {
  const draft = planDraftOf(r);
  return {
    submitterCorrection: draft?.submitterCorrection ?? null,
    plannedFamilySize: draft?.familySize ?? null,
    samplingNotes: r.samplingNotes || null,
    independenceFlags: await flagsFor(rerun, draft?.subject ?? null),
  };
}

/** Automatic findings from the latest completed rerun of the current revision, keyed by criterion. */
export async function currentFindings(r: ReviewRequest): Promise<{ rerun: Rerun | null; findings: Map<Criterion, AutoFinding> }> {
  const rerun = await latestDoneRerun(r);
  if (!rerun?.result) return { rerun: null, findings: new Map() };
  const all = autoFindings(rerun.result as unknown as RerunResult, await findingContext(r, rerun));
  return { rerun, findings: new Map(all.map((f) => [f.criterion, f])) };
}

/** All nine entries in checklist order; criteria never touched have version 0 and no verdict. */
export async function listChecklist(r: ReviewRequest): Promise<ChecklistEntryView[]> {
  const rows = await ChecklistEntry.findAll({ where: { requestId: r.id } });
  const byCriterion = new Map(rows.map((x) => [x.criterion, x]));
  const reviewerIds = [...new Set(rows.map((x) => x.reviewerId).filter((x): x is string => !!x))];
  const users = reviewerIds.length ? await User.findAll({ where: { id: reviewerIds }, attributes: ['id', 'name', 'email'] }) : [];
  const who = new Map<string, PersonRef>(users.map((u) => [u.id, { id: u.id, name: u.name, email: u.email }]));
  const { rerun, findings } = await currentFindings(r);
  return CRITERIA.map((criterion) => {
    const row = byCriterion.get(criterion);
    return {
      criterion, verdict: row?.verdict ?? null, note: row?.note ?? '', auto: findings.get(criterion) ?? null, rerunId: rerun?.id ?? null,
      reviewer: row?.reviewerId ? who.get(row.reviewerId) ?? null : null, updatedAt: row ? iso(row.updatedAt) : null, version: row?.version ?? 0,
    };
  });
}

/** The assigned reviewer may record verdicts while the request is in review. */
export function assertCanJudge(me: CurrentUser, r: ReviewRequest): void {
  if (!(me.roles.includes('reviewer') && activeAssignment(r)?.reviewerId === me.id)) throw forbidden('Only the assigned reviewer can record checklist verdicts.');
  if (r.state !== 'in-review') throw wrongState(`Checklist verdicts are recorded while the request is in review; this one is ${r.state.replace('-', ' ')}.`);
}

/**
 * Records a verdict and note with optimistic locking: the caller sends the version it read
 * (0 for an entry never saved); a stale version is a 409 and nothing is changed. The
 * automatic finding the reviewer saw is stored with the verdict.
 */
export async function putChecklistEntry(
  me: CurrentUser,
  r: ReviewRequest,
  criterion: Criterion,
  body: { verdict: ChecklistEntryView['verdict']; note: string; version: number },
  req?: Request,
): Promise<ChecklistEntryView> {
  assertCanJudge(me, r);
  const { rerun, findings } = await currentFindings(r);
  const auto = findings.get(criterion) ?? null;
  const existing = await ChecklistEntry.findOne({ where: { requestId: r.id, criterion } });
  const before = existing ? { verdict: existing.verdict, note: existing.note } : null;
  if (!existing) {
    if (body.version !== 0) throw staleVersion();
    try {
      // Created entries start at version 1, so a second tab still holding version 0 is refused.
      await ChecklistEntry.create({
        requestId: r.id, criterion, verdict: body.verdict, note: body.note, autoFinding: auto as unknown as Record<string, unknown>,
        rerunId: rerun?.id ?? null, reviewerId: me.id, version: 1,
      });
    } catch (err) {
      if (err instanceof UniqueConstraintError) throw staleVersion();
      throw err;
    }
  } else {
    if (existing.version !== body.version) throw staleVersion();
    existing.verdict = body.verdict;
    existing.note = body.note;
    existing.autoFinding = auto as unknown as Record<string, unknown>;
    existing.rerunId = rerun?.id ?? null;
    existing.reviewerId = me.id;
    // Sequelize's version check turns a concurrent save of the same version into an OptimisticLockError (409).
    await existing.save();
  }
  await audit({
    actorId: me.id, action: 'checklist.updated', entityType: 'request', entityId: r.id,
    details: { criterion, before, after: { verdict: body.verdict, note: body.note }, rerunId: rerun?.id ?? null },
  }, req);
  return (await listChecklist(r)).find((e) => e.criterion === criterion)!;
}
