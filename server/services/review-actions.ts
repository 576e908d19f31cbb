/**
 * The reviewer's two ways out of a review: return the request for revision with a list of
 * required changes, or decide (every criterion judged, the verdicts consistent with the
 * decision, the decision resting on a completed rerun).
 */
import type { Request } from 'express';
import { QueryTypes } from 'sequelize';
import type { RevisionRequestView } from '../../shared/api/review-types';
import { CRITERIA, type Decision } from '../../shared/api/types';
import type { DecisionView } from '../../shared/api/workflow';
import { forbidden, HttpError, notFound, staleVersion, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { Assignment, ChecklistEntry, DecisionRow, User, type ReviewRequest } from '../models/index';
import { revisionRequests } from '../models/revision-request';
import { notifyEvent } from './notify-event';
import { iso } from './paging';
import { activeAssignment } from './request-access';
import { moveRequest } from './request-state';
import { findRerun, latestDoneRerun } from './reruns';

function assertAssignedInReview(me: CurrentUser, r: ReviewRequest, what: string): void {
  if (!(me.roles.includes('reviewer') && activeAssignment(r)?.reviewerId === me.id)) throw forbidden(`Only the assigned reviewer can ${what}.`);
  if (r.state !== 'in-review') throw wrongState(`A request must be in review to ${what}; this one is ${r.state.replace('-', ' ')}.`);
}

const person = (u: User | null | undefined) => (u ? { id: u.id, name: u.name, email: u.email } : null);

/** Returns the request to its submitter with the required changes; notifies the submitter. */
export async function requestRevision(
  me: CurrentUser, r: ReviewRequest, body: { changes: string[]; message?: string; version: number }, req?: Request,
): Promise<RevisionRequestView> {
  assertAssignedInReview(me, r, 'request a revision');
  if (body.version !== r.version) throw staleVersion();
  const Rows = revisionRequests();
  const message = body.message ?? '';
  const row = await r.sequelize.transaction(async (transaction) => {
    const created = await Rows.create({ requestId: r.id, revisionNo: r.revisionNo, changes: body.changes, message, requestedById: me.id }, { transaction });
    await moveRequest(r, 'revision-requested', { actorId: me.id, version: body.version, details: { changes: body.changes, revisionNo: r.revisionNo }, req, transaction });
    return created;
  });
  await notifyEvent('request.revision-requested', r.id, {
    actorId: me.id, extra: { changes: body.changes.map((c) => `- ${c}`).join('\n'), ...(message ? { note: message } : {}) },
  });
  return { changes: row.changes, message: row.message, requestedBy: person(await User.findByPk(me.id)), requestedAt: iso(row.createdAt) ?? '', revisionNo: row.revisionNo };
}

/** The latest required changes, or 404 when the request was never returned for revision. */
export async function latestRevisionRequest(r: ReviewRequest): Promise<RevisionRequestView> {
  const row = await revisionRequests().findOne({ where: { requestId: r.id }, order: [['createdAt', 'DESC'], ['id', 'DESC']] });
  if (!row) throw notFound('A revision request for this review request');
  const by = row.requestedById ? await User.findByPk(row.requestedById) : null;
  return { changes: row.changes, message: row.message, requestedBy: person(by), requestedAt: iso(row.createdAt) ?? '', revisionNo: row.revisionNo };
}

/**
 * Records the decision: every criterion needs a verdict (422 naming the missing ones), an
 * endorsement cannot stand on a criterion judged not met (422), and the decision rests on a
 * completed rerun of the current revision. Moves the request to decided and notifies the submitter.
 */
export async function decide(
  me: CurrentUser, r: ReviewRequest,
  body: { decision: Decision; conditions: string[]; rationale: string; rerunId?: string; version: number }, req?: Request,
): Promise<DecisionView> {
  assertAssignedInReview(me, r, 'record a decision');
  if (body.version !== r.version) throw staleVersion();
  const entries = await ChecklistEntry.findAll({ where: { requestId: r.id } });
  const verdicts = new Map(entries.map((e) => [e.criterion, e.verdict]));
  const missing = CRITERIA.filter((c) => !verdicts.get(c));
  if (missing.length) {
    throw new HttpError(422, 'checklist-incomplete', `Every checklist criterion needs a verdict before deciding; missing: ${missing.join(', ')}.`,
      Object.fromEntries(missing.map((c) => [`checklist.${c}`, 'No verdict yet'])));
  }
  const notMet = CRITERIA.filter((c) => verdicts.get(c) === 'not-met');
  if (body.decision === 'endorse' && notMet.length) {
    throw new HttpError(422, 'inconsistent-decision',
      `An unconditional endorsement cannot rest on criteria judged not met (${notMet.join(', ')}); endorse with conditions, ask for a revision, or change those verdicts.`,
      Object.fromEntries([['decision', 'Not consistent with the checklist'], ...notMet.map((c) => [`checklist.${c}`, 'Judged not met'])]));
  }
  const rerun = body.rerunId ? await findRerun(body.rerunId) : await latestDoneRerun(r);
  if (body.rerunId && (!rerun || rerun.requestId !== r.id || rerun.status !== 'done')) {
    throw new HttpError(422, 'invalid-rerun', 'rerunId must name a completed rerun of this request.', { rerunId: 'Not a completed rerun of this request' });
  }
  if (!rerun) throw new HttpError(422, 'no-rerun', 'Rerun the analysis on the current revision before deciding: the decision must rest on a completed rerun.', { rerunId: 'No completed rerun yet' });

  const decidedAt = new Date();
  const row = await r.sequelize.transaction(async (transaction) => {
    const created = await DecisionRow.create({
      requestId: r.id, decision: body.decision, conditions: body.conditions, rationale: body.rationale, decidedById: me.id, decidedAt,
    }, { transaction });
    await r.sequelize.query('UPDATE decisions SET rerunId = ? WHERE id = ?', { replacements: [rerun.id, created.id], type: QueryTypes.UPDATE, transaction });
    await moveRequest(r, 'decided', { actorId: me.id, version: body.version, details: { decision: body.decision, decisionId: created.id, rerunId: rerun.id }, req, transaction });
    const a = activeAssignment(r);
    if (a) await Assignment.update({ completedAt: decidedAt }, { where: { id: a.id }, transaction });
    return created;
  });
  await notifyEvent('request.decided', r.id, { actorId: me.id, extra: { decision: body.decision } });
  return { decision: row.decision, conditions: row.conditions, rationale: row.rationale, decidedBy: person(await User.findByPk(me.id)), decidedAt: iso(decidedAt) ?? '', rerunId: rerun.id };
}

/** The request's latest decision, or 404 before one is made. */
export async function currentDecision(r: ReviewRequest): Promise<DecisionView> {
  const row = await DecisionRow.findOne({ attributes: { include: ['rerunId'] }, where: { requestId: r.id }, order: [['decidedAt', 'DESC'], ['createdAt', 'DESC']] });
  if (!row) throw notFound('A decision on this request');
  const by = row.decidedById ? await User.findByPk(row.decidedById) : null;
  return {
    decision: row.decision, conditions: row.conditions, rationale: row.rationale, decidedBy: person(by), decidedAt: iso(row.decidedAt) ?? '',
    rerunId: (row.get('rerunId') as string | null) ?? null,
  };
}
