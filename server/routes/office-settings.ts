/**
 * /api/office/settings: every signed-in person reads the office rules (the filing form takes
 * its default alpha from them); only the head changes them.
 */
import { Router, type RequestHandler } from 'express';
import { officeSettingsSchema } from '../../shared/api/intake-schemas';
import { currentUser, requireAuth, requireRole } from '../middleware/auth';
import { toOfficeSettings, updateOfficeSettings } from '../services/office-settings';
import { notFound } from '../middleware/errors';
import { Office } from '../models/index';
import { body } from './validate';

/** The caller's own office. */
async function myOffice(officeId: string): Promise<Office> {
  const o = await Office.findByPk(officeId);
  if (!o) throw notFound('Your office');
  return o;
}

const show: RequestHandler = async (req, res) => {
  res.json(toOfficeSettings(await myOffice(currentUser(req).officeId)));
};

const update: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const input = body(req, officeSettingsSchema);
  res.json(await updateOfficeSettings(await myOffice(me.officeId), input, me.id, req));
};

/** Creates the router (mounted at /api/office). */
export function officeSettingsRouter(): Router {
  const router = Router();
  router.get('/settings', requireAuth, show);
  router.put('/settings', requireRole('head'), update);
  return router;
}
