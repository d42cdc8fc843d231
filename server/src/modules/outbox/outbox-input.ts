// What a module hands the outbox: checked here so a bad address or an oversized body fails in the caller's
// transaction with the field named, not later in the worker.
import { z } from 'zod';
import { badRequest } from '../../domain/errors';

/** Kinds in use; the column takes any short kebab-case name so a new notice needs no migration. */
export const OUTBOX_KINDS = ['volunteer-confirmation', 'rebooking-notice', 'written-statement', 'compensation-receipt', 'care-summary'] as const;

/** Far below the catcher's and common providers' 10 MiB limits, and well inside MEDIUMTEXT. */
const MAX_BODY_CHARS = 1_000_000;

export const outboxInputSchema = z.object({
  stationId: z.number().int().positive('must be a positive station id'),
  flightId: z.number().int().positive('must be a positive flight id').nullable().default(null),
  passengerIds: z.array(z.number().int().positive('must be positive passenger ids')).max(500, 'at most 500 passengers').default([]),
  kind: z.string().regex(/^[a-z][a-z0-9-]{0,39}$/, 'must be 1-40 lower-case letters, digits or hyphens, starting with a letter'),
  // 254: the longest address that fits a RCPT TO path (RFC 5321 section 4.5.3.1.3, with RFC 3696 errata 1690).
  to: z.email('must be an e-mail address').max(254, 'must be at most 254 characters'),
  subject: z.string().trim().min(1, 'must not be empty').max(300, 'must be at most 300 characters')
    .refine((s) => !/[\r\n]/.test(s), 'must be one line'),
  text: z.string().min(1, 'must not be empty').max(MAX_BODY_CHARS, `must be at most ${MAX_BODY_CHARS} characters`),
  html: z.string().max(MAX_BODY_CHARS, `must be at most ${MAX_BODY_CHARS} characters`).nullable().default(null),
  dedupeKey: z.string().min(1, 'must not be empty').max(100, 'must be at most 100 characters').nullable().default(null),
});

export type OutboxInput = z.input<typeof outboxInputSchema>;
export type CheckedOutboxInput = z.output<typeof outboxInputSchema>;

export function checkOutboxInput(input: OutboxInput): CheckedOutboxInput {
  const parsed = outboxInputSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  const details = parsed.error.issues.map((i) => ({ field: `message.${i.path.join('.') || 'body'}`, rule: i.message }));
  throw badRequest(`${details[0].field}: ${details[0].rule}`, details);
}
