/**
 * Due-soon reminders: once per assignment, the reviewer is told when the due date comes
 * within the office's dueSoonDays. server/main.ts runs this every hour.
 */
import { Op } from 'sequelize';
import { Assignment, Office, ReviewRequest } from '../models/index';
import { audit } from './audit';
import { mailLogger } from './mailer';
import { notifyEvent } from './notify-event';
import { toOfficeSettings } from './office-settings';
import { addDays, isoDay, REVIEWER_MOVE_STATES } from './workload';

/** Sends the reminders that are due as of `now`; returns the ids of the assignments reminded. */
export async function sendDueSoonReminders(now = new Date()): Promise<string[]> {
  const sent: string[] = [];
  for (const office of await Office.findAll()) {
    const horizon = addDays(isoDay(now), toOfficeSettings(office).dueSoonDays);
    const due = await Assignment.findAll({
      where: { active: true, declined: false, dueReminderSentAt: { [Op.is]: null }, dueAt: { [Op.lte]: horizon } },
      include: [{ model: ReviewRequest, as: 'request', required: true, attributes: ['id', 'state'], where: { officeId: office.id, state: [...REVIEWER_MOVE_STATES] } }],
    });
    for (const a of due) {
      // Claiming the row first makes two overlapping runs (or two servers) send it once.
      const [claimed] = await Assignment.update({ dueReminderSentAt: now }, { where: { id: a.id, dueReminderSentAt: { [Op.is]: null } } });
      if (!claimed) continue;
      await audit({ actorId: null, action: 'assignment.due-reminder-sent', entityType: 'assignment', entityId: a.id, details: { requestId: a.requestId, dueAt: a.dueAt } });
      await notifyEvent('request.due-soon', a.requestId, { extra: { dueAt: a.dueAt ?? '' } });
      sent.push(a.id);
    }
  }
  if (sent.length) mailLogger().info({ count: sent.length }, 'due-soon reminders sent');
  return sent;
}
