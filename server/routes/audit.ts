/** GET /api/audit: the audit log for administrators. There is deliberately no route that changes it. */
import { Router, type RequestHandler } from 'express';
import { auditQuerySchema } from '../../shared/api/schemas';
import { requireRole } from '../middleware/auth';
import { listAudit } from '../services/audit';
import { query } from './validate';

const list: RequestHandler = async (req, res) => {
  res.json(await listAudit(query(req, auditQuerySchema)));
};

/** Creates the router. */
export function auditRouter(): Router {
  return Router().use(requireRole('admin')).get('/', list);
}
