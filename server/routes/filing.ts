/**
 * Filing actions on a request: POST /:id/submit, POST /:id/withdraw, and the saved
 * revisions GET /:id/versions and GET /:id/versions/:revisionNo.
 */
import { Router, type RequestHandler } from 'express';
import { submitSchema, withdrawSchema } from '../../shared/api/filing-schemas';
import { currentUser, requireAuth } from '../middleware/auth';
import { notFound } from '../middleware/errors';
import { getVersion, listVersions, submitRequest, withdrawRequest } from '../services/filing';
import { toDetail } from '../services/requests';
import { load, loaded } from './requests';
import { body } from './validate';

const submit: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  await submitRequest(me, r, body(req, submitSchema), req);
  res.json(await toDetail(me, r));
};

const withdraw: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  await withdrawRequest(me, r, body(req, withdrawSchema), req);
  res.json(await toDetail(me, r));
};

const versions: RequestHandler = async (_req, res) => {
  res.json(await listVersions(loaded(res)));
};

const version: RequestHandler = async (req, res) => {
  const n = Number(req.params['revisionNo']);
  const v = Number.isInteger(n) && n > 0 ? await getVersion(loaded(res), n) : null;
  if (!v) throw notFound('This revision');
  res.json(v);
};

/** Creates the router; mount it at /requests beside the requests router. */
export function filingRouter(): Router {
  const router = Router();
  router.post('/:id/submit', requireAuth, load, submit);
  router.post('/:id/withdraw', requireAuth, load, withdraw);
  router.get('/:id/versions', requireAuth, load, versions);
  router.get('/:id/versions/:revisionNo', requireAuth, load, version);
  return router;
}
