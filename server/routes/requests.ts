/**
 * /api/requests: lists by scope, detail, drafts and their edits. Records the caller may not
 * see answer 404 (see services/request-access.ts); `load` resolves :id and checks that.
 */
import { Router, type RequestHandler } from 'express';
import { requestCreateSchema, requestListQuerySchema, requestPatchSchema } from '../../shared/api/schemas';
import { currentUser, requireAuth, requireRole } from '../middleware/auth';
import { notFound } from '../middleware/errors';
import type { ReviewRequest } from '../models/index';
import { audit } from '../services/audit';
import { createDraft, findVisibleRequest, listRequests, patchRequest, toDetail } from '../services/requests';
import { body, isUuid, query } from './validate';

/** The request resolved by {@link load}, kept on res.locals. */
export const loaded = (res: { locals: Record<string, unknown> }): ReviewRequest => res.locals['request'] as ReviewRequest;

/** Resolves :id to a request the caller may see, else 404. Other routers mounted under a request reuse it. */
export const load: RequestHandler = async (req, res, next) => {
  const id = req.params['id'];
  const r = isUuid(id) ? await findVisibleRequest(currentUser(req), id) : null;
  if (!r) throw notFound('Review request');
  res.locals['request'] = r;
  next();
};

const list: RequestHandler = async (req, res) => {
  res.json(await listRequests(currentUser(req), query(req, requestListQuerySchema)));
};

const show: RequestHandler = async (req, res) => {
  res.json(await toDetail(currentUser(req), loaded(res)));
};

const create: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = await createDraft(me, body(req, requestCreateSchema));
  await audit({ actorId: me.id, action: 'request.created', entityType: 'request', entityId: r.id, details: { reference: r.reference, title: r.title } }, req);
  res.status(201).location(`/api/requests/${r.id}`).json(await toDetail(me, r));
};

const update: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  const changed = await patchRequest(me, r, body(req, requestPatchSchema));
  if (changed.length) await audit({ actorId: me.id, action: 'request.updated', entityType: 'request', entityId: r.id, details: { fields: changed, version: r.version } }, req);
  res.json(await toDetail(me, r));
};

/** Creates the /api/requests router. */
export function requestsRouter(): Router {
  const router = Router();
  router.use(requireAuth);
  router.get('/', list);
  router.post('/', requireRole('submitter'), create);
  router.get('/:id', load, show);
  router.patch('/:id', load, update);
  return router;
}
