/** /api/admin/users: people and their roles (administrators only). Role changes are audited. */
import { Router, type RequestHandler } from 'express';
import { userCreateSchema, userListQuerySchema, userPatchSchema } from '../../shared/api/schemas';
import type { Config } from '../config';
import { currentUser, requireRole } from '../middleware/auth';
import { notFound } from '../middleware/errors';
import type { User } from '../models/index';
import { audit } from '../services/audit';
import { createLocalUser, findUser, listUsers, toAdminRow, updateUser } from '../services/users';
import { body, isUuid, query } from './validate';

/** Creates the router. */
export function adminUsersRouter(config: Config): Router {
  const router = Router();
  router.use(requireRole('admin'));

  const load: RequestHandler = async (req, res, next) => {
    const id = req.params['id'];
    const u = isUuid(id) ? await findUser(currentUser(req).officeId, id) : null;
    if (!u) throw notFound('Person');
    res.locals['user'] = u;
    next();
  };

  const list: RequestHandler = async (req, res) => {
    res.json(await listUsers(currentUser(req).officeId, query(req, userListQuerySchema)));
  };

  const create: RequestHandler = async (req, res) => {
    const me = currentUser(req);
    const input = body(req, userCreateSchema);
    const u = await createLocalUser(me.officeId, input, config.bcryptRounds);
    await audit({ actorId: me.id, action: 'user.created', entityType: 'user', entityId: u.id, details: { email: u.email, roles: input.roles, via: 'admin' } }, req);
    res.status(201).json(toAdminRow(u));
  };

  const update: RequestHandler = async (req, res) => {
    const me = currentUser(req);
    const u = res.locals['user'] as User;
    const change = await updateUser(u, body(req, userPatchSchema), me.id);
    if ('roles' in change.after) {
      await audit({ actorId: me.id, action: 'user.roles-changed', entityType: 'user', entityId: u.id, details: { email: u.email, before: change.before['roles'], after: change.after['roles'] } }, req);
    }
    const other = Object.keys(change.after).filter((k) => k !== 'roles');
    if (other.length) {
      const pick = (o: Record<string, unknown>) => Object.fromEntries(other.map((k) => [k, o[k]]));
      await audit({ actorId: me.id, action: 'user.updated', entityType: 'user', entityId: u.id, details: { email: u.email, before: pick(change.before), after: pick(change.after) } }, req);
    }
    res.json(toAdminRow((await findUser(me.officeId, u.id))!));
  };

  router.get('/', list);
  router.post('/', create);
  router.patch('/:id', load, update);
  return router;
}
