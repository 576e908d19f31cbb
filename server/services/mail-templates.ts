/**
 * Wording of the notification for each workflow event: the in-app title and line, and the
 * e-mail subject with plain-text and HTML bodies. Every message names the office and links to
 * the request page; user-supplied text is escaped in the HTML version.
 */
import type { NotifyEvent } from '../../shared/api/workflow';

/** What a template is filled with. */
export interface TemplateInput {
  event: NotifyEvent;
  reference: string;
  title: string;
  officeName: string;
  /** Absolute link to the request page. */
  link: string;
  recipientName: string;
  actorName: string | null;
  /** Event details, e.g. dueAt, reason, decision, note. */
  extra: Record<string, string>;
}

/** A filled template. */
export interface RenderedMessage {
  /** Short line for the in-app notification title and the e-mail subject. */
  subject: string;
  /** One-line summary for the in-app notification body. */
  summary: string;
  text: string;
  html: string;
}

/** Escapes text for HTML element content and attribute values. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

const DECISION_WORDS: Record<string, string> = {
  endorse: 'endorsed',
  'endorse-with-conditions': 'endorsed with conditions',
  'revise-and-resubmit': 'returned with a request to revise and resubmit',
  'not-endorsed': 'not endorsed',
};

const DECLINE_WORDS: Record<string, string> = { conflict: 'a conflict of interest', capacity: 'not enough capacity', other: 'another reason' };

/** Per event: subject, the lines of the message (plain text; escaped for HTML), and the call to action. */
interface Wording { subject: string; lines: string[]; action: string }

function wording(i: TemplateInput): Wording {
  const ref = `${i.reference} “${i.title}”`;
  const by = i.actorName ? ` by ${i.actorName}` : '';
  const note = i.extra['note']?.trim() ? [`Note: ${i.extra['note'].trim()}`] : [];
  switch (i.event) {
    case 'request.filed':
      return { subject: `New request to assign: ${i.reference}`, lines: [`${ref} was filed${by} and is waiting for a reviewer.`, ...note], action: 'Open the request to assign it' };
    case 'request.assigned':
      return {
        subject: `Assigned to you: ${i.reference}`,
        lines: [`${ref} was assigned to you${by}.`, ...(i.extra['dueAt'] ? [`Your review is due on ${i.extra['dueAt']}.`] : []), ...note],
        action: 'Open the request to start the review',
      };
    case 'assignment.declined':
      return {
        subject: `Assignment declined: ${i.reference}`,
        lines: [`${i.actorName ?? 'The reviewer'} declined ${ref} because of ${DECLINE_WORDS[i.extra['reason'] ?? 'other'] ?? 'another reason'}.`, 'The request is back in the queue and needs a new reviewer.', ...note],
        action: 'Open the request to assign it again',
      };
    case 'request.revision-requested':
      return {
        subject: `Changes requested: ${i.reference}`,
        lines: [`The reviewer asked for changes to ${ref} before the review can finish.`, ...(i.extra['changes'] ? [`Required changes:\n${i.extra['changes']}`] : []), ...note],
        action: 'Open the request to see the changes and resubmit',
      };
    case 'request.resubmitted':
      return { subject: `Revision submitted: ${i.reference}`, lines: [`${ref} was revised and submitted again${by}.`, ...note], action: 'Open the request to continue the review' };
    case 'request.decided':
      return {
        subject: `Review finished: ${i.reference}`,
        lines: [`The review of ${ref} is finished: the analysis was ${DECISION_WORDS[i.extra['decision'] ?? ''] ?? 'decided'}.`, 'The signed letter follows once it is issued.'],
        action: 'Open the request to read the decision',
      };
    case 'request.due-soon':
      return {
        subject: `Review due soon: ${i.reference}`,
        lines: [`Your review of ${ref} is due${i.extra['dueAt'] ? ` on ${i.extra['dueAt']}` : ' soon'}.`],
        action: 'Open the request',
      };
    case 'letter.ready':
      return {
        subject: `Review letter issued: ${i.reference}`,
        lines: [`The signed review letter for ${ref} is ready.`, 'Download it from the request page; anyone you share it with can check it on the verification page.'],
        action: 'Open the request to download the letter',
      };
    case 'letter.countersign-needed':
      return { subject: `Countersignature needed: ${i.reference}`, lines: [`The review letter for ${ref} was signed${by} and needs the head's countersignature before it is issued.`], action: 'Open the request to countersign' };
    case 'comment.added':
      return {
        subject: `${i.extra['internal'] === 'true' ? 'New internal note' : 'New comment'}: ${i.reference}`,
        lines: [`${i.actorName ?? 'Someone'} ${i.extra['internal'] === 'true' ? 'added an internal note to' : 'commented on'} ${ref}.`],
        action: 'Open the request to read it',
      };
  }
}

/** Fills the template for an event. */
export function renderMessage(i: TemplateInput): RenderedMessage {
  const w = wording(i);
  const greeting = `Hello ${i.recipientName},`;
  const footer = `— ${i.officeName}, via Assayer`;
  const text = [greeting, '', ...w.lines.flatMap((l) => [l, '']), `${w.action}: ${i.link}`, '', footer, ''].join('\n');
  const para = (l: string) => `<p style="margin:0 0 12px">${escapeHtml(l).replace(/\n/g, '<br>')}</p>`;
  const html = [
    '<!doctype html><html><body style="font-family:Arial,Helvetica,sans-serif;font-size:15px;line-height:1.45;color:#1d2327">',
    para(greeting),
    ...w.lines.map(para),
    `<p style="margin:16px 0"><a href="${escapeHtml(i.link)}" style="color:#0b5c6b;font-weight:bold">${escapeHtml(w.action)}</a></p>`,
    `<p style="margin:16px 0 0;color:#5b6670;font-size:13px">${escapeHtml(footer)}</p>`,
    '</body></html>',
  ].join('\n');
  return { subject: w.subject, summary: w.lines[0]!, text, html };
}
