/**
 * The reviewer's outcomes: POST/GET /api/requests/:id/revision-request (required changes)
 * and POST/GET /api/requests/:id/decision.
 */
import { Router, type RequestHandler } from 'express';
import { decisionBodySchema, revisionRequestSchema } from '../../shared/api/review-schemas';
import { currentUser, requireAuth } from '../middleware/auth';
import { currentDecision, decide, latestRevisionRequest, requestRevision } from '../services/review-actions';
import { load, loaded } from './requests';
import { body } from './validate';

const askRevision: RequestHandler = async (req, res) => {
  res.status(201).json(await requestRevision(currentUser(req), loaded(res), body(req, revisionRequestSchema), req));
};

const showRevision: RequestHandler = async (_req, res) => {
  res.json(await latestRevisionRequest(loaded(res)));
};

const record: RequestHandler = async (req, res) => {
  res.status(201).json(await decide(currentUser(req), loaded(res), body(req, decisionBodySchema), req));
};

const showDecision: RequestHandler = async (_req, res) => {
  res.json(await currentDecision(loaded(res)));
};

/** Routes under /api/requests/:id (mount at /requests). */
export function reviewActionsRouter(): Router {
  const router = Router();
  router.use(requireAuth);
  router.post('/:id/revision-request', load, askRevision);
  router.get('/:id/revision-request', load, showRevision);
  router.post('/:id/decision', load, record);
  router.get('/:id/decision', load, showDecision);
  return router;
}
