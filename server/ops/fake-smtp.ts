/**
 * A local stand-in for the office's mail server, for development and tests.
 * Accepts every message on 127.0.0.1 and stores it as one JSON file per message
 * in a directory, where tests and the admins' outbox page read them.
 */
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { mkdirSync, writeFileSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import { freePort } from './free-port';

/** A message as the fake server stores it. */
export interface StoredMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

/** A running fake SMTP server. */
export interface FakeSmtpHandle {
  port: number;
  /** SMTP URL for nodemailer, e.g. smtp://127.0.0.1:2525. */
  url: string;
  dir: string;
  stop(): Promise<void>;
}

/** Starts the fake SMTP server; messages land in `dir`. */
export async function startFakeSmtp(opts: { dir: string; port?: number }): Promise<FakeSmtpHandle> {
  mkdirSync(opts.dir, { recursive: true });
  const port = opts.port ?? (await freePort());
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const mail: StoredMail = {
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          };
          // Time-prefixed names keep the directory listing in arrival order.
          writeFileSync(join(opts.dir, `${Date.now()}-${mail.id}.json`), JSON.stringify(mail, null, 2));
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  return {
    port,
    url: `smtp://127.0.0.1:${port}`,
    dir: opts.dir,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** Reads the stored messages, oldest first. */
export function readMailbox(dir: string): StoredMail[] {
  let names: string[];
  try {
    names = readdirSync(dir).filter((n) => n.endsWith('.json')).sort();
  } catch {
    return [];
  }
  return names.map((n) => JSON.parse(readFileSync(join(dir, n), 'utf8')) as StoredMail);
}
