/** People: the current user, the admin list, local accounts and role changes. */
import { Op, type WhereOptions } from 'sequelize';
import type { UserCreateBody, UserListQuery, UserPatchBody } from '../../shared/api/schemas';
import { ROLES, type Me, type Page, type Role, type UserAdminRow } from '../../shared/api/types';
import type { CurrentUser } from '../middleware/session-types';
import { badRequest, HttpError, staleVersion } from '../middleware/errors';
import { Department, User, UserRole } from '../models/index';
import { hashPassword } from '../auth/passwords';
import { iso, likeContains, limits, toPage } from './paging';

const byRoleOrder = (a: Role, b: Role) => ROLES.indexOf(a) - ROLES.indexOf(b);

/** Distinct roles of a person in the canonical order. */
export function rolesOf(u: User): Role[] {
  return [...new Set((u.roles ?? []).map((r) => r.role))].sort(byRoleOrder);
}

/** Loads an active person with roles and department, or null. */
export async function loadCurrentUser(id: string): Promise<CurrentUser | null> {
  const u = await User.findByPk(id, { include: [{ model: UserRole, as: 'roles' }, { model: Department, as: 'department' }] });
  if (!u || !u.active) return null;
  return { id: u.id, email: u.email, name: u.name, roles: rolesOf(u), officeId: u.officeId, departmentId: u.departmentId, department: u.department?.name ?? null };
}

/** The Me shape for the client. */
export function toMe(me: CurrentUser): Me {
  return { id: me.id, email: me.email, name: me.name, roles: me.roles, department: me.department };
}

/** Admin row shape. */
export function toAdminRow(u: User): UserAdminRow {
  const signIn: ('local' | 'saml')[] = [];
  if (u.passwordHash) signIn.push('local');
  if (u.samlNameId) signIn.push('saml');
  return {
    id: u.id, email: u.email, name: u.name, department: u.department?.name ?? null, roles: rolesOf(u), signIn, active: u.active,
    lastSignInAt: iso(u.lastSignInAt), version: u.version,
  };
}

/** Lists the office's people for admins (filter by text, role, active; sort; page). */
export async function listUsers(officeId: string, q: UserListQuery): Promise<Page<UserAdminRow>> {
  const where: WhereOptions[] = [{ officeId }];
  if (q.q) where.push({ [Op.or]: [{ name: { [Op.like]: likeContains(q.q) } }, { email: { [Op.like]: likeContains(q.q) } }] });
  if (q.active) where.push({ active: q.active === 'true' });
  if (q.role) {
    const holders = await UserRole.findAll({ attributes: ['userId'], where: { role: q.role } });
    where.push({ id: holders.map((h) => h.userId) });
  }
  const sort = q.sort ?? 'name';
  const count = await User.count({ where: { [Op.and]: where } });
  const rows = await User.findAll({
    where: { [Op.and]: where },
    include: [{ model: UserRole, as: 'roles' }, { model: Department, as: 'department' }],
    order: [[sort, q.dir === 'desc' ? 'DESC' : 'ASC'], ['id', 'ASC']],
    ...limits(q.page, q.pageSize),
  });
  return toPage(rows.map(toAdminRow), count, q.page, q.pageSize);
}

/** Loads one person of the office with roles and department, or null. */
export async function findUser(officeId: string, id: string): Promise<User | null> {
  return User.findOne({ where: { id, officeId }, include: [{ model: UserRole, as: 'roles' }, { model: Department, as: 'department' }] });
}

async function checkDepartment(officeId: string, departmentId: string | null | undefined): Promise<void> {
  if (departmentId && !(await Department.findOne({ where: { id: departmentId, officeId } }))) {
    throw badRequest('Department must be one of the listed departments', { departmentId: 'Unknown department' });
  }
}

/** Creates a local account with roles. */
export async function createLocalUser(officeId: string, body: UserCreateBody, rounds: number): Promise<User> {
  const email = body.email.trim().toLowerCase();
  if (await User.findOne({ where: { email } })) throw new HttpError(409, 'duplicate', `An account for ${email} already exists.`, { email: 'Already in use' });
  await checkDepartment(officeId, body.departmentId);
  const user = await User.create({
    officeId, email, name: body.name, departmentId: body.departmentId ?? null, passwordHash: await hashPassword(body.password, rounds),
    samlNameId: null, expertise: null, lastSignInAt: null,
  });
  for (const role of body.roles) await UserRole.create({ userId: user.id, role, source: 'manual' });
  return (await findUser(officeId, user.id))!;
}

/** What changed in an admin edit, for the audit log. */
export interface UserChange { before: Record<string, unknown>; after: Record<string, unknown> }

/**
 * Applies an admin edit with optimistic locking. Setting roles replaces every grant
 * (SSO-derived ones come back at the next SSO sign-in if the mapping still applies).
 * An admin cannot remove their own admin role or deactivate themselves: that locks the office out.
 */
export async function updateUser(user: User, body: UserPatchBody, actorId: string): Promise<UserChange> {
  if (body.version !== user.version) throw staleVersion();
  const before: Record<string, unknown> = {};
  const after: Record<string, unknown> = {};
  if (user.id === actorId && body.roles && !body.roles.includes('admin')) {
    throw new HttpError(409, 'self-lockout', 'You cannot remove your own admin role; ask another administrator.');
  }
  if (user.id === actorId && body.active === false) throw new HttpError(409, 'self-lockout', 'You cannot deactivate your own account.');
  await checkDepartment(user.officeId, body.departmentId);
  const sequelize = User.sequelize!;
  await sequelize.transaction(async (transaction) => {
    if (body.roles) {
      const old = rolesOf(user);
      const next = [...body.roles].sort(byRoleOrder);
      if (old.join() !== next.join()) {
        before['roles'] = old;
        after['roles'] = next;
        await UserRole.destroy({ where: { userId: user.id }, transaction });
        for (const role of next) await UserRole.create({ userId: user.id, role, source: 'manual' }, { transaction });
      }
    }
    for (const key of ['active', 'name', 'departmentId'] as const) {
      if (body[key] !== undefined && body[key] !== user[key]) {
        before[key] = user[key];
        after[key] = body[key];
        user.set(key, body[key] as never);
      }
    }
    // Bump the version even when only roles changed: they are part of what the admin edited.
    user.changed('updatedAt', true);
    await user.save({ transaction });
  });
  return { before, after };
}
