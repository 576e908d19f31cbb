/**
 * Request state changes: which moves are allowed, and the audit entry every move writes.
 * Later workflow routes (submit, assign, start review, request revision, decide, withdraw)
 * call {@link moveRequest} so the rules and the audit trail live in one place.
 */
import type { Request } from 'express';
import type { Transaction } from 'sequelize';
import type { RequestState } from '../../shared/api/types';
import { staleVersion, wrongState } from '../middleware/errors';
import type { ReviewRequest } from '../models/index';
import { audit } from './audit';

/** Allowed moves: from → to. */
export const TRANSITIONS: Record<RequestState, readonly RequestState[]> = {
  draft: ['filed', 'withdrawn'],
  filed: ['assigned', 'withdrawn'],
  assigned: ['in-review', 'filed', 'assigned', 'withdrawn'],
  // in-review → in-review: the head hands a review in progress to another reviewer.
  'in-review': ['revision-requested', 'decided', 'filed', 'in-review', 'withdrawn'],
  // A resubmitted revision goes straight back to its assigned reviewer.
  'revision-requested': ['filed', 'in-review', 'withdrawn'],
  decided: [],
  withdrawn: [],
};

/** True when the move is allowed. */
export const canMove = (from: RequestState, to: RequestState): boolean => TRANSITIONS[from].includes(to);

/**
 * Moves a request to a new state with optimistic locking (pass the version the caller read)
 * and audits it as `request.<to>` with the old state and any details.
 */
export async function moveRequest(
  r: ReviewRequest,
  to: RequestState,
  opts: { actorId: string; version?: number; details?: Record<string, unknown>; req?: Request; transaction?: Transaction },
): Promise<void> {
  if (opts.version !== undefined && opts.version !== r.version) throw staleVersion();
  const from = r.state;
  if (!canMove(from, to)) throw wrongState(`A request that is ${from.replace('-', ' ')} cannot become ${to.replace('-', ' ')}.`);
  r.state = to;
  if (to === 'filed' && !r.filedAt) r.filedAt = new Date();
  if (to === 'decided') r.decidedAt = new Date();
  await r.save({ transaction: opts.transaction });
  await audit({ actorId: opts.actorId, action: `request.${to}`, entityType: 'request', entityId: r.id, details: { from, to, reference: r.reference, ...opts.details } }, opts.req, opts.transaction);
}
