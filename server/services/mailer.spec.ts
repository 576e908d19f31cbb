/** The mailer skips without SMTP_URL, delivers to an SMTP server, and never throws when delivery fails. */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort } from '../ops/free-port';
import { readMailbox, startFakeSmtp } from '../ops/fake-smtp';
import { configureMailer, sendMail } from './mailer';

const msg = { to: 'imani@demo.test', cc: ['owen@demo.test'], subject: 'Test subject', text: 'Plain body', html: '<p>HTML body</p>' };
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'assayer-mailer-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe('sendMail', () => {
  it('skips (returns false) when no SMTP URL is configured', async () => {
    configureMailer({ smtpUrl: null, publicUrl: 'http://x.test', logLevel: 'silent' });
    await expect(sendMail(msg)).resolves.toBe(false);
  });

  it('delivers text, HTML and copies to the SMTP server', async () => {
    const smtp = await startFakeSmtp({ dir });
    try {
      configureMailer({ smtpUrl: smtp.url, publicUrl: 'http://x.test', logLevel: 'silent', from: 'Assayer <assayer@demo.test>' });
      await expect(sendMail(msg)).resolves.toBe(true);
      const [m] = readMailbox(dir);
      expect(m).toMatchObject({ from: 'assayer@demo.test', subject: 'Test subject', text: 'Plain body', html: '<p>HTML body</p>' });
      expect([...m!.to].sort()).toEqual(['imani@demo.test', 'owen@demo.test']);
    } finally {
      await smtp.stop();
    }
  });

  it('returns false instead of throwing when the server cannot be reached', async () => {
    configureMailer({ smtpUrl: `smtp://127.0.0.1:${await freePort()}`, publicUrl: 'http://x.test', logLevel: 'silent' });
    await expect(sendMail(msg)).resolves.toBe(false);
  });
});
