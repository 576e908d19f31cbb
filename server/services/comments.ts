/**
 * The comment thread of a request: HTML sanitized on the server to a small allow-list,
 * internal notes for the reviewer and the head only (never shown, nor counted, to others).
 */
import type { Request } from 'express';
import sanitizeHtml from 'sanitize-html';
import type { CommentView } from '../../shared/api/workflow';
import { badRequest, forbidden, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { Comment, User, type ReviewRequest } from '../models/index';
import { audit } from './audit';
import { notifyEvent } from './notify-event';
import { iso } from './paging';
import { activeAssignment } from './request-access';

/** The allow-list: text structure, emphasis, lists, quotes, code and plain links; no styles, no scripts, no handlers. */
const SANITIZE: sanitizeHtml.IOptions = {
  allowedTags: ['p', 'br', 'strong', 'em', 'ul', 'ol', 'li', 'a', 'code', 'blockquote'],
  allowedAttributes: { a: ['href'] },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesByTag: {},
  allowProtocolRelative: false,
  disallowedTagsMode: 'discard',
  // Links open outside the app without handing it the opener.
  transformTags: { a: sanitizeHtml.simpleTransform('a', { rel: 'noopener noreferrer nofollow' }) },
};
// transformTags adds rel after filtering; allow it through.
SANITIZE.allowedAttributes = { a: ['href', 'rel'] };

/** Sanitizes comment HTML to the allow-list. */
export function sanitizeComment(html: string): string {
  return sanitizeHtml(html, SANITIZE).trim();
}

/** True when the caller may see internal notes: the assigned reviewer or the office head. */
export function seesInternal(me: CurrentUser, r: ReviewRequest): boolean {
  if (r.submitterId === me.id) return false;
  if (me.roles.includes('head') && r.officeId === me.officeId) return true;
  return me.roles.includes('reviewer') && activeAssignment(r)?.reviewerId === me.id;
}

/** Comments the caller may see, oldest first. */
export async function listComments(me: CurrentUser, r: ReviewRequest): Promise<CommentView[]> {
  const rows = await Comment.findAll({
    where: { requestId: r.id, ...(seesInternal(me, r) ? {} : { internal: false }) },
    include: [{ model: User, as: 'author', attributes: ['id', 'name', 'email'] }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  });
  return rows.map(toView);
}

function toView(c: Comment & { author?: User | null }): CommentView {
  return {
    id: c.id, author: c.author ? { id: c.author.id, name: c.author.name, email: c.author.email } : null,
    bodyHtml: c.bodyHtml, internal: c.internal, createdAt: iso(c.createdAt) ?? '',
  };
}

/** Adds a comment as the submitter, the assigned reviewer or the head; internal notes only for the latter two. */
export async function addComment(me: CurrentUser, r: ReviewRequest, body: { body: string; internal?: boolean }, req?: Request): Promise<CommentView> {
  const staff = seesInternal(me, r);
  if (r.submitterId !== me.id && !staff) throw forbidden('Only the submitter, the assigned reviewer and the office head can comment on this request.');
  if (r.state === 'draft' || r.state === 'withdrawn') throw wrongState(`Comments are closed while a request is ${r.state}.`);
  const internal = body.internal ?? false;
  if (internal && !staff) throw forbidden('Internal notes are for the reviewer and the office head.');
  const html = sanitizeComment(body.body);
  if (!sanitizeHtml(html, { allowedTags: [], allowedAttributes: {} }).trim()) {
    throw badRequest('The comment is empty once unsupported markup is removed.', { body: 'Write some text (scripts, styles and unsupported tags are removed).' });
  }
  const c = await Comment.create({ requestId: r.id, authorId: me.id, bodyHtml: html, internal });
  await audit({ actorId: me.id, action: 'comment.added', entityType: 'request', entityId: r.id, details: { commentId: c.id, internal } }, req);
  await notifyEvent('comment.added', r.id, { actorId: me.id, extra: { internal: String(internal), commentId: c.id } });
  const author = await User.findByPk(me.id, { attributes: ['id', 'name', 'email'] });
  return toView(Object.assign(c, { author }));
}
