/**
 * Assigning requests to reviewers: the conflict-of-interest rule, candidate suggestions,
 * assign/reassign by the head and decline by the reviewer. State changes go through
 * moveRequest (audited); people are told through notifyEvent.
 */
import type { Request } from 'express';
import { DESIGN_KIND_LABELS } from '../../shared/review/plan-mapping';
import type { DesignKind } from '../../shared/api/types';
import type { AssignBody, AssignmentCandidate, DeclineBody } from '../../shared/api/workflow';
import { badRequest, HttpError, staleVersion, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { Assignment, Department, Office, ReviewRequest, User } from '../models/index';
import { audit } from './audit';
import { notifyEvent } from './notify-event';
import { toOfficeSettings } from './office-settings';
import { activeAssignment } from './request-access';
import { moveRequest } from './request-state';
import { addDays, isoDay, officeReviewers, openCounts } from './workload';

/** What the conflict rule looks at, besides the reviewer. */
export interface ConflictContext {
  submitterId: string;
  submitterDepartmentId: string | null;
  requestDepartmentId: string | null;
  /** Reviewers who declined this request earlier because of a conflict of interest. */
  declinedWithConflict: ReadonlySet<string>;
  /** Department names by id, for the message. */
  departmentNames: ReadonlyMap<string, string>;
}

/** Why the reviewer may not review the request (a plain sentence), or null when they may. */
export function conflictReason(reviewer: { id: string; name: string; departmentId: string | null }, c: ConflictContext): string | null {
  const dept = (id: string) => c.departmentNames.get(id) ?? 'the same department';
  if (reviewer.id === c.submitterId) return `${reviewer.name} filed this request and cannot review their own work.`;
  if (reviewer.departmentId && reviewer.departmentId === c.submitterDepartmentId) {
    return `${reviewer.name} works in the submitter's department (${dept(reviewer.departmentId)}).`;
  }
  if (reviewer.departmentId && reviewer.departmentId === c.requestDepartmentId) {
    return `${reviewer.name} works in the department the request comes from (${dept(reviewer.departmentId)}).`;
  }
  if (c.declinedWithConflict.has(reviewer.id)) return `${reviewer.name} declined this request earlier, declaring a conflict of interest.`;
  return null;
}

const words = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim();

/** Whether declared expertise (free words such as "repeated measures" or design kinds) covers the design kind. */
export function expertiseMatches(expertise: readonly string[], kind: DesignKind | null): boolean {
  if (!kind) return false;
  const kindWords = words(kind);
  const label = words(DESIGN_KIND_LABELS[kind]);
  return expertise.some((e) => {
    const w = words(e);
    return w !== '' && (w === kindWords || w === label || ` ${label} `.includes(` ${w} `));
  });
}

/** Loads what the conflict rule needs for a request. */
export async function conflictContext(r: ReviewRequest): Promise<ConflictContext> {
  const submitter = await User.findByPk(r.submitterId, { attributes: ['id', 'departmentId'] });
  const declined = await Assignment.findAll({ attributes: ['reviewerId', 'declineReason', 'conflictNote'], where: { requestId: r.id, declined: true } });
  const departments = await Department.findAll({ attributes: ['id', 'name'], where: { officeId: r.officeId } });
  return {
    submitterId: r.submitterId,
    submitterDepartmentId: submitter?.departmentId ?? null,
    requestDepartmentId: r.departmentId,
    declinedWithConflict: new Set(declined.filter((a) => a.declineReason === 'conflict').map((a) => a.reviewerId)),
    departmentNames: new Map(departments.map((d) => [d.id, d.name])),
  };
}

/** Ranks candidates: without conflict first, then expertise match, then lowest load, then name; marks the first free one as suggested. */
export function rankCandidates(cands: Omit<AssignmentCandidate, 'suggested'>[]): AssignmentCandidate[] {
  const sorted = [...cands].sort((a, b) =>
    Number(a.conflict !== null) - Number(b.conflict !== null)
    || Number(b.expertiseMatch) - Number(a.expertiseMatch)
    || a.openCount - b.openCount
    || a.reviewer.name.localeCompare(b.reviewer.name));
  return sorted.map((c, i) => ({ ...c, suggested: i === 0 && c.conflict === null }));
}

/** The office's reviewers for a request, ranked, with conflicts and the suggestion. */
export async function listCandidates(r: ReviewRequest): Promise<AssignmentCandidate[]> {
  const [reviewers, counts, ctx] = await Promise.all([officeReviewers(r.officeId), openCounts(r.officeId), conflictContext(r)]);
  return rankCandidates(reviewers.map((u) => ({
    reviewer: { id: u.id, name: u.name, email: u.email },
    openCount: counts.get(u.id) ?? 0,
    expertiseMatch: expertiseMatches(u.expertise ?? [], r.designKind),
    expertise: u.expertise ?? [],
    conflict: conflictReason(u, ctx),
  })));
}

/** Assigns (state filed) or reassigns (assigned, in-review) the request to a reviewer; the previous assignment is retired. */
export async function assignReviewer(me: CurrentUser, r: ReviewRequest, b: AssignBody, req?: Request): Promise<Assignment> {
  if (b.version !== r.version) throw staleVersion();
  if (!['filed', 'assigned', 'in-review'].includes(r.state)) {
    throw wrongState(`A request that is ${r.state.replace('-', ' ')} cannot be assigned; only filed, assigned or in-review requests can.`);
  }
  const reviewer = (await officeReviewers(r.officeId)).find((u) => u.id === b.reviewerId);
  if (!reviewer) throw badRequest('reviewerId is not an active reviewer of this office.', { reviewerId: 'Choose one of the listed reviewers' });
  const conflict = conflictReason(reviewer, await conflictContext(r));
  if (conflict) throw new HttpError(409, 'conflict-of-interest', `Conflict of interest: ${conflict} Choose another reviewer.`, { reviewerId: conflict });

  const office = await Office.findByPk(r.officeId, { rejectOnEmpty: true });
  const today = isoDay(new Date());
  const dueAt = b.dueAt ?? addDays(today, toOfficeSettings(office).serviceLevelDays);
  if (dueAt < today) throw badRequest('dueAt must be today or later.', { dueAt: `dueAt must be today (${today}) or later` });

  const previous = activeAssignment(r);
  const from = r.state;
  const created = await r.sequelize.transaction(async (transaction) => {
    if (previous) await previous.update({ active: false }, { transaction });
    const a = await Assignment.create({
      requestId: r.id, reviewerId: reviewer.id, assignedById: me.id, dueAt, declinedAt: null, conflictNote: null, completedAt: null,
    }, { transaction });
    // Reassigning keeps the state (assigned→assigned, in-review→in-review); flag it changed so the version still moves.
    r.changed('state', true);
    await moveRequest(r, from === 'filed' ? 'assigned' : from, {
      actorId: me.id, version: b.version, req, transaction,
      details: { reviewerId: reviewer.id, reviewer: reviewer.name, dueAt, previousReviewerId: previous?.reviewerId ?? null, reassigned: Boolean(previous), note: b.note ?? null },
    });
    return a;
  });
  await notifyEvent('request.assigned', r.id, { actorId: me.id, extra: { dueAt, ...(b.note ? { note: b.note } : {}) } });
  return created;
}

/** The assigned reviewer declines: the assignment is retired (a conflict bars them from the request) and the request goes back to filed. */
export async function declineAssignment(me: CurrentUser, r: ReviewRequest, b: DeclineBody, req?: Request): Promise<void> {
  const a = activeAssignment(r);
  if (!a || a.reviewerId !== me.id) throw new HttpError(403, 'forbidden', 'Only the reviewer assigned to this request can decline it.');
  if (!['assigned', 'in-review'].includes(r.state)) throw wrongState(`A request that is ${r.state.replace('-', ' ')} can no longer be declined.`);
  await r.sequelize.transaction(async (transaction) => {
    await a.update({ active: false, declined: true, declinedAt: new Date(), declineReason: b.reason, conflictNote: b.reason === 'conflict' ? b.note : null }, { transaction });
    await moveRequest(r, 'filed', { actorId: me.id, req, transaction, details: { declined: true, reason: b.reason, note: b.note } });
  });
  await audit({ actorId: me.id, action: 'assignment.declined', entityType: 'assignment', entityId: a.id, details: { requestId: r.id, reference: r.reference, reason: b.reason, note: b.note } }, req);
  await notifyEvent('assignment.declined', r.id, { actorId: me.id, extra: { reason: b.reason, note: b.note } });
}
