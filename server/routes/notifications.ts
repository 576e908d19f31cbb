/** /api/notifications: the caller's own in-app notifications. */
import { Router, type RequestHandler } from 'express';
import { notificationQuerySchema } from '../../shared/api/schemas';
import { currentUser, requireAuth } from '../middleware/auth';
import { notFound } from '../middleware/errors';
import { listNotifications, markRead } from '../services/notifications';
import { isUuid, query } from './validate';

const list: RequestHandler = async (req, res) => {
  res.json(await listNotifications(currentUser(req).id, query(req, notificationQuerySchema)));
};

const read: RequestHandler = async (req, res) => {
  const id = req.params['id'];
  if (!isUuid(id) || !(await markRead(currentUser(req).id, id))) throw notFound('Notification');
  res.status(204).end();
};

/** Creates the router. */
export function notificationsRouter(): Router {
  return Router().use(requireAuth).get('/', list).post('/:id/read', read);
}
