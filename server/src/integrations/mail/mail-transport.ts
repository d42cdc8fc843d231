// The one SMTP transport the server sends through, built from configuration.
import { createTransport } from 'nodemailer';
import type SMTPTransport from 'nodemailer/lib/smtp-transport';
import type { Env } from '../../config/env';

/** One message as the outbox hands it to SMTP. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** The Message-ID header, angle brackets included (RFC 5322 section 3.6.4). */
  messageId: string;
  headers: Record<string, string>;
}

/** What the outbox needs of a transport: nodemailer's, or a stand-in in tests. */
export interface MailTransport {
  sendMail(mail: OutgoingMail): Promise<SMTPTransport.SentMessageInfo>;
  close(): void;
}

export type MailConfig = Pick<Env, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_SECURE' | 'MAIL_FROM'>;

/**
 * Bounded waits so a stalled server fails one attempt instead of holding the worker; the outbox's claim lease
 * is longer than their sum, so a slow send is never claimed twice.
 */
export const SMTP_TIMEOUTS_MS = { connectionTimeout: 5_000, greetingTimeout: 5_000, socketTimeout: 20_000 } as const;

const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '::1']);

export function smtpOptions(config: MailConfig): SMTPTransport.Options {
  return {
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE,
    // On loopback there is nothing to protect and the local catcher offers no STARTTLS; elsewhere nodemailer
    // upgrades whenever the server offers it.
    ignoreTLS: !config.SMTP_SECURE && LOOPBACK_HOSTS.has(config.SMTP_HOST),
    // One SMTP session per message (no pool): a refused or dropped session affects exactly one message.
    pool: false,
    ...SMTP_TIMEOUTS_MS,
  };
}

/** nodemailer transport with MAIL_FROM as the default sender. */
export function createMailTransport(config: MailConfig): MailTransport {
  return createTransport(smtpOptions(config), { from: config.MAIL_FROM });
}
