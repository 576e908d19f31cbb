/** The review checklist of a request: GET /api/requests/:id/checklist, PUT .../checklist/:criterion. */
import { Router, type RequestHandler } from 'express';
import { checklistPutSchema, criterionSchema } from '../../shared/api/review-schemas';
import { currentUser, requireAuth } from '../middleware/auth';
import { badRequest, forbidden } from '../middleware/errors';
import { listChecklist, putChecklistEntry } from '../services/checklist';
import { canRunReruns } from '../services/reruns';
import { load, loaded } from './requests';
import { body } from './validate';

const list: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  // The checklist is the reviewer's working paper; the submitter reads the outcome in the decision.
  if (!canRunReruns(me, r) && !me.roles.includes('admin')) throw forbidden('The checklist is for the reviewer and the office head.');
  res.json(await listChecklist(r));
};

const put: RequestHandler = async (req, res) => {
  const parsed = criterionSchema.safeParse(req.params['criterion']);
  if (!parsed.success) throw badRequest(parsed.error.issues[0]!.message, { criterion: parsed.error.issues[0]!.message });
  res.json(await putChecklistEntry(currentUser(req), loaded(res), parsed.data, body(req, checklistPutSchema), req));
};

/** Routes under /api/requests/:id/checklist (mount at /requests). */
export function checklistRouter(): Router {
  const router = Router();
  router.use(requireAuth);
  router.get('/:id/checklist', load, list);
  router.put('/:id/checklist/:criterion', load, put);
  return router;
}
