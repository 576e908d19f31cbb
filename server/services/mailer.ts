/**
 * Outgoing e-mail through nodemailer. The transport comes from SMTP_URL; without it the
 * message is only logged, so a development machine without a mail server still works.
 */
import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import { loadConfig } from '../config';
import { createLogger } from '../logger';

/** What the mailer needs from the configuration. */
export interface MailSettings {
  smtpUrl: string | null;
  publicUrl: string;
  /** Envelope and header sender. */
  from: string;
  logLevel: string;
}

/** One message to send. */
export interface OutgoingMail {
  to: string;
  cc?: string[];
  subject: string;
  text: string;
  html: string;
}

let settings: MailSettings | null = null;
let logger: Logger | null = null;
let transport: { url: string; t: Transporter } | null = null;

/** Sets the mail settings (createApp calls it; otherwise they come from the environment on first use). */
export function configureMailer(s: { smtpUrl: string | null; publicUrl: string; logLevel: string; from?: string }, log?: Logger): void {
  settings = { smtpUrl: s.smtpUrl, publicUrl: s.publicUrl, logLevel: s.logLevel, from: s.from ?? process.env['MAIL_FROM'] ?? 'Assayer <assayer@localhost>' };
  if (log) logger = log;
}

/** The settings in force: those given to {@link configureMailer}, else read afresh from the environment. */
export function mailSettings(): MailSettings {
  if (settings) return settings;
  const c = loadConfig();
  return { smtpUrl: c.smtpUrl, publicUrl: c.publicUrl, logLevel: c.logLevel, from: process.env['MAIL_FROM'] ?? 'Assayer <assayer@localhost>' };
}

/** The mail logger (shared by the notification code). */
export function mailLogger(): Logger {
  logger ??= createLogger(mailSettings().logLevel);
  return logger;
}

function transporter(url: string): Transporter {
  // Rebuilt when the URL changes: tests start their own fake server per file.
  // Short timeouts: routes await the notification, so a dead mail server must not hold a response for minutes.
  if (transport?.url !== url) transport = { url, t: nodemailer.createTransport({ url, connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 20_000 }) };
  return transport.t;
}

/** Sends one message; returns false (and logs) when it was skipped or failed. Never throws. */
export async function sendMail(m: OutgoingMail): Promise<boolean> {
  try {
    const s = mailSettings();
    if (!s.smtpUrl) {
      mailLogger().info({ to: m.to, subject: m.subject }, 'mail not sent: SMTP_URL is not set');
      return false;
    }
    await transporter(s.smtpUrl).sendMail({ from: s.from, to: m.to, cc: m.cc?.length ? m.cc : undefined, subject: m.subject, text: m.text, html: m.html });
    return true;
  } catch (err) {
    mailLogger().error({ err, to: m.to, subject: m.subject }, 'mail could not be sent');
    return false;
  }
}
