/**
 * Who may see and do what with a review request. Records a caller may not see are
 * answered with 404, never 403, so the API does not reveal that they exist; 403 is
 * reserved for records the caller can see but whose action their role does not allow.
 */
import { Op, type WhereOptions } from 'sequelize';
import type { RequestDetail, RequestState } from '../../shared/api/types';
import type { CurrentUser } from '../middleware/session-types';
import type { Assignment, ReviewRequest } from '../models/index';

/** States in which the submitter may still edit the request. */
export const EDITABLE_STATES: readonly RequestState[] = ['draft', 'revision-requested'];

/** The assignment currently in force (not declined, not replaced), if any. */
export function activeAssignment(r: ReviewRequest): Assignment | null {
  return r.assignments?.find((a) => a.active && !a.declined) ?? null;
}

/** Whether the caller may read the request. Drafts are private to their submitter. */
export function canSee(me: CurrentUser, r: ReviewRequest): boolean {
  if (r.submitterId === me.id) return true;
  if (r.state === 'draft' || r.officeId !== me.officeId) return false;
  if (me.roles.includes('head') || me.roles.includes('admin')) return true;
  return me.roles.includes('reviewer') && activeAssignment(r)?.reviewerId === me.id;
}

/** What the caller may do now (the client shows buttons from this; the server re-checks). */
export function permissions(me: CurrentUser, r: ReviewRequest): RequestDetail['can'] {
  const owner = r.submitterId === me.id;
  const assignedToMe = me.roles.includes('reviewer') && activeAssignment(r)?.reviewerId === me.id;
  return {
    edit: owner && EDITABLE_STATES.includes(r.state),
    assign: me.roles.includes('head') && (r.state === 'filed' || r.state === 'assigned') && r.officeId === me.officeId,
    review: assignedToMe && (r.state === 'assigned' || r.state === 'in-review'),
    decide: assignedToMe && r.state === 'in-review',
    withdraw: owner && !['decided', 'withdrawn'].includes(r.state),
  };
}

/** SQL filter equivalent to {@link canSee} for list queries (assignment ids are looked up by the caller). */
export function visibleWhere(me: CurrentUser, assignedIds: string[]): WhereOptions {
  const or: WhereOptions[] = [{ submitterId: me.id }];
  if (me.roles.includes('head') || me.roles.includes('admin')) or.push({ officeId: me.officeId, state: { [Op.ne]: 'draft' } });
  else if (me.roles.includes('reviewer')) or.push({ id: assignedIds, state: { [Op.ne]: 'draft' } });
  return { [Op.or]: or };
}
