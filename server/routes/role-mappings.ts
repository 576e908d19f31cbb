/** /api/admin/role-mappings: which SSO attribute values grant which roles (administrators only). */
import { Router, type RequestHandler } from 'express';
import { roleMappingsPutSchema } from '../../shared/api/schemas';
import { currentUser, requireRole } from '../middleware/auth';
import { audit } from '../services/audit';
import { listRoleMappings, replaceRoleMappings } from '../services/role-mappings';
import { body } from './validate';

const list: RequestHandler = async (req, res) => {
  res.json(await listRoleMappings(currentUser(req).officeId));
};

const replace: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const input = body(req, roleMappingsPutSchema);
  const before = await listRoleMappings(me.officeId);
  const after = await replaceRoleMappings(me.officeId, input);
  const strip = (ms: { attribute: string; value: string; role: string }[]) => ms.map(({ attribute, value, role }) => ({ attribute, value, role }));
  await audit({ actorId: me.id, action: 'role-mappings.replaced', entityType: 'office', entityId: me.officeId, details: { before: strip(before), after: strip(after) } }, req);
  res.json(after);
};

/** Creates the router. */
export function roleMappingsRouter(): Router {
  return Router().use(requireRole('admin')).get('/', list).put('/', replace);
}
