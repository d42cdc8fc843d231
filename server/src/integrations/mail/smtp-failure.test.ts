import { describe, expect, it } from 'vitest';
import { classifySmtpFailure } from './smtp-failure';

// The error shapes are what nodemailer 10 rejects with against the local catcher (observed: RCPT 452/550,
// DATA 451, connection refused), built here by hand so the rule is checked without a network.
describe('classifySmtpFailure', () => {
  it('treats a 4yz reply as transient (RFC 5321 section 4.2.1: transient negative completion)', () => {
    const failure = classifySmtpFailure({ code: 'EENVELOPE', responseCode: 452, response: '452 try later', command: 'RCPT TO', message: "Can't send mail" });
    expect(failure).toEqual({ kind: 'transient', reason: '452 try later (after RCPT TO)' });
  });

  it('treats 421 "service not available" as transient (RFC 5321 section 3.8 and 4.2.3)', () => {
    expect(classifySmtpFailure({ code: 'EPROTOCOL', responseCode: 421, response: '421 closing channel' }).kind).toBe('transient');
  });

  it('treats a 4yz reply after DATA as transient (RFC 5321 section 4.2.1)', () => {
    expect(classifySmtpFailure({ code: 'EMESSAGE', responseCode: 451, response: '451 local error', command: 'DATA' }).kind).toBe('transient');
  });

  it('treats a 5yz reply as permanent and keeps the server text (RFC 5321 section 4.2.1: permanent negative completion)', () => {
    const failure = classifySmtpFailure({ code: 'EENVELOPE', responseCode: 550, response: '550 Mailbox unavailable', command: 'RCPT TO' });
    expect(failure).toEqual({ kind: 'permanent', reason: '550 Mailbox unavailable (after RCPT TO)' });
  });

  it('treats a refused, reset or timed-out connection as transient (no reply was received; common practice)', () => {
    expect(classifySmtpFailure({ code: 'ESOCKET', command: 'CONN', message: 'connect ECONNREFUSED 127.0.0.1:4625' })).toEqual({
      kind: 'transient',
      reason: 'connection problem (ESOCKET): connect ECONNREFUSED 127.0.0.1:4625',
    });
    for (const code of ['ECONNREFUSED', 'ETIMEDOUT', 'ECONNECTION', 'ECONNRESET']) expect(classifySmtpFailure({ code, message: 'x' }).kind).toBe('transient');
  });

  it('gives up on failures with neither a reply nor a network fault, since repeating cannot help', () => {
    expect(classifySmtpFailure({ code: 'EENVELOPE', message: 'No recipients defined' })).toEqual({ kind: 'permanent', reason: 'EENVELOPE: No recipients defined' });
    expect(classifySmtpFailure('boom')).toEqual({ kind: 'permanent', reason: 'boom' });
  });

  it('folds multi-line replies onto one line for the last_error column', () => {
    expect(classifySmtpFailure({ responseCode: 450, response: '450-first\r\n450 second' }).reason).toBe('450-first 450 second');
  });
});
