/**
 * Reading the e-mail the fake SMTP server caught (MAIL_DIR, set by the harness or by
 * `npm test`), so API tests can assert on what was sent.
 */
import { readMailbox, type StoredMail } from '../../../server/ops/fake-smtp';

export type { StoredMail };

function mailDir(): string {
  const dir = process.env['MAIL_DIR'];
  if (!dir) throw new Error('MAIL_DIR is not set: use useApiHarness() (it starts a fake SMTP server) or run under npm test');
  return dir;
}

/** Every message caught so far, oldest first. */
export function mailbox(): StoredMail[] {
  return readMailbox(mailDir());
}

/** Waits until a message matching `pred` arrives (mail is sent after the response), else rejects after timeoutMs. */
export async function waitForMail(pred: (m: StoredMail) => boolean, timeoutMs = 5000): Promise<StoredMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const hit = mailbox().find(pred);
    if (hit) return hit;
    if (Date.now() > until) {
      const seen = mailbox().map((m) => `${m.to.join(',')}: ${m.subject}`);
      throw new Error(`no matching e-mail within ${timeoutMs} ms; mailbox has ${seen.length}: ${seen.slice(-10).join(' | ')}`);
    }
    await new Promise((r) => setTimeout(r, 50));
  }
}
