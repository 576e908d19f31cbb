/** Just-in-time accounts from SSO: create or update the person and recompute SSO-derived roles. */
import { Op } from 'sequelize';
import type { Role } from '../../shared/api/types';
import { Department, User, UserRole } from '../models/index';
import { listRoleMappings, rolesFromAttributes, type SsoAttributes } from './role-mappings';

/** Outcome of an SSO sign-in attempt. */
export type SsoResult =
  | { ok: true; user: User; created: boolean; ssoRoles: Role[] }
  | { ok: false; reason: 'no-email' | 'inactive' | 'no-role'; email: string | null };

const first = (attrs: SsoAttributes, ...names: string[]): string | null => {
  const lower = new Map(Object.entries(attrs).map(([k, v]) => [k.toLowerCase(), v]));
  for (const n of names) {
    const v = lower.get(n.toLowerCase())?.[0];
    if (v) return v;
  }
  return null;
};

/**
 * Finds the person by NameID, then by e-mail; creates them when new. SSO-derived roles
 * are replaced by what the mappings grant now; roles an admin granted stay.
 * A new person whom no mapping grants a role is not created.
 */
export async function signInFromSso(officeId: string, nameId: string | null, attrs: SsoAttributes): Promise<SsoResult> {
  const email = (first(attrs, 'mail', 'email', 'urn:oid:0.9.2342.19200300.100.1.3') ?? (nameId?.includes('@') ? nameId : null))?.toLowerCase() ?? null;
  if (!email) return { ok: false, reason: 'no-email', email: null };
  const name = first(attrs, 'displayName', 'cn', 'urn:oid:2.16.840.1.113730.3.1.241') ?? email;
  const deptName = first(attrs, 'department', 'ou');
  const dept = deptName
    ? await Department.findOne({ where: { officeId, [Op.or]: [{ name: deptName }, { code: deptName }] } })
    : null;
  const ssoRoles = rolesFromAttributes(await listRoleMappings(officeId), attrs);
  const subject = nameId ?? email;

  return User.sequelize!.transaction(async (transaction) => {
    let user = await User.findOne({ where: { samlNameId: subject }, transaction })
      ?? await User.findOne({ where: { email }, transaction });
    const created = !user;
    if (!user) {
      if (!ssoRoles.length) return { ok: false as const, reason: 'no-role' as const, email };
      user = await User.create({ officeId, email, name, departmentId: dept?.id ?? null, passwordHash: null, samlNameId: subject, expertise: null, lastSignInAt: null }, { transaction });
    } else {
      if (!user.active) return { ok: false as const, reason: 'inactive' as const, email };
      user.set({ name, samlNameId: subject, ...(dept ? { departmentId: dept.id } : {}) });
      if (user.changed()) await user.save({ transaction });
    }
    const held = await UserRole.findAll({ where: { userId: user.id }, transaction });
    for (const r of held) if (r.source === 'sso' && !ssoRoles.includes(r.role)) await r.destroy({ transaction });
    for (const role of ssoRoles) if (!held.some((h) => h.role === role)) await UserRole.create({ userId: user.id, role, source: 'sso' }, { transaction });
    const remaining = await UserRole.count({ where: { userId: user.id }, transaction });
    if (!remaining) return { ok: false as const, reason: 'no-role' as const, email };
    return { ok: true as const, user, created, ssoRoles };
  });
}
