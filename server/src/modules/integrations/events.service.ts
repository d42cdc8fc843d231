import type { DataSource, EntityManager } from 'typeorm';
import { integrationEventSchema, type EventResult, type IntegrationEvent } from '@shared/schemas/integration-events';
import { DomainError } from '../../domain/errors';
import { forecastStale, recordEffect } from '../../events';
import { applyEvent, BatchFlights, type Applied } from './apply-event';

const codeOf = (err: unknown) => (err as { driverError?: { code?: string } })?.driverError?.code ?? (err as { code?: string })?.code ?? '';
const isRetryable = (err: unknown) => err instanceof RaceLost || ['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT'].includes(codeOf(err));
const DUPLICATE = 'This event id was already received; nothing was applied again.';

/** Another batch stored one of our event ids between our look-up and our insert: the whole batch runs again. */
class RaceLost extends Error {}

type Outcome = Omit<EventResult, 'index' | 'id'>;

/** Ids of this batch already stored for the station, in one look-up. */
async function storedIds(em: EntityManager, stationId: number, ids: string[]): Promise<Set<string>> {
  if (!ids.length) return new Set();
  const rows: { event_id: string }[] = await em.query('SELECT event_id FROM flight_events WHERE station_id = ? AND event_id IN (?)', [stationId, ids]);
  return new Set(rows.map((r) => r.event_id));
}

/**
 * The batch's event rows in one INSERT IGNORE, in arrival order (the trail's order). The unique index on (station,
 * event id) still decides: a row ignored means a concurrent batch stored that id after our look-up, and ours is
 * rolled back and run again, when the look-up finds it.
 */
async function recordEvents(em: EntityManager, stationId: number, rows: { event: IntegrationEvent; a: Applied }[]) {
  if (!rows.length) return;
  const values = rows.map(({ event, a }) => [stationId, event.id, a.flightId, event.type, new Date(event.occurredAt), a.status, a.summary.slice(0, 200), JSON.stringify(event)]);
  const result: { affectedRows?: number } = await em.query(
    'INSERT IGNORE INTO flight_events (station_id, event_id, flight_id, type, occurred_at, status, summary, payload) VALUES ?',
    [values],
  );
  if ((result.affectedRows ?? 0) < rows.length) throw new RaceLost('an event id of this batch was stored meanwhile');
}

/**
 * Applies a batch in one transaction: ids already stored (or repeated in the batch) are acknowledged without being
 * applied twice, a bad event is rejected alone (every check of an event comes before its first write, so a rejected
 * event has changed nothing), and the batch commits once. Statements per status event: one guarded update; per batch:
 * the id look-up, each flight's look-up, one locking read of every booking the status events name, and one insert of
 * all event rows. A deadlock, or a
 * concurrent batch storing one of our ids, retries the whole batch.
 */
export async function applyEventBatch(db: DataSource, stationId: number, raw: unknown[]): Promise<{ results: EventResult[] }> {
  const parsed = raw.map((item, index) => {
    const id = typeof (item as { id?: unknown })?.id === 'string' ? (item as { id: string }).id : null;
    const p = integrationEventSchema.safeParse(item);
    if (p.success) return { index, id, event: p.data };
    const details = p.error.issues.map((i) => ({ field: i.path.join('.') || 'event', rule: i.message }));
    return { index, id, rejected: { status: 'rejected' as const, message: `${details[0].field}: ${details[0].rule}`, details } };
  });
  const valid = parsed.filter((p): p is typeof p & { event: IntegrationEvent } => p.event !== undefined);
  for (let attempt = 1; ; attempt++) {
    const outcome = new Map<number, Outcome>();
    try {
      if (valid.length) {
        await db.transaction(async (em) => {
          const seen = await storedIds(em, stationId, [...new Set(valid.map((p) => p.event.id))]);
          const flights = new BatchFlights(em, stationId);
          await flights.lockAhead(valid.filter((p) => !seen.has(p.event.id)).map((p) => p.event));
          const rows: { event: IntegrationEvent; a: Applied }[] = [];
          for (const p of valid) {
            if (seen.has(p.event.id)) {
              outcome.set(p.index, { status: 'duplicate', message: DUPLICATE });
              continue;
            }
            seen.add(p.event.id);
            try {
              const a = await applyEvent(em, flights, p.event);
              rows.push({ event: p.event, a });
              outcome.set(p.index, { status: a.status, message: a.summary });
              // Once the batch commits, the flight is recomputed (its notice follows the new version).
              recordEffect(em, forecastStale(a.flightId));
            } catch (err) {
              if (!(err instanceof DomainError)) throw err;
              // Rejected: its id stays free, so the feed may send the event again once fixed.
              seen.delete(p.event.id);
              outcome.set(p.index, { status: 'rejected', message: err.message, details: err.details });
            }
          }
          await recordEvents(em, stationId, rows);
        });
      }
    } catch (err) {
      if (isRetryable(err) && attempt < 4) continue;
      throw err;
    }
    const results = parsed.map((p) => ({ index: p.index, id: p.id, ...(p.rejected ?? outcome.get(p.index)!) }));
    return { results };
  }
}
