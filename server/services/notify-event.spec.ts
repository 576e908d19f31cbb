/** Recipient resolution of every notification event, and the actor rule. */
import { describe, expect, it } from 'vitest';
import { NOTIFY_EVENTS, type NotifyEvent } from '../../shared/api/workflow';
import { resolveRecipients, type RecipientContext } from './notify-event';

const base: RecipientContext = { submitterId: 'sub', reviewerId: 'rev', headIds: ['head1', 'head2'], actorId: null, extra: {} };

describe('resolveRecipients', () => {
  const expected: Record<NotifyEvent, { to: string[]; cc: string[] }> = {
    'request.filed': { to: ['head1', 'head2'], cc: [] },
    'request.assigned': { to: ['rev'], cc: [] },
    'assignment.declined': { to: ['head1', 'head2'], cc: [] },
    'request.revision-requested': { to: ['sub'], cc: [] },
    'request.resubmitted': { to: ['rev'], cc: [] },
    'request.decided': { to: ['sub'], cc: [] },
    'request.due-soon': { to: ['rev'], cc: [] },
    'letter.ready': { to: ['sub'], cc: ['rev'] },
    'letter.countersign-needed': { to: ['head1', 'head2'], cc: [] },
    // No actor: an open comment by nobody in particular goes to both parties.
    'comment.added': { to: ['sub', 'rev'], cc: [] },
  };
  it.each(NOTIFY_EVENTS.map((e) => [e]))('%s goes to the right people', (event) => {
    expect(resolveRecipients(event, base)).toEqual(expected[event]);
  });

  it('never notifies the actor', () => {
    expect(resolveRecipients('request.filed', { ...base, actorId: 'head1' }).to).toEqual(['head2']);
    expect(resolveRecipients('request.assigned', { ...base, actorId: 'rev' }).to).toEqual([]);
    expect(resolveRecipients('letter.ready', { ...base, actorId: 'rev' })).toEqual({ to: ['sub'], cc: [] });
  });

  it('sends a comment to the other party, and internal notes to reviewer and heads only', () => {
    expect(resolveRecipients('comment.added', { ...base, actorId: 'sub' }).to).toEqual(['rev']);
    expect(resolveRecipients('comment.added', { ...base, actorId: 'rev' }).to).toEqual(['sub']);
    expect(resolveRecipients('comment.added', { ...base, actorId: 'head1' }).to).toEqual(['sub', 'rev']);
    expect(resolveRecipients('comment.added', { ...base, actorId: 'rev', extra: { internal: 'true' } }).to).toEqual(['head1', 'head2']);
    expect(resolveRecipients('comment.added', { ...base, actorId: 'head1', extra: { internal: 'true' } }).to).toEqual(['rev', 'head2']);
  });

  it('has nobody to tell when no reviewer is assigned', () => {
    expect(resolveRecipients('request.due-soon', { ...base, reviewerId: null }).to).toEqual([]);
    expect(resolveRecipients('letter.ready', { ...base, reviewerId: null })).toEqual({ to: ['sub'], cc: [] });
  });

  it('lists a person once even when they hold two parts', () => {
    // A head who is also the assigned reviewer gets one internal-note notice.
    expect(resolveRecipients('comment.added', { ...base, reviewerId: 'head1', actorId: 'sub', extra: { internal: 'true' } }).to).toEqual(['head1', 'head2']);
  });
});
