/**
 * /api/requests/:id/assignment: candidates and assigning (the head), declining (the assigned
 * reviewer). `load` answers 404 for requests the caller cannot see before any role check.
 */
import { Router, type RequestHandler } from 'express';
import { assignBodySchema, declineBodySchema } from '../../shared/api/intake-schemas';
import { currentUser, requireRole } from '../middleware/auth';
import { notFound } from '../middleware/errors';
import { assignReviewer, declineAssignment, listCandidates } from '../services/assignment';
import { findVisibleRequest, toDetail } from '../services/requests';
import { load, loaded } from './requests';
import { body } from './validate';

const candidates: RequestHandler = async (_req, res) => {
  res.json(await listCandidates(loaded(res)));
};

const assign: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  await assignReviewer(me, r, body(req, assignBodySchema), req);
  const fresh = await findVisibleRequest(me, r.id);
  if (!fresh) throw notFound('Review request');
  res.json(await toDetail(me, fresh));
};

const decline: RequestHandler = async (req, res) => {
  await declineAssignment(currentUser(req), loaded(res), body(req, declineBodySchema), req);
  res.status(204).end();
};

/** Creates the router (mounted at /api/requests/:id/assignment). */
export function assignmentRouter(): Router {
  const router = Router({ mergeParams: true });
  router.get('/candidates', load, requireRole('head'), candidates);
  router.put('/', load, requireRole('head'), assign);
  router.post('/decline', load, requireRole('reviewer'), decline);
  return router;
}
