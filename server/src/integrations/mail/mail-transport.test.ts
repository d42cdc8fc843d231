import { describe, expect, it } from 'vitest';
import { smtpOptions } from './mail-transport';

const base = { SMTP_HOST: '127.0.0.1', SMTP_PORT: 4625, SMTP_SECURE: false, MAIL_FROM: 'Bumpboard <no-reply@bumpboard.test>' };

describe('smtpOptions', () => {
  it('talks plain SMTP to the loopback catcher, one session per message, with bounded waits', () => {
    expect(smtpOptions(base)).toMatchObject({ host: '127.0.0.1', port: 4625, secure: false, ignoreTLS: true, pool: false, socketTimeout: 20_000 });
  });

  it('leaves STARTTLS on for any other host, and implicit TLS when SMTP_SECURE is set (RFC 8314 section 3)', () => {
    expect(smtpOptions({ ...base, SMTP_HOST: 'smtp.example.net', SMTP_PORT: 587 }).ignoreTLS).toBe(false);
    expect(smtpOptions({ ...base, SMTP_HOST: 'smtp.example.net', SMTP_PORT: 465, SMTP_SECURE: true })).toMatchObject({ secure: true, ignoreTLS: false });
  });
});
