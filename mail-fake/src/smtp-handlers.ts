// The SMTP server itself: accepts mail from nodemailer, applies the fault switch, parses and stores messages.
import { randomUUID } from 'node:crypto';
import { SMTPServer, type SMTPServerError, type SMTPServerSession } from 'smtp-server';
import { simpleParser, type ParsedMail } from 'mailparser';
import type { FaultSwitch } from './faults.js';
import type { Inbox } from './inbox.js';
import { BUMPBOARD_ID_HEADER, MESSAGE_ID_HEADER, type StoredMessage } from './message.js';

export const DEFAULT_MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

export interface SmtpDeps {
  inbox: Inbox;
  faults: FaultSwitch;
  maxMessageBytes: number;
  /** Where SMTP-level errors (client resets and the like) are reported. */
  onError: (error: Error) => void;
  now?: () => Date;
}

/** The decision taken at the first RCPT TO of a transaction, reused for its other recipients. */
interface RcptDecision {
  transaction: number;
  rejection: SMTPServerError | null;
}

export function createSmtpServer(deps: SmtpDeps): SMTPServer {
  const now = deps.now ?? (() => new Date());
  const rcptDecisions = new WeakMap<SMTPServerSession, RcptDecision>();

  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Local mail catcher (test mail)',
    size: deps.maxMessageBytes,
    rejectOversized: true,
    logger: false,
    // Shutdown should not hang for the library's default 30 s on a client that never says QUIT.
    closeTimeout: 2000,

    onRcptTo(_address, session, callback) {
      // One decision per transaction: a counted fault refuses whole messages, never some of their recipients.
      let decision = rcptDecisions.get(session);
      if (decision === undefined || decision.transaction !== session.transaction) {
        decision = { transaction: session.transaction, rejection: deps.faults.takeRejection('rcpt') };
        rcptDecisions.set(session, decision);
      }
      callback(decision.rejection);
    },

    onData(stream, session, callback) {
      const rejection = deps.faults.takeRejection('data');
      if (rejection !== null) {
        callback(rejection); // the library drains the rest of the message before replying
        return;
      }
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => {
        if (!stream.sizeExceeded) chunks.push(chunk);
      });
      stream.on('end', () => {
        if (stream.sizeExceeded) {
          callback(); // rejectOversized makes the library answer 552 itself
          return;
        }
        storeMessage(Buffer.concat(chunks), session, deps.inbox, now())
          .then((id) => callback(null, `OK: queued as ${id}`))
          .catch((error: Error) => {
            deps.onError(error);
            // RFC 5321 section 4.2.3: 451 "local error in processing" tells the sender to retry.
            callback(Object.assign(new Error('Local error while storing the message'), { responseCode: 451 }));
          });
      });
    },
  });

  server.on('error', deps.onError);
  return server;
}

async function storeMessage(raw: Buffer, session: SMTPServerSession, inbox: Inbox, receivedAt: Date): Promise<string> {
  const parsed = await simpleParser(raw);
  const message = toStoredMessage(parsed, session, receivedAt);
  await inbox.add(message);
  return message.id;
}

export function toStoredMessage(parsed: ParsedMail, session: SMTPServerSession, receivedAt: Date): StoredMessage {
  const envelopeFrom = session.envelope.mailFrom === false ? '' : session.envelope.mailFrom.address;
  const headers: Record<string, string> = {};
  if (parsed.messageId) headers[MESSAGE_ID_HEADER] = parsed.messageId;
  const bumpboardId = firstHeaderText(parsed, BUMPBOARD_ID_HEADER);
  if (bumpboardId !== null) headers[BUMPBOARD_ID_HEADER] = bumpboardId;
  return {
    id: randomUUID(),
    receivedAt: receivedAt.toISOString(),
    from: parsed.from?.text || envelopeFrom,
    to: session.envelope.rcptTo.map((recipient) => recipient.address),
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    headers,
  };
}

/** mailparser keys headers in lower case and turns a repeated header into an array. */
function firstHeaderText(parsed: ParsedMail, name: string): string | null {
  const value = parsed.headers.get(name.toLowerCase());
  const first = Array.isArray(value) ? value[0] : value;
  return typeof first === 'string' && first.trim() !== '' ? first.trim() : null;
}
