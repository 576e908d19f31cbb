/**
 * Notifies the right people about a workflow event: picks the recipients, writes their in-app
 * notifications and sends the e-mail. Callers fire it after their change is saved; it never
 * throws (a failed notification must not undo the work), failures are logged.
 */
import type { NotifyEvent } from '../../shared/api/workflow';
import { Assignment, Office, ReviewRequest, User, UserRole } from '../models/index';
import { mailLogger, mailSettings, sendMail } from './mailer';
import { renderMessage } from './mail-templates';
import { notify } from './notifications';
import { activeAssignment } from './request-access';

/** The people around a request, as recipient resolution sees them (user ids). */
export interface RecipientContext {
  submitterId: string;
  /** The reviewer of the active assignment, if any. */
  reviewerId: string | null;
  /** Active heads of the request's office. */
  headIds: string[];
  actorId: string | null;
  extra: Record<string, string>;
}

/** Who gets the message: `to` each get their own notification; `cc` are copied on the e-mail to the first `to`. */
export interface Recipients { to: string[]; cc: string[] }

/** Picks the recipients of an event; the actor is never among them. */
export function resolveRecipients(event: NotifyEvent, c: RecipientContext): Recipients {
  const reviewer = c.reviewerId ? [c.reviewerId] : [];
  let to: string[];
  let cc: string[] = [];
  switch (event) {
    case 'request.filed':
    case 'assignment.declined':
    case 'letter.countersign-needed':
      to = c.headIds;
      break;
    case 'request.assigned':
    case 'request.resubmitted':
    case 'request.due-soon':
      to = reviewer;
      break;
    case 'request.revision-requested':
    case 'request.decided':
      to = [c.submitterId];
      break;
    case 'letter.ready':
      to = [c.submitterId];
      cc = reviewer;
      break;
    case 'comment.added':
      if (c.extra['internal'] === 'true') to = [...reviewer, ...c.headIds];
      else if (c.actorId === c.submitterId) to = reviewer;
      else if (c.actorId !== null && c.actorId === c.reviewerId) to = [c.submitterId];
      // Someone else (the head) commented openly: both parties hear about it.
      else to = [c.submitterId, ...reviewer];
      break;
  }
  const notActor = (id: string) => id !== c.actorId;
  const uniq = (ids: string[]) => [...new Set(ids)].filter(notActor);
  const toIds = uniq(to);
  return { to: toIds, cc: uniq(cc).filter((id) => !toIds.includes(id)) };
}

/** Ids of the active heads of an office. */
export async function activeHeadIds(officeId: string): Promise<string[]> {
  const rows = await UserRole.findAll({ attributes: ['userId'], where: { role: 'head' } });
  if (!rows.length) return [];
  const heads = await User.findAll({ attributes: ['id'], where: { id: rows.map((r) => r.userId), officeId, active: true } });
  return heads.map((u) => u.id);
}

/**
 * Notifies the people concerned by `event` on request `requestId` (in-app and e-mail).
 * `opts.actorId` is the person who caused it (never notified); `opts.extra` carries details
 * for the wording (dueAt, reason, note, decision, changes, internal).
 */
export async function notifyEvent(event: NotifyEvent, requestId: string, opts: { actorId?: string; extra?: Record<string, string> } = {}): Promise<void> {
  try {
    const r = await ReviewRequest.findByPk(requestId, { include: [{ model: Assignment, as: 'assignments' }] });
    if (!r) {
      mailLogger().warn({ event, requestId }, 'notification skipped: request not found');
      return;
    }
    const extra = opts.extra ?? {};
    const recipients = resolveRecipients(event, {
      submitterId: r.submitterId, reviewerId: activeAssignment(r)?.reviewerId ?? null, headIds: await activeHeadIds(r.officeId),
      actorId: opts.actorId ?? null, extra,
    });
    const ids = [...recipients.to, ...recipients.cc];
    if (!ids.length) return;
    const people = new Map((await User.findAll({ where: { id: [...ids, ...(opts.actorId ? [opts.actorId] : [])] } })).map((u) => [u.id, u]));
    const office = await Office.findByPk(r.officeId);
    const path = `/requests/${r.id}`;
    const link = `${mailSettings().publicUrl}${path}`;
    const base = { event, reference: r.reference, title: r.title, officeName: office?.name ?? 'the review office', link, actorName: opts.actorId ? people.get(opts.actorId)?.name ?? null : null, extra };
    const ccEmails = recipients.cc.map((id) => people.get(id)).filter((u): u is User => Boolean(u?.active)).map((u) => u.email);
    for (const [i, id] of recipients.to.entries()) {
      const person = people.get(id);
      if (!person?.active) continue;
      try {
        const msg = renderMessage({ ...base, recipientName: person.name });
        await notify({ userId: id, kind: event, title: msg.subject, body: msg.summary, link: path, requestId: r.id });
        await sendMail({ to: person.email, cc: i === 0 ? ccEmails : undefined, subject: msg.subject, text: msg.text, html: msg.html });
      } catch (err) {
        mailLogger().error({ err, event, requestId, userId: id }, 'notification failed for one recipient');
      }
    }
    // Copied people get the in-app notice too; their e-mail went as cc.
    for (const id of recipients.cc) {
      const person = people.get(id);
      if (!person?.active) continue;
      const msg = renderMessage({ ...base, recipientName: person.name });
      await notify({ userId: id, kind: event, title: msg.subject, body: msg.summary, link: path, requestId: r.id }).catch((err: unknown) => {
        mailLogger().error({ err, event, requestId, userId: id }, 'in-app notification failed');
      });
    }
  } catch (err) {
    mailLogger().error({ err, event, requestId }, 'notification failed');
  }
}
