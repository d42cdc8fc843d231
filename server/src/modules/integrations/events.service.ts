import type { DataSource, EntityManager } from 'typeorm';
import { integrationEventSchema, type EventResult, type IntegrationEvent } from '@shared/schemas/integration-events';
import { HttpError } from '../../http/errors';
import { applyEvent, type Applied } from './apply-event';

const codeOf = (err: unknown) => (err as { driverError?: { code?: string } })?.driverError?.code ?? (err as { code?: string })?.code ?? '';
const isRetryable = (err: unknown) => ['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT'].includes(codeOf(err));
const DUPLICATE = 'This event id was already received; nothing was applied again.';

/** Thrown inside a one-event batch to undo it: the transaction is the event's savepoint. */
class Undo extends Error {
  constructor(readonly result: Omit<EventResult, 'index' | 'id'>) {
    super('undo');
  }
}

/**
 * The event's row, inserted after its changes and ignored when the (station, event id) pair is already stored: a
 * repeat is found by the unique index at insert, with no look-up first, and its changes are undone.
 */
async function recordEvent(em: EntityManager, stationId: number, event: IntegrationEvent, a: Applied): Promise<boolean> {
  const result: { affectedRows?: number } = await em.query(
    `INSERT IGNORE INTO flight_events (station_id, event_id, flight_id, type, occurred_at, status, summary, payload) VALUES (?, ?, ?, ?, ?, ?, ?, ?)`,
    [stationId, event.id, a.flightId, event.type, new Date(event.occurredAt), a.status, a.summary.slice(0, 200), JSON.stringify(event)],
  );
  return (result.affectedRows ?? 0) > 0;
}

/** One event inside the batch's transaction; anything it changed is undone when it is rejected or a repeat. */
async function applyOne(em: EntityManager, stationId: number, event: IntegrationEvent, own: boolean): Promise<{ result: Omit<EventResult, 'index' | 'id'>; flightId?: number }> {
  if (!own) await em.query('SAVEPOINT feed_event');
  try {
    const a = await applyEvent(em, stationId, event);
    if (!(await recordEvent(em, stationId, event, a))) throw new Undo({ status: 'duplicate', message: DUPLICATE });
    if (!own) await em.query('RELEASE SAVEPOINT feed_event');
    return { result: { status: a.status, message: a.summary }, flightId: a.flightId };
  } catch (err) {
    const undo = err instanceof Undo ? err : err instanceof HttpError ? new Undo({ status: 'rejected', message: err.message, details: err.details }) : null;
    if (!undo) throw err;
    if (own) throw undo;
    await em.query('ROLLBACK TO SAVEPOINT feed_event');
    return { result: undo.result };
  }
}

/**
 * Applies a batch in one transaction, each event under a savepoint of its own: a bad event is rejected alone, a
 * repeated id (in the batch or from before) is acknowledged without being applied twice, and the batch commits once.
 * A deadlock retries the whole batch.
 */
export async function applyEventBatch(db: DataSource, stationId: number, raw: unknown[]): Promise<{ results: EventResult[]; touchedFlights: Set<number> }> {
  const parsed = raw.map((item, index) => {
    const id = typeof (item as { id?: unknown })?.id === 'string' ? (item as { id: string }).id : null;
    const p = integrationEventSchema.safeParse(item);
    if (p.success) return { index, id, event: p.data };
    const details = p.error.issues.map((i) => ({ field: i.path.join('.') || 'event', rule: i.message }));
    return { index, id, rejected: { status: 'rejected' as const, message: `${details[0].field}: ${details[0].rule}`, details } };
  });
  const valid = parsed.filter((p) => p.event);
  // A batch of one needs no savepoint: its transaction is rolled back instead.
  const own = valid.length === 1;
  for (let attempt = 1; ; attempt++) {
    const touchedFlights = new Set<number>();
    const outcome = new Map<number, Omit<EventResult, 'index' | 'id'>>();
    try {
      if (valid.length) {
        await db.transaction(async (em) => {
          for (const p of valid) {
            const r = await applyOne(em, stationId, p.event!, own);
            outcome.set(p.index, r.result);
            if (r.flightId !== undefined) touchedFlights.add(r.flightId);
          }
        });
      }
    } catch (err) {
      if (err instanceof Undo) outcome.set(valid[0].index, err.result);
      else if (isRetryable(err) && attempt < 4) continue;
      else throw err;
    }
    const results = parsed.map((p) => ({ index: p.index, id: p.id, ...(p.rejected ?? outcome.get(p.index)!) }));
    return { results, touchedFlights };
  }
}
