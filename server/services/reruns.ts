/**
 * Reruns: starting the engine on a request's stored plan and data (always in a worker
 * thread), storing every run with its plan snapshot, data hash, engine version and
 * timings, reproducing a stored run, and the views the API returns.
 */
import { createHash } from 'node:crypto';
import type { Request } from 'express';
import { Op, QueryTypes } from 'sequelize';
import type { ReproduceResult } from '../../shared/api/review-types';
import type { PersonRef } from '../../shared/api/types';
import type { RerunDetail, RerunSummary } from '../../shared/api/workflow';
import { InputError, type AnalysisPlan, type RerunResult } from '../../shared/stats/contract';
import { ENGINE_VERSION } from '../../shared/stats/version';
import { runInWorker } from '../engine-worker/run-in-worker';
import { forbidden, HttpError, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { Dataset, Rerun, User, type ReviewRequest } from '../models/index';
import { audit } from './audit';
import { readerName } from './datasets';
import { iso } from './paging';
import { activeAssignment } from './request-access';
import { moveRequest } from './request-state';
import { liveState, openLive, publish } from './rerun-live';
import { filedEnginePlan, mergePlan } from './rerun-plan';
import { resultDifferences } from './result-compare';

/** States in which a new rerun may be started. */
const RERUN_STATES = ['assigned', 'in-review'] as const;

/** Completion of reruns started by this process, for callers that must wait (reproduce). */
const finished = new Map<string, Promise<void>>();

/** The assigned reviewer, or the head of the request's office. */
export function canRunReruns(me: CurrentUser, r: ReviewRequest): boolean {
  if (me.roles.includes('head') && r.officeId === me.officeId && r.submitterId !== me.id) return true;
  return me.roles.includes('reviewer') && activeAssignment(r)?.reviewerId === me.id;
}

/** True when the caller sees only completed reruns (the submitter, and anyone outside the review). */
export function seesCompletedOnly(me: CurrentUser, r: ReviewRequest): boolean {
  return !canRunReruns(me, r) && !me.roles.includes('admin');
}

/** The revision round a rerun belongs to (reruns.revisionNo, migration 0005; not on the core model). */
const revisionOf = (row: Rerun): number => Number(row.get('revisionNo') ?? 1);
const withRevision = { attributes: { include: ['revisionNo'] } };

async function setRevision(id: string, revisionNo: number): Promise<void> {
  await Rerun.sequelize!.query('UPDATE reruns SET revisionNo = ? WHERE id = ?', { replacements: [revisionNo, id], type: QueryTypes.UPDATE });
}

/** The data file a new rerun uses: the newest of the current revision (or the latest earlier one kept). */
export async function currentDataset(r: ReviewRequest): Promise<Dataset | null> {
  return Dataset.scope('withBytes').findOne({
    where: { requestId: r.id, revisionNo: { [Op.lte]: r.revisionNo } },
    order: [['revisionNo', 'DESC'], ['createdAt', 'DESC'], ['id', 'DESC']],
  });
}

const round1 = (x: number) => Math.round(x * 10) / 10;

function failureMessage(err: unknown): string {
  if (err instanceof InputError) return err.message.includes(err.field) ? err.message : `${err.field}: ${err.message}`;
  return err instanceof Error ? err.message : String(err);
}

/** Runs a stored rerun row in a worker and records the outcome; never throws. */
function execute(row: Rerun, data: Uint8Array, filename: string, actorId: string): Promise<void> {
  const id = row.id;
  const t0 = performance.now();
  openLive(id);
  let running: Promise<unknown> | null = null;
  const job = (async () => {
    try {
      const out = await runInWorker({ plan: row.planSnapshot, data, filename }, (fraction, stage) => {
        // Awaited before the final write; a failure here only loses the intermediate status.
        if (stage !== 'queued' && !running) running = Rerun.update({ status: 'running' }, { where: { id } }).catch(() => undefined);
        publish(id, { status: stage === 'queued' ? 'queued' : 'running', progress: Math.max(0, Math.min(1, fraction)), stage });
      });
      await running;
      const timings = { queuedMs: round1(out.timings.queuedMs), parseMs: round1(out.timings.parseMs), totalMs: round1(performance.now() - t0) };
      await Rerun.update(
        { status: 'done', result: out.result as unknown as Record<string, unknown>, timings, engineVersion: out.result.engine, finishedAt: new Date(), error: null },
        { where: { id } },
      );
      await audit({ actorId, action: 'rerun.done', entityType: 'rerun', entityId: id, details: { requestId: row.requestId, engineVersion: out.result.engine, timings } });
      publish(id, { status: 'done', progress: 1, stage: 'done' });
    } catch (err) {
      const message = failureMessage(err);
      try {
        await running;
        await Rerun.update({ status: 'failed', error: message, finishedAt: new Date(), timings: { totalMs: round1(performance.now() - t0) } }, { where: { id } });
        await audit({ actorId, action: 'rerun.failed', entityType: 'rerun', entityId: id, details: { requestId: row.requestId, error: message } });
      } catch {
        // The database is gone (shutdown): the row stays "running" and is reported as interrupted when read.
      }
      publish(id, { status: 'failed', progress: 1, stage: 'failed', error: message });
    }
  })();
  finished.set(id, job);
  void job.finally(() => finished.delete(id));
  return job;
}

async function createAndRun(
  me: CurrentUser,
  r: ReviewRequest,
  fields: { label: string; plan: AnalysisPlan; dataset: Dataset; revisionNo: number },
  req?: Request,
): Promise<Rerun> {
  const bytes = new Uint8Array(fields.dataset.bytes);
  const sha = createHash('sha256').update(bytes).digest('hex');
  if (sha !== fields.dataset.sha256) {
    throw new HttpError(409, 'data-integrity', `The stored data file ${fields.dataset.filename} no longer matches its recorded SHA-256; the rerun was not started.`);
  }
  const row = await Rerun.create({
    requestId: r.id, datasetId: fields.dataset.id, label: fields.label, status: 'queued', engineVersion: ENGINE_VERSION,
    planSnapshot: fields.plan as unknown as Record<string, unknown>, dataSha256: sha, timings: null, result: null, error: null,
    startedById: me.id, startedAt: new Date(), finishedAt: null,
  });
  await setRevision(row.id, fields.revisionNo);
  await audit({
    actorId: me.id, action: 'rerun.started', entityType: 'rerun', entityId: row.id,
    details: { requestId: r.id, reference: r.reference, label: fields.label, datasetId: fields.dataset.id, dataSha256: sha, revisionNo: fields.revisionNo },
  }, req);
  // The stored format (sniffed at upload) decides the reader, not a possibly misleading file name.
  void execute(row, bytes, readerName(fields.dataset.format ?? null, fields.dataset.filename), me.id);
  return (await Rerun.findByPk(row.id, withRevision))!;
}

/**
 * Starts a rerun of the request's plan (with the override merged) on its current data.
 * The first rerun of an assigned request moves it to in review.
 */
export async function startRerun(
  me: CurrentUser,
  r: ReviewRequest,
  body: { label?: string; planOverride?: Record<string, unknown> },
  req?: Request,
): Promise<Rerun> {
  if (!canRunReruns(me, r)) throw forbidden('Only the assigned reviewer or the office head can start a rerun.');
  if (!(RERUN_STATES as readonly string[]).includes(r.state)) {
    throw wrongState(`Reruns are started while a request is assigned or in review; this one is ${r.state.replace('-', ' ')}.`);
  }
  const plan = mergePlan(filedEnginePlan(r), body.planOverride);
  const dataset = await currentDataset(r);
  if (!dataset) throw new HttpError(422, 'no-data', 'The request has no data file, so there is nothing to rerun.');
  // Labels count within the revision round: the first rerun of each revision is that revision "as filed".
  const earlier = await Rerun.count({ where: { requestId: r.id, revisionNo: r.revisionNo } as never });
  const label = body.label ?? (earlier === 0 ? 'as filed' : `variant ${earlier + 1}`);
  const row = await createAndRun(me, r, { label, plan, dataset, revisionNo: r.revisionNo }, req);
  if (r.state === 'assigned') await moveRequest(r, 'in-review', { actorId: me.id, details: { rerunId: row.id }, req });
  return row;
}

/** Runs a stored rerun again with the same plan snapshot and data, waits, and compares the results. */
export async function reproduceRerun(me: CurrentUser, r: ReviewRequest, original: Rerun, req?: Request): Promise<ReproduceResult> {
  if (!canRunReruns(me, r)) throw forbidden('Only the assigned reviewer or the office head can reproduce a rerun.');
  if (original.status !== 'done') throw wrongState('Only a completed rerun can be reproduced; this one has no result.');
  const dataset = original.datasetId ? await Dataset.scope('withBytes').findByPk(original.datasetId) : null;
  if (!dataset) throw wrongState('The data file of this rerun is no longer stored, so it cannot be reproduced.');
  if (dataset.sha256 !== original.dataSha256) throw new HttpError(409, 'data-integrity', 'The stored data file no longer matches the hash recorded with this rerun.');
  const row = await createAndRun(me, r, {
    label: `reproduction of “${original.label}”`.slice(0, 200), plan: original.planSnapshot as unknown as AnalysisPlan, dataset, revisionNo: revisionOf(original),
  }, req);
  await finished.get(row.id);
  const fresh = (await Rerun.findByPk(row.id, withRevision))!;
  const differences = fresh.status === 'done'
    ? resultDifferences(original.result, fresh.result)
    : [`the reproduction failed: ${fresh.error ?? 'unknown error'}`];
  if (fresh.status === 'done' && fresh.engineVersion !== original.engineVersion) {
    differences.unshift(`engine version ${original.engineVersion ?? '?'} → ${fresh.engineVersion ?? '?'}`);
  }
  const identical = differences.length === 0;
  await audit({ actorId: me.id, action: 'rerun.reproduced', entityType: 'rerun', entityId: original.id, details: { reproductionId: row.id, identical, differences } }, req);
  const [summary] = await toSummaries([fresh]);
  return { originalId: original.id, rerun: summary!, identical, differences };
}

/** When this process started: a rerun still open from before then can no longer finish. */
const PROCESS_STARTED = new Date();

/**
 * A row marked queued or running that no worker of this process is running, and that was
 * started before this process, was interrupted by a restart: it is marked failed. The row is
 * re-read first, since the caller's copy may predate the rerun's end.
 */
async function settleOrphan(row: Rerun): Promise<void> {
  if (row.status !== 'queued' && row.status !== 'running') return;
  if (liveState(row.id) || finished.has(row.id)) return;
  const fresh = await Rerun.findByPk(row.id, withRevision);
  if (!fresh) return;
  if ((fresh.status === 'queued' || fresh.status === 'running') && fresh.startedAt && fresh.startedAt < PROCESS_STARTED) {
    fresh.status = 'failed';
    fresh.error = 'The server stopped before this rerun finished; start it again.';
    fresh.finishedAt = new Date();
    await Rerun.update({ status: fresh.status, error: fresh.error, finishedAt: fresh.finishedAt }, { where: { id: row.id, status: ['queued', 'running'] } });
  }
  row.set(fresh.get({ plain: true }), { raw: true });
}

async function people(ids: (string | null)[]): Promise<Map<string, PersonRef>> {
  const wanted = [...new Set(ids.filter((x): x is string => !!x))];
  const rows = wanted.length ? await User.findAll({ where: { id: wanted }, attributes: ['id', 'name', 'email'] }) : [];
  return new Map(rows.map((u) => [u.id, { id: u.id, name: u.name, email: u.email }]));
}

function summary(row: Rerun, who: Map<string, PersonRef>): RerunSummary {
  return {
    id: row.id, label: row.label, status: row.status, engineVersion: row.engineVersion, dataSha256: row.dataSha256, datasetId: row.datasetId,
    revisionNo: revisionOf(row), startedBy: row.startedById ? who.get(row.startedById) ?? null : null,
    startedAt: iso(row.startedAt), finishedAt: iso(row.finishedAt), timings: (row.timings as RerunSummary['timings']) ?? null, error: row.error,
  };
}

/** API summaries of rerun rows (people resolved in one query). */
export async function toSummaries(rows: Rerun[]): Promise<RerunSummary[]> {
  for (const row of rows) await settleOrphan(row);
  const who = await people(rows.map((x) => x.startedById));
  return rows.map((row) => summary(row, who));
}

/** API detail of one rerun, with the live progress while it runs. */
export async function toDetail(row: Rerun): Promise<RerunDetail> {
  const [s] = await toSummaries([row]);
  const live = liveState(row.id);
  const done = row.status === 'done' || row.status === 'failed';
  return {
    ...s!, requestId: row.requestId, planSnapshot: row.planSnapshot as unknown as AnalysisPlan, result: (row.result as unknown as RerunResult) ?? null,
    progress: done ? 1 : live?.progress ?? 0, stage: done ? row.status : live?.stage ?? null,
  };
}

/** Reruns of a request the caller may see, newest first. */
export async function listReruns(me: CurrentUser, r: ReviewRequest): Promise<RerunSummary[]> {
  const rows = await Rerun.findAll({
    ...withRevision,
    where: { requestId: r.id, ...(seesCompletedOnly(me, r) ? { status: 'done' } : {}) },
    order: [['createdAt', 'DESC'], ['id', 'ASC']],
  });
  return toSummaries(rows);
}

/** One rerun row with its revision round, or null. */
export async function findRerun(id: string): Promise<Rerun | null> {
  return Rerun.findByPk(id, withRevision);
}

/** The newest completed rerun of the request's current revision round, or null. */
export async function latestDoneRerun(r: ReviewRequest): Promise<Rerun | null> {
  const rows = await Rerun.findAll({ ...withRevision, where: { requestId: r.id, status: 'done' }, order: [['finishedAt', 'DESC'], ['createdAt', 'DESC']] });
  return rows.find((x) => revisionOf(x) === r.revisionNo) ?? null;
}

/** The live event state of a rerun: from memory while it runs here, else from the stored row. */
export async function currentEvent(row: Rerun): Promise<{ status: RerunSummary['status']; progress: number; stage: string | null; error?: string }> {
  const live = liveState(row.id);
  if (live) return live;
  await settleOrphan(row);
  const final = row.status === 'done' || row.status === 'failed';
  return { status: row.status, progress: final ? 1 : 0, stage: final ? row.status : null, ...(row.error ? { error: row.error } : {}) };
}

/** Waits for a rerun started by this process to finish (resolves at once otherwise). */
export async function rerunSettled(id: string): Promise<void> {
  await finished.get(id);
}
