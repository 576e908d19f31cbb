/** Review requests: listing by scope, detail, creating drafts and editing them. */
import { literal, Op, UniqueConstraintError, type WhereOptions } from 'sequelize';
import type { RequestCreateBody, RequestListQuery, RequestPatchBody, RequestScope } from '../../shared/api/schemas';
import type { Page, RequestDetail, RequestSummary } from '../../shared/api/types';
import { badRequest, forbidden, staleVersion, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { Assignment, Dataset, Department, Office, ReviewRequest, User } from '../models/index';
import { activeAssignment, canSee, EDITABLE_STATES, permissions, visibleWhere } from './request-access';
import { iso, likeContains, limits, toPage } from './paging';

const includes = () => [
  { model: User, as: 'submitter', attributes: ['id', 'name', 'email'] },
  { model: Department, as: 'department', attributes: ['id', 'name'] },
  { model: Assignment, as: 'assignments', required: false, include: [{ model: User, as: 'reviewer', attributes: ['id', 'name', 'email'] }] },
];

/** API summary of a loaded request (with submitter, department and assignments). */
export function toSummary(r: ReviewRequest): RequestSummary {
  const a = activeAssignment(r);
  const person = (u: User | undefined) => (u ? { id: u.id, name: u.name, email: u.email } : { id: '', name: '', email: '' });
  return {
    id: r.id, reference: r.reference, title: r.title, state: r.state, designKind: r.designKind, department: r.department?.name ?? null,
    submitter: person(r.submitter), reviewer: a?.reviewer ? person(a.reviewer) : null,
    createdAt: iso(r.createdAt) ?? '', filedAt: iso(r.filedAt), dueAt: a?.dueAt ?? null, deadline: r.deadline, updatedAt: iso(r.updatedAt) ?? '',
  };
}

/** The scope used when the client names none: the first queue the person's roles give them. */
export function defaultScope(me: CurrentUser): RequestScope {
  if (me.roles.includes('submitter')) return 'mine';
  if (me.roles.includes('reviewer')) return 'assigned';
  return 'all';
}

async function assignedRequestIds(me: CurrentUser): Promise<string[]> {
  if (!me.roles.includes('reviewer')) return [];
  const rows = await Assignment.findAll({ attributes: ['requestId'], where: { reviewerId: me.id, active: true, declined: false } });
  return rows.map((a) => a.requestId);
}

/**
 * Lists requests in a scope: mine (own, any role), intake (head: filed, awaiting assignment),
 * assigned (reviewer: assigned to me), all (head and admin: every non-draft request of the office).
 */
export async function listRequests(me: CurrentUser, q: RequestListQuery): Promise<Page<RequestSummary>> {
  const scope = q.scope ?? defaultScope(me);
  const assigned = await assignedRequestIds(me);
  const where: WhereOptions[] = [visibleWhere(me, assigned)];
  if (scope === 'mine') where.push({ submitterId: me.id });
  else if (scope === 'intake') {
    if (!me.roles.includes('head')) throw forbidden('The intake queue is for the office head.');
    where.push({ officeId: me.officeId, state: 'filed' });
  } else if (scope === 'assigned') {
    if (!me.roles.includes('reviewer')) throw forbidden('The assigned queue is for reviewers.');
    where.push({ id: assigned, state: { [Op.ne]: 'draft' } });
  } else {
    if (!me.roles.includes('head') && !me.roles.includes('admin')) throw forbidden('Only the office head and administrators see all requests.');
    where.push({ officeId: me.officeId, state: { [Op.ne]: 'draft' } });
  }
  if (q.state?.length) where.push({ state: q.state });
  if (q.q) where.push({ [Op.or]: [{ title: { [Op.like]: likeContains(q.q) } }, { reference: { [Op.like]: likeContains(q.q) } }] });
  const count = await ReviewRequest.count({ where: { [Op.and]: where } });
  const rows = await ReviewRequest.findAll({
    where: { [Op.and]: where }, include: includes(),
    order: [[sortExpression(q.sort ?? 'updatedAt'), q.dir === 'asc' ? 'ASC' : 'DESC'], ['id', 'ASC']],
    ...limits(q.page, q.pageSize),
  });
  return toPage(rows.map(toSummary), count, q.page, q.pageSize);
}

/**
 * ORDER BY expression for a list sort key. Columns of related rows are sorted through
 * correlated subqueries, which stay correct under the paged subquery Sequelize builds
 * for the has-many assignments include.
 */
function sortExpression(key: NonNullable<RequestListQuery['sort']>): string | ReturnType<typeof literal> {
  const activeAssignment = 'FROM assignments a WHERE a.requestId = `ReviewRequest`.`id` AND a.active = 1 AND a.declined = 0 ORDER BY a.createdAt DESC LIMIT 1';
  switch (key) {
    case 'department':
      return literal('(SELECT d.name FROM departments d WHERE d.id = `ReviewRequest`.`departmentId`)');
    case 'submitter':
      return literal('(SELECT u.name FROM users u WHERE u.id = `ReviewRequest`.`submitterId`)');
    case 'reviewer':
      return literal(`(SELECT u.name FROM users u WHERE u.id = (SELECT a.reviewerId ${activeAssignment}))`);
    case 'dueAt':
      return literal(`(SELECT a.dueAt ${activeAssignment})`);
    default:
      return key;
  }
}

/** Loads a request the caller may see, or null (unknown and invisible look the same). */
export async function findVisibleRequest(me: CurrentUser, id: string): Promise<ReviewRequest | null> {
  const r = await ReviewRequest.findByPk(id, { include: includes() });
  return r && canSee(me, r) ? r : null;
}

/** Detail shape, with datasets (without their bytes). */
export async function toDetail(me: CurrentUser, r: ReviewRequest): Promise<RequestDetail> {
  const datasets = await Dataset.findAll({ where: { requestId: r.id }, order: [['createdAt', 'ASC']] });
  return {
    ...toSummary(r),
    purpose: r.purpose, decisionInformed: r.decisionInformed, audience: r.audience, samplingNotes: r.samplingNotes, plan: r.plan,
    reported: (r.reported ?? []) as RequestDetail['reported'], departmentId: r.departmentId ?? null, revisionNo: r.revisionNo,
    datasets: datasets.map((d) => ({ id: d.id, filename: d.filename, sha256: d.sha256, rows: d.rowCount, columns: d.columns.map((c) => c.name), uploadedAt: iso(d.createdAt) ?? '' })),
    version: r.version,
    can: permissions(me, r),
  };
}

/** Next free reference for the office and year, e.g. HV-2026-007. */
export async function nextReference(officeId: string, at = new Date()): Promise<string> {
  const office = await Office.findByPk(officeId);
  const prefix = `${office?.settings.referencePrefix ?? 'REQ'}-${at.getUTCFullYear()}-`;
  const rows = await ReviewRequest.findAll({ attributes: ['reference'], where: { reference: { [Op.like]: `${prefix}%` } } });
  const max = rows.reduce((m, r) => Math.max(m, Number(r.reference.slice(prefix.length)) || 0), 0);
  return `${prefix}${String(max + 1).padStart(3, '0')}`;
}

async function checkDepartment(officeId: string, departmentId: string | null | undefined): Promise<void> {
  if (departmentId && !(await Department.findOne({ where: { id: departmentId, officeId } }))) {
    throw badRequest('Department must be one of the listed departments', { departmentId: 'Unknown department' });
  }
}

/** Creates a draft owned by the caller; retries the reference if two drafts race for it. */
export async function createDraft(me: CurrentUser, body: RequestCreateBody): Promise<ReviewRequest> {
  await checkDepartment(me.officeId, body.departmentId);
  for (let attempt = 0; ; attempt++) {
    try {
      const r = await ReviewRequest.create({
        officeId: me.officeId, reference: await nextReference(me.officeId), title: body.title, state: 'draft',
        designKind: body.designKind ?? null, departmentId: body.departmentId === undefined ? me.departmentId : body.departmentId,
        submitterId: me.id, purpose: body.purpose ?? '', decisionInformed: body.decisionInformed ?? '', audience: body.audience ?? '',
        samplingNotes: body.samplingNotes ?? '', deadline: body.deadline ?? null, plan: body.plan ?? null, reported: null, filedAt: null, decidedAt: null,
      });
      return (await ReviewRequest.findByPk(r.id, { include: includes() }))!;
    } catch (err) {
      if (!(err instanceof UniqueConstraintError) || attempt >= 4) throw err;
    }
  }
}

/** Applies the owner's edit to an editable request with optimistic locking; returns the changed field names. */
export async function patchRequest(me: CurrentUser, r: ReviewRequest, body: RequestPatchBody): Promise<string[]> {
  if (r.submitterId !== me.id) throw forbidden('Only the submitter can edit a request.');
  if (!EDITABLE_STATES.includes(r.state)) throw wrongState(`A request that is ${r.state.replace('-', ' ')} cannot be edited.`);
  if (body.version !== r.version) throw staleVersion();
  await checkDepartment(me.officeId, body.departmentId);
  const { version: _v, ...fields } = body;
  const changed: string[] = [];
  for (const [k, v] of Object.entries(fields)) {
    if (v === undefined) continue;
    const key = k as keyof typeof fields;
    if (JSON.stringify(r.get(key)) !== JSON.stringify(v)) {
      r.set(key, v as never);
      changed.push(k);
    }
  }
  if (changed.length) await r.save();
  return changed;
}
