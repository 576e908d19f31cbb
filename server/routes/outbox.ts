/**
 * /api/admin/outbox: the e-mail the local fake SMTP server caught, for admins in development
 * and tests. It exists only while MAIL_DIR points at that server's directory; elsewhere 404.
 */
import { Router, type RequestHandler } from 'express';
import type { OutboxMail } from '../../shared/api/workflow';
import { requireRole } from '../middleware/auth';
import { HttpError } from '../middleware/errors';
import { readMailbox } from '../ops/fake-smtp';

/** The fake SMTP server's directory, when one is in use. */
export const outboxDir = (): string | null => process.env['MAIL_DIR'] || null;

const onlyWithOutbox: RequestHandler = (req, _res, next) => {
  if (!outboxDir()) throw new HttpError(404, 'not-found', `No API route ${req.method} /admin/outbox: the outbox exists only with the development mail server (MAIL_DIR).`);
  next();
};

const list: RequestHandler = (_req, res) => {
  const mail: OutboxMail[] = readMailbox(outboxDir()!).reverse()
    .map((m) => ({ id: m.id, receivedAt: m.receivedAt, from: m.from, to: m.to, subject: m.subject, text: m.text, html: m.html }));
  res.json(mail);
};

/** Creates the router (mounted at /api/admin/outbox). */
export function outboxRouter(): Router {
  return Router().get('/', onlyWithOutbox, requireRole('admin'), list);
}
