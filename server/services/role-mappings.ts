/** SSO attribute → role mappings of an office, and applying them to a set of attributes. */
import type { RoleMappingsPutBody } from '../../shared/api/schemas';
import { ROLES, type Role, type RoleMapping } from '../../shared/api/types';
import { RoleMappingRow } from '../models/index';

/** Normalised SSO attributes: each name maps to a list of string values. */
export type SsoAttributes = Record<string, string[]>;

/** API shape. */
export const toRoleMapping = (m: RoleMappingRow): RoleMapping => ({ id: m.id, attribute: m.attribute, value: m.value, role: m.role });

/** The office's mappings in a stable order. */
export async function listRoleMappings(officeId: string): Promise<RoleMapping[]> {
  const rows = await RoleMappingRow.findAll({ where: { officeId }, order: [['attribute', 'ASC'], ['value', 'ASC'], ['role', 'ASC']] });
  return rows.map(toRoleMapping);
}

/** Replaces the office's mappings with the given list (duplicates collapse). */
export async function replaceRoleMappings(officeId: string, body: RoleMappingsPutBody): Promise<RoleMapping[]> {
  const seen = new Set<string>();
  const unique = body.mappings.filter((m) => {
    const k = `${m.attribute}\u0000${m.value}\u0000${m.role}`;
    return seen.has(k) ? false : (seen.add(k), true);
  });
  await RoleMappingRow.sequelize!.transaction(async (transaction) => {
    await RoleMappingRow.destroy({ where: { officeId }, transaction });
    for (const m of unique) await RoleMappingRow.create({ officeId, ...m }, { transaction });
  });
  return listRoleMappings(officeId);
}

/**
 * Roles granted by the attributes. Attribute names compare case-insensitively (IdPs differ
 * in spelling); values compare exactly, except that a scoped affiliation such as
 * "staff@harrowvale.test" also matches a mapping for "staff".
 */
export function rolesFromAttributes(mappings: RoleMapping[], attrs: SsoAttributes): Role[] {
  const lower = new Map(Object.entries(attrs).map(([k, v]) => [k.toLowerCase(), v]));
  const granted = new Set<Role>();
  for (const m of mappings) {
    const values = lower.get(m.attribute.toLowerCase()) ?? [];
    if (values.some((v) => v === m.value || v.split('@')[0] === m.value)) granted.add(m.role);
  }
  return ROLES.filter((r) => granted.has(r));
}
