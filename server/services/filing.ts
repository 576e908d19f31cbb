/**
 * Filing a request: submit (every check, then a dry run of the engine, then a frozen
 * snapshot of the revision and the state change), withdraw, and the saved revisions.
 */
import type { Request } from 'express';
import { Op, QueryTypes } from 'sequelize';
import { asPlanDraft, type SubmitInput, type WithdrawInput } from '../../shared/api/filing-schemas';
import type { RequestVersionDetail, RequestVersionSnapshot } from '../../shared/api/filing-types';
import type { RequestVersionSummary } from '../../shared/api/workflow';
import { toEnginePlan } from '../../shared/review/plan-mapping';
import { HttpError, forbidden, staleVersion, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { AnalysisPlanRow, AuditLog, Dataset, RequestVersion, Rerun, ReviewRequest, User } from '../models/index';
import { revisionRequests } from '../models/revision-request';
import { currentDataset, datasetBytes, readUpload, workingRevision } from './datasets';
import type { UploadFormat } from './dataset-sniff';
import { distinctValues, dryRunProblems, planColumns, staticProblems, storedReported, type Problems } from './filing-checks';
import { notify } from './notifications';
import { notifyEvent } from './notify-event';
import { iso } from './paging';
import { activeAssignment } from './request-access';
import { moveRequest } from './request-state';

/** 422 listing the problems by field. */
export function submitProblems(fields: Problems): HttpError {
  const n = Object.keys(fields).length;
  return new HttpError(422, 'validation', `The request cannot be filed yet: ${n} ${n === 1 ? 'problem needs' : 'problems need'} attention. ${Object.values(fields)[0]}`, fields);
}

/** The reviewer's required changes for the revision being filed (revision_requests, else the audit entry). */
async function revisionReason(r: ReviewRequest): Promise<string | null> {
  try {
    const row = await revisionRequests().findOne({ where: { requestId: r.id, revisionNo: r.revisionNo }, order: [['createdAt', 'DESC']] });
    if (row) return [...row.changes, row.message].map((x) => String(x).trim()).filter(Boolean).join('\n') || null;
  } catch {
    // Table not there (older schema): fall through to the audit log.
  }
  const e = await AuditLog.findOne({ where: { entityType: 'request', entityId: r.id, action: 'request.revision-requested' }, order: [['at', 'DESC']] });
  const d = (e?.details ?? {}) as Record<string, unknown>;
  if (Array.isArray(d['changes'])) return (d['changes'] as unknown[]).map(String).join('\n');
  for (const k of ['reason', 'message', 'note']) if (typeof d[k] === 'string' && d[k]) return d[k] as string;
  return null;
}

/**
 * Submits a draft (→ filed) or a revision (→ in-review, next revision number). Throws 422
 * with per-field problems when anything is missing or the engine refuses the plan; nothing
 * changes then.
 */
export async function submitRequest(me: CurrentUser, r: ReviewRequest, body: SubmitInput, req?: Request): Promise<void> {
  if (r.submitterId !== me.id) throw forbidden('Only the submitter can file a request.');
  if (r.state !== 'draft' && r.state !== 'revision-requested') throw wrongState(`A request that is ${r.state.replace('-', ' ')} cannot be submitted again.`);
  if (body.version !== r.version) throw staleVersion();

  const draft = asPlanDraft(r.plan, r.designKind);
  const dataset = await currentDataset(r);
  let values = new Map<string, Set<string>>();
  if (draft && dataset && planColumns(draft).some((c) => c.levels?.length)) {
    const table = await readUpload(await datasetBytes(dataset), (dataset.format ?? 'csv') as UploadFormat);
    values = distinctValues(table, planColumns(draft).map((c) => c.column));
  }
  const problems = staticProblems(r, draft, dataset, values);
  if (Object.keys(problems).length) throw submitProblems(problems);
  const reported = storedReported(r.reported);
  const engine = await dryRunProblems(draft!, reported, dataset!);
  if (Object.keys(engine).length) throw submitProblems(engine);

  const resubmission = r.state === 'revision-requested';
  const revisionNo = workingRevision(r);
  const enginePlan = toEnginePlan(draft!, reported);
  const snapshot: RequestVersionSnapshot = {
    title: r.title, purpose: r.purpose, decisionInformed: r.decisionInformed, audience: r.audience, samplingNotes: r.samplingNotes,
    deadline: r.deadline, designKind: draft!.designKind, plan: draft!, enginePlan, reported, datasetId: dataset!.id, datasetSha256: dataset!.sha256,
    note: body.note ?? null,
  };
  const reason = resubmission ? await revisionReason(r) : null;
  await ReviewRequest.sequelize!.transaction(async (transaction) => {
    await RequestVersion.create({ requestId: r.id, revisionNo, snapshot: snapshot as unknown as Record<string, unknown>, reason, createdById: me.id }, { transaction });
    await AnalysisPlanRow.create({ requestId: r.id, revisionNo, plan: enginePlan as unknown as Record<string, unknown>, createdById: me.id }, { transaction });
    r.revisionNo = revisionNo;
    r.designKind = draft!.designKind;
    await moveRequest(r, resubmission ? 'in-review' : 'filed', {
      actorId: me.id, version: body.version, req, transaction,
      details: { revisionNo, datasetId: dataset!.id, dataSha256: dataset!.sha256, resubmitted: resubmission },
    });
  }).catch(async (err: unknown) => {
    await r.reload();
    throw err;
  });
  await notifyEvent(resubmission ? 'request.resubmitted' : 'request.filed', r.id, { actorId: me.id, extra: body.note ? { note: body.note } : {} });
}

/** Withdraws a request that is not yet decided; an assigned reviewer is told in the app. */
export async function withdrawRequest(me: CurrentUser, r: ReviewRequest, body: WithdrawInput, req?: Request): Promise<void> {
  if (r.submitterId !== me.id) throw forbidden('Only the submitter can withdraw a request.');
  if (r.state === 'decided' || r.state === 'withdrawn') throw wrongState(`A request that is ${r.state} cannot be withdrawn.`);
  const reviewerId = activeAssignment(r)?.reviewerId ?? null;
  await moveRequest(r, 'withdrawn', { actorId: me.id, version: body.version, req, details: { reason: body.reason } });
  if (reviewerId) {
    await notify({ userId: reviewerId, kind: 'request.withdrawn', title: `${r.reference} was withdrawn`, body: body.reason, link: `/requests/${r.id}`, requestId: r.id })
      .catch((err: unknown) => req?.log?.error({ err }, 'withdrawal notice failed'));
  }
}

const revisionColumn = new WeakMap<object, boolean>();
/** True when the reruns table records the revision each rerun belongs to (reruns.revisionNo, added by the review migration). */
async function rerunsHaveRevision(): Promise<boolean> {
  const sequelize = Rerun.sequelize!;
  if (!revisionColumn.has(sequelize)) revisionColumn.set(sequelize, 'revisionNo' in (await sequelize.getQueryInterface().describeTable('reruns')));
  return revisionColumn.get(sequelize)!;
}

/** Ids of the reruns of one revision: by their revision column, else by time (from this filing to the next). */
async function rerunIdsOf(r: ReviewRequest, v: RequestVersion, next: RequestVersion | undefined): Promise<string[]> {
  if (await rerunsHaveRevision()) {
    const rows = await Rerun.sequelize!.query<{ id: string }>('SELECT id FROM reruns WHERE requestId = ? AND revisionNo = ? ORDER BY createdAt, id', {
      replacements: [r.id, v.revisionNo], type: QueryTypes.SELECT,
    });
    return rows.map((x) => x.id);
  }
  const rows = await Rerun.findAll({ attributes: ['id'], where: { requestId: r.id, createdAt: { [Op.gte]: v.createdAt, ...(next ? { [Op.lt]: next.createdAt } : {}) } }, order: [['createdAt', 'ASC']] });
  return rows.map((x) => x.id);
}

async function summaries(r: ReviewRequest, versions: RequestVersion[]): Promise<RequestVersionSummary[]> {
  const people = new Map((await User.findAll({ where: { id: versions.map((v) => v.createdById).filter((x): x is string => Boolean(x)) } })).map((u) => [u.id, u]));
  const datasets = await Dataset.findAll({ attributes: ['id', 'revisionNo'], where: { requestId: r.id }, order: [['createdAt', 'ASC']] });
  const out: RequestVersionSummary[] = [];
  for (const [i, v] of versions.entries()) {
    const snap = v.snapshot as Partial<RequestVersionSnapshot>;
    const ids = datasets.filter((d) => d.revisionNo === v.revisionNo).map((d) => d.id);
    if (snap.datasetId && !ids.includes(snap.datasetId)) ids.unshift(snap.datasetId);
    const rerunIds = await rerunIdsOf(r, v, versions[i + 1]);
    const who = v.createdById ? people.get(v.createdById) : undefined;
    out.push({
      revisionNo: v.revisionNo, createdAt: iso(v.createdAt) ?? '', createdBy: who ? { id: who.id, name: who.name, email: who.email } : null,
      reason: v.reason, datasetIds: ids, rerunIds,
    });
  }
  return out;
}

/** The request's filed revisions, oldest first. */
export async function listVersions(r: ReviewRequest): Promise<RequestVersionSummary[]> {
  return summaries(r, await RequestVersion.findAll({ where: { requestId: r.id }, order: [['revisionNo', 'ASC']] }));
}

/** One revision with its snapshot, or null. */
export async function getVersion(r: ReviewRequest, revisionNo: number): Promise<RequestVersionDetail | null> {
  const all = await RequestVersion.findAll({ where: { requestId: r.id }, order: [['revisionNo', 'ASC']] });
  const i = all.findIndex((v) => v.revisionNo === revisionNo);
  if (i < 0) return null;
  const [summary] = await summaries(r, all.slice(i, i + 2));
  return { ...summary, snapshot: all[i].snapshot as Partial<RequestVersionSnapshot> };
}
