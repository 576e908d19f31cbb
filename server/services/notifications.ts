/** In-app notifications: listing one's own and creating them for events. */
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { NotificationItem, NotificationPage } from '../../shared/api/types';
import { Notification } from '../models/index';
import { iso, limits, toPage } from './paging';


/** Creates a notification for a person. */
export async function notify(
  n: { userId: string; kind: string; title: string; body?: string; link?: string | null; requestId?: string | null },
  transaction?: Transaction,
): Promise<void> {
  await Notification.create({ userId: n.userId, kind: n.kind, title: n.title, body: n.body ?? '', link: n.link ?? null, requestId: n.requestId ?? null, readAt: null }, { transaction });
}

/** Lists the person's own notifications, newest first, with the unread count. */
export async function listNotifications(userId: string, q: { page: number; pageSize: number; unread?: 'true' | 'false' }): Promise<NotificationPage> {
  const where: WhereOptions = q.unread === 'true' ? { userId, readAt: null } : { userId };
  const { rows, count } = await Notification.findAndCountAll({ where, order: [['createdAt', 'DESC'], ['id', 'ASC']], ...limits(q.page, q.pageSize) });
  const unread = await Notification.count({ where: { userId, readAt: { [Op.is]: null } } });
  return {
    ...toPage(rows.map((n) => ({ id: n.id, kind: n.kind, title: n.title, body: n.body, link: n.link, requestId: n.requestId, createdAt: iso(n.createdAt) ?? '', readAt: iso(n.readAt) })), count, q.page, q.pageSize),
    unread,
  };
}

/** Marks one of the person's notifications read; false when it is not theirs. */
export async function markRead(userId: string, id: string): Promise<boolean> {
  const [n] = await Notification.update({ readAt: new Date() }, { where: { id, userId, readAt: { [Op.is]: null } } });
  return n > 0 || (await Notification.count({ where: { id, userId } })) > 0;
}
