// The shape of one caught message, as kept in memory, written to the JSONL file and served by the JSON API.
import { z } from 'zod';

/** Header names kept on each message; the server stamps the second one so a test can count deliveries. */
export const MESSAGE_ID_HEADER = 'Message-ID';
export const BUMPBOARD_ID_HEADER = 'X-Bumpboard-Message-Id';

export const storedMessageSchema = z.object({
  id: z.string().min(1),
  /** ISO 8601 instant in UTC. */
  receivedAt: z.iso.datetime(),
  /** The From header as written by the sender, falling back to the envelope sender (MAIL FROM). */
  from: z.string(),
  /** Envelope recipients (RCPT TO), so Cc and Bcc deliveries show up too. */
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  /** null when the message had no HTML part. */
  html: z.string().nullable(),
  /** Only the headers of interest that were present, keyed by their canonical spelling. */
  headers: z.record(z.string(), z.string()),
});

export type StoredMessage = z.infer<typeof storedMessageSchema>;

/** Filters of GET /api/messages; every given filter must match. */
export interface MessageFilter {
  /** An envelope recipient, compared case-insensitively. */
  to?: string;
  /** A case-insensitive substring of the subject. */
  subject?: string;
  /** Exact value of the X-Bumpboard-Message-Id header. */
  bumpboardMessageId?: string;
  /** Exact value of the Message-ID header. */
  messageId?: string;
}

export function matchesFilter(message: StoredMessage, filter: MessageFilter): boolean {
  if (filter.to !== undefined) {
    const wanted = filter.to.toLowerCase();
    if (!message.to.some((address) => address.toLowerCase() === wanted)) return false;
  }
  if (filter.subject !== undefined && !message.subject.toLowerCase().includes(filter.subject.toLowerCase())) {
    return false;
  }
  if (filter.bumpboardMessageId !== undefined && message.headers[BUMPBOARD_ID_HEADER] !== filter.bumpboardMessageId) {
    return false;
  }
  if (filter.messageId !== undefined && message.headers[MESSAGE_ID_HEADER] !== filter.messageId) return false;
  return true;
}
