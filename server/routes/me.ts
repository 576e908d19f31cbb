/** /api/me: the signed-in person's own profile settings (declared methods expertise). */
import { Router, type RequestHandler } from 'express';
import { expertiseSchema } from '../../shared/api/intake-schemas';
import { currentUser, requireRole } from '../middleware/auth';
import { User } from '../models/index';
import { audit } from '../services/audit';
import { body } from './validate';

const getExpertise: RequestHandler = async (req, res) => {
  const u = await User.findByPk(currentUser(req).id, { attributes: ['id', 'expertise'], rejectOnEmpty: true });
  res.json({ expertise: u.expertise ?? [] });
};

const setExpertise: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const { expertise } = body(req, expertiseSchema);
  // Case-insensitive duplicates would count twice in suggestions.
  const seen = new Set<string>();
  const clean = expertise.filter((e) => !seen.has(e.toLowerCase()) && Boolean(seen.add(e.toLowerCase())));
  const u = await User.findByPk(me.id, { rejectOnEmpty: true });
  const before = u.expertise ?? [];
  u.expertise = clean;
  await u.save();
  await audit({ actorId: me.id, action: 'user.expertise-changed', entityType: 'user', entityId: me.id, details: { before, after: clean } }, req);
  res.json({ expertise: clean });
};

/** Creates the router (mounted at /api/me). */
export function meRouter(): Router {
  return Router().get('/expertise', requireRole('reviewer'), getExpertise).patch('/expertise', requireRole('reviewer'), setExpertise);
}
