// Sorts a failed send into "try again later" or "give up", the way an SMTP client must (RFC 5321 section 4.2.1).

export type SmtpFailureKind = 'transient' | 'permanent';

export interface SmtpFailure {
  kind: SmtpFailureKind;
  /** One line for people: the reply code and text, or the connection problem. */
  reason: string;
}

/** The fields nodemailer puts on the errors it rejects with. */
interface NodemailerError {
  message?: string;
  code?: string;
  responseCode?: number;
  response?: string;
  command?: string;
}

/**
 * Errors raised before any reply was read: the server was unreachable, slow or hung up. nodemailer reports a
 * refused connection as ESOCKET with "connect ECONNREFUSED" in the message.
 */
const CONNECTION_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ECONNECTION', 'ETIMEDOUT', 'ESOCKET', 'EDNS', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH']);

export function classifySmtpFailure(error: unknown): SmtpFailure {
  const e = (typeof error === 'object' && error !== null ? error : { message: String(error) }) as NodemailerError;
  const message = oneLine(e.message ?? 'unknown error');
  if (typeof e.responseCode === 'number') {
    const reply = oneLine(e.response ?? `${e.responseCode} ${message}`);
    const reason = e.command ? `${reply} (after ${e.command})` : reply;
    // RFC 5321 section 4.2.1: 4yz is a transient negative completion (the same request may succeed later),
    // 5yz a permanent one (do not repeat it unchanged). Anything else here is a reply the client did not expect.
    if (e.responseCode >= 500 && e.responseCode <= 599) return { kind: 'permanent', reason };
    return { kind: 'transient', reason };
  }
  if (e.code !== undefined && CONNECTION_CODES.has(e.code)) {
    return { kind: 'transient', reason: `connection problem (${e.code}): ${message}` };
  }
  // No reply and no network fault: the message itself could not be built or addressed; repeating will not help.
  return { kind: 'permanent', reason: e.code ? `${e.code}: ${message}` : message };
}

function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}
