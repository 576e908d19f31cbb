/** Writing and reading the append-only audit log. */
import type { Request } from 'express';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { AuditQuery } from '../../shared/api/schemas';
import type { AuditEntry, Page } from '../../shared/api/types';
import { AuditLog, User } from '../models/index';
import { iso, likeContains, limits, toPage } from './paging';

/** What to record: who did what to which entity. */
export interface AuditInput {
  actorId: string | null;
  action: string;
  entityType?: string | null;
  entityId?: string | null;
  details?: Record<string, unknown>;
}

/** Appends one entry; pass the request to record the caller's address. */
export async function audit(entry: AuditInput, req?: Request, transaction?: Transaction): Promise<void> {
  await AuditLog.create(
    {
      actorId: entry.actorId, action: entry.action, entityType: entry.entityType ?? null, entityId: entry.entityId ?? null,
      details: entry.details ?? {}, ip: req?.ip ?? null,
    },
    { transaction },
  );
}

/** Lists entries, newest first, filtered by actor (e-mail or name fragment), action prefix, entity type or id, and date range. */
export async function listAudit(q: AuditQuery): Promise<Page<AuditEntry>> {
  const where: WhereOptions[] = [];
  if (q.action) where.push({ action: { [Op.like]: `${q.action.replace(/[\\%_]/g, (c) => `\\${c}`)}%` } });
  if (q.entity) where.push({ [Op.or]: [{ entityType: q.entity }, { entityId: q.entity }] });
  if (q.from) where.push({ at: { [Op.gte]: new Date(`${q.from}T00:00:00Z`) } });
  if (q.to) where.push({ at: { [Op.lt]: new Date(Date.parse(`${q.to}T00:00:00Z`) + 86_400_000) } });
  if (q.actor) {
    const people = await User.findAll({ attributes: ['id'], where: { [Op.or]: [{ email: { [Op.like]: likeContains(q.actor) } }, { name: { [Op.like]: likeContains(q.actor) } }] } });
    where.push({ actorId: people.map((p) => p.id) });
  }
  if (q.q) where.push({ [Op.or]: [{ action: { [Op.like]: likeContains(q.q) } }, { entityId: { [Op.like]: likeContains(q.q) } }] });
  const { rows, count } = await AuditLog.findAndCountAll({
    where: { [Op.and]: where },
    include: [{ model: User, as: 'actor', attributes: ['id', 'name', 'email'] }],
    order: [['at', q.dir === 'asc' ? 'ASC' : 'DESC'], ['id', 'ASC']],
    ...limits(q.page, q.pageSize),
  });
  return toPage(rows.map(toAuditEntry), count, q.page, q.pageSize);
}

/** API shape of one entry. */
export function toAuditEntry(a: AuditLog): AuditEntry {
  return {
    id: a.id, at: iso(a.at) ?? '', actor: a.actor ? { id: a.actor.id, name: a.actor.name, email: a.actor.email } : null,
    action: a.action, entityType: a.entityType, entityId: a.entityId, details: { ...a.details, ...(a.ip ? { ip: a.ip } : {}) },
  };
}
