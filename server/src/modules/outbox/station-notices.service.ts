// The station's notices for the Notices screen: list, open, retry a failed one, send a sent one again.
import { randomUUID } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { NoticeDetail, NoticesQuery, StationNotice, StationNoticeList } from '@shared/schemas/admin-notices';
import { FlightEntity, OutboxMessageEntity } from '../../db/entities';
import { conflict, notFound } from '../../domain/errors';
import { mailQueued, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';

/** Newest notices shown at once; the filters narrow a busy station's list. */
const LIST_LIMIT = 300;
/** A copy made by "send again" names its original in the dedupe key, so the screen can say what it repeats. */
const RESEND_PREFIX = 'resend:';

function present(row: OutboxMessageEntity, flights: Map<number, FlightEntity>): StationNotice {
  const f = row.flightId ? flights.get(row.flightId) : undefined;
  return {
    id: row.id, kind: row.kind, to: row.toAddress, subject: row.subject, status: row.status, attempts: row.attempts, lastError: row.lastError,
    createdAt: row.createdAt.toISOString(), sentAt: row.sentAt?.toISOString() ?? null, nextAttemptAt: row.nextAttemptAt.toISOString(),
    flight: f ? { id: f.id, label: `${f.carrierCode}${f.flightNumber} ${f.serviceDate}` } : null,
    resendOf: row.dedupeKey?.startsWith(RESEND_PREFIX) ? row.dedupeKey.slice(RESEND_PREFIX.length).split(':')[0] : null,
  };
}

async function flightsOf(em: DataSource | EntityManager, rows: OutboxMessageEntity[]) {
  const ids = [...new Set(rows.map((r) => r.flightId).filter((id): id is number => id !== null))];
  const flights = ids.length ? await em.getRepository(FlightEntity).createQueryBuilder('f').whereInIds(ids).getMany() : [];
  return new Map(flights.map((f) => [f.id, f]));
}

export async function listStationNotices(db: DataSource, stationId: number, q: NoticesQuery): Promise<StationNoticeList> {
  const qb = db.getRepository(OutboxMessageEntity).createQueryBuilder('m').where('m.stationId = :stationId', { stationId });
  if (q.status) qb.andWhere('m.status = :status', { status: q.status });
  if (q.flightId) qb.andWhere('m.flightId = :flightId', { flightId: q.flightId });
  if (q.q) qb.andWhere('(m.toAddress LIKE :like OR m.subject LIKE :like)', { like: `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%` });
  const rows = await qb.orderBy('m.createdAt', 'DESC').addOrderBy('m.id', 'DESC').take(LIST_LIMIT).getMany();
  const counted: { status: string; n: string }[] = await db.query('SELECT status, COUNT(*) AS n FROM outbox_messages WHERE station_id = ? GROUP BY status', [stationId]);
  const counts = { pending: 0, sent: 0, failed: 0 };
  for (const c of counted) if (c.status in counts) counts[c.status as keyof typeof counts] = Number(c.n);
  const flights = await flightsOf(db, rows);
  return { notices: rows.map((r) => present(r, flights)), limit: LIST_LIMIT, counts };
}

async function find(em: DataSource | EntityManager, stationId: number, id: string, lock = false): Promise<OutboxMessageEntity> {
  const row = await em.getRepository(OutboxMessageEntity).findOne({ where: { id, stationId }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  if (!row) throw notFound('Notice');
  return row;
}

export async function noticeDetail(db: DataSource, stationId: number, id: string): Promise<NoticeDetail> {
  const row = await find(db, stationId, id);
  return { ...present(row, await flightsOf(db, [row])), text: row.text, html: row.html };
}

/** A failed notice back in the queue with a fresh set of tries. Pending or sent ones are refused: that could mail twice. */
export async function retryStationNotice(db: DataSource, user: SessionUser, stationId: number, id: string): Promise<StationNotice> {
  return db.transaction(async (em) => {
    const row = await find(em, stationId, id, true);
    if (row.status !== 'failed') throw conflict('notice_not_failed', `Only a failed notice can be retried; this one is ${row.status}.${row.status === 'sent' ? ' Use "Send again" to mail a copy.' : ''}`);
    const before = { status: row.status, attempts: row.attempts, lastError: row.lastError };
    await em.query(`UPDATE outbox_messages SET status = 'pending', attempts = 0, next_attempt_at = UTC_TIMESTAMP(3) WHERE id = ?`, [row.id]);
    await audit(em, { actor: user, action: 'notice.requeued', entityType: 'outbox_message', entityId: row.id, stationId, before: { ...before, flightId: row.flightId }, after: { status: 'pending', attempts: 0, flightId: row.flightId } });
    recordEffect(em, mailQueued());
    const updated = await find(em, stationId, id);
    return present(updated, await flightsOf(em, [updated]));
  });
}

/**
 * A new copy of a sent notice, for a passenger who says it never arrived. The copy is a message of its own (new id,
 * so the mail is not taken for a duplicate); a second request while a copy still waits is refused.
 */
export async function resendStationNotice(db: DataSource, user: SessionUser, stationId: number, id: string): Promise<StationNotice> {
  return db.transaction(async (em) => {
    const row = await find(em, stationId, id, true);
    if (row.status !== 'sent') throw conflict('notice_not_sent', `Only a sent notice can be sent again; this one is ${row.status}.${row.status === 'failed' ? ' Use "Retry" instead.' : ''}`);
    const [waiting]: { n: string }[] = await em.query("SELECT COUNT(*) AS n FROM outbox_messages WHERE dedupe_key LIKE ? AND status = 'pending'", [`${RESEND_PREFIX}${row.id}:%`]);
    if (Number(waiting.n) > 0) throw conflict('resend_pending', 'A copy of this notice is already waiting to be sent.');
    const copyId = randomUUID();
    await em.query(
      `INSERT INTO outbox_messages (id, station_id, flight_id, passenger_ids, kind, to_address, subject, text, html, status, attempts, next_attempt_at, created_at, dedupe_key)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, 'pending', 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3), ?)`,
      [copyId, row.stationId, row.flightId, JSON.stringify(row.passengerIds), row.kind, row.toAddress, row.subject, row.text, row.html, `${RESEND_PREFIX}${row.id}:${copyId.slice(0, 8)}`],
    );
    await audit(em, { actor: user, action: 'notice.resent', entityType: 'outbox_message', entityId: copyId, stationId, before: { original: row.id, flightId: row.flightId }, after: { status: 'pending', to: row.toAddress, subject: row.subject, flightId: row.flightId } });
    recordEffect(em, mailQueued());
    const copy = await find(em, stationId, copyId);
    return present(copy, await flightsOf(em, [copy]));
  });
}
