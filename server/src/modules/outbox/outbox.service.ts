// Writing to the outbox inside a caller's transaction, and the reads and re-queue behind the notices routes.
import { randomUUID } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { outboxMessageSchema } from '@shared/schemas/volunteers';
import type { z } from 'zod';
import { OutboxMessageEntity } from '../../db/entities';
import { conflict, notFound } from '../../domain/errors';
import { flightChanged, mailQueued, recordEffect, type DomainEvent } from '../../events';
import { audit } from '../audit/audit.service';
import { checkOutboxInput, type OutboxInput } from './outbox-input';

export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export interface EnqueueResult {
  /** The stable message id, stamped on the mail as Message-ID and X-Bumpboard-Message-Id. */
  id: string;
  /** false when a message with the same dedupeKey already existed; its id is returned instead. */
  created: boolean;
}

/** Newest messages shown per flight; a flight never has anywhere near this many notices. */
const LIST_LIMIT = 500;

/**
 * Adds a message in the caller's transaction: it is sent only if that transaction commits. A message whose
 * dedupeKey is already in the table is not added again, so retrying a business action cannot mail twice.
 * All times come from the database clock, the same clock the worker compares against. The workers are woken once
 * that transaction commits, so no caller has to remember to.
 */
export async function enqueueMessage(em: EntityManager, input: OutboxInput): Promise<EnqueueResult> {
  const msg = checkOutboxInput(input);
  const id = randomUUID();
  // ON DUPLICATE KEY with a no-op update: a repeated dedupe_key is a quiet "already there", not an error that
  // would have to be caught inside the caller's transaction. affectedRows cannot tell the two apart (with the
  // driver's FOUND_ROWS flag a no-op update also counts 1), so the id that holds the key decides.
  await em.query(
    `INSERT INTO outbox_messages
       (id, station_id, flight_id, passenger_ids, kind, to_address, subject, text, html, status, attempts, next_attempt_at, created_at, dedupe_key)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, 'pending', 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3), ?)
     ON DUPLICATE KEY UPDATE id = id`,
    [id, msg.stationId, msg.flightId, JSON.stringify(msg.passengerIds), msg.kind, msg.to, msg.subject, msg.text, msg.html, msg.dedupeKey],
  );
  // Once committed: the workers look now, and the flight's consoles see the notice in its list.
  const queued: DomainEvent[] = [mailQueued(), ...(msg.flightId === null ? [] : [flightChanged(msg.flightId, msg.stationId, ['notices'])])];
  if (msg.dedupeKey === null) {
    recordEffect(em, ...queued);
    return { id, created: true };
  }
  const [holder]: { id: string }[] = await em.query('SELECT id FROM outbox_messages WHERE dedupe_key = ?', [msg.dedupeKey]);
  if (holder.id === id) recordEffect(em, ...queued);
  return { id: holder.id, created: holder.id === id };
}

export function presentOutboxMessage(row: OutboxMessageEntity): OutboxMessage {
  return {
    id: row.id,
    kind: row.kind,
    to: row.toAddress,
    subject: row.subject,
    status: row.status,
    attempts: row.attempts,
    lastError: row.lastError,
    createdAt: row.createdAt.toISOString(),
    sentAt: row.sentAt?.toISOString() ?? null,
    passengerIds: row.passengerIds,
  };
}

/** A flight's notices, newest first; messages of the same millisecond in id order, so the list is stable. */
export async function listFlightNotices(db: DataSource, flight: { id: number; stationId: number }): Promise<{ messages: OutboxMessage[] }> {
  const rows = await db.getRepository(OutboxMessageEntity).find({
    where: { flightId: flight.id, stationId: flight.stationId },
    order: { createdAt: 'DESC', id: 'DESC' },
    take: LIST_LIMIT,
  });
  return { messages: rows.map(presentOutboxMessage) };
}

/**
 * Puts a failed message back in the queue with a fresh set of tries, audited. Only 'failed' may be re-queued:
 * re-queueing a pending or sent message could mail it twice.
 */
export async function requeueFailedNotice(db: DataSource, user: SessionUser, flight: { id: number; stationId: number }, messageId: string): Promise<OutboxMessage> {
  return db.transaction(async (em) => {
    const row = await em.findOne(OutboxMessageEntity, { where: { id: messageId, flightId: flight.id, stationId: flight.stationId }, lock: { mode: 'pessimistic_write' } });
    if (!row) throw notFound('Notice');
    if (row.status !== 'failed') throw conflict('notice_not_failed', `Only a failed notice can be sent again; this one is ${row.status}.`);
    const before = { status: row.status, attempts: row.attempts, lastError: row.lastError };
    // last_error is kept: until a try replaces it, and after a successful one, the list shows what went wrong.
    await em.query(`UPDATE outbox_messages SET status = 'pending', attempts = 0, next_attempt_at = UTC_TIMESTAMP(3) WHERE id = ?`, [row.id]);
    await audit(em, { actor: user, action: 'notice.requeued', entityType: 'outbox_message', entityId: row.id, stationId: row.stationId, before, after: { status: 'pending', attempts: 0 } });
    recordEffect(em, mailQueued());
    const updated = await em.findOneByOrFail(OutboxMessageEntity, { id: row.id });
    return presentOutboxMessage(updated);
  });
}
