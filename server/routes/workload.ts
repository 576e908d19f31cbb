/** /api/workload: the head's board of reviewer loads. */
import { Router, type RequestHandler } from 'express';
import { currentUser, requireRole } from '../middleware/auth';
import { computeWorkload } from '../services/workload';

const show: RequestHandler = async (req, res) => {
  res.json(await computeWorkload(currentUser(req).officeId));
};

/** Creates the router (mounted at /api/workload). */
export function workloadRouter(): Router {
  return Router().get('/', requireRole('head'), show);
}
