import type { DataSource } from 'typeorm';
import { integrationEventSchema, type EventResult } from '@shared/schemas/integration-events';
import { FlightEventEntity } from '../../db/entities';
import { HttpError } from '../../http/errors';
import { applyEvent } from './apply-event';

const isDuplicateKey = (err: unknown) => (err as { code?: string })?.code === 'ER_DUP_ENTRY' || (err as { driverError?: { code?: string } })?.driverError?.code === 'ER_DUP_ENTRY';
const isRetryable = (err: unknown) => ['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT'].includes((err as { driverError?: { code?: string } })?.driverError?.code ?? (err as { code?: string })?.code ?? '');

/**
 * Applies a batch one event at a time, each in its own transaction with its event row, so a bad event is rejected
 * alone and a repeated id (the unique index on station + event id) is acknowledged without being applied twice.
 */
export async function applyEventBatch(db: DataSource, stationId: number, raw: unknown[]): Promise<{ results: EventResult[]; touchedFlights: Set<number> }> {
  const results: EventResult[] = [];
  const touchedFlights = new Set<number>();
  for (const [index, item] of raw.entries()) {
    const id = typeof (item as { id?: unknown })?.id === 'string' ? (item as { id: string }).id : null;
    const parsed = integrationEventSchema.safeParse(item);
    if (!parsed.success) {
      const details = parsed.error.issues.map((i) => ({ field: i.path.join('.') || 'event', rule: i.message }));
      results.push({ index, id, status: 'rejected', message: `${details[0].field}: ${details[0].rule}`, details });
      continue;
    }
    const event = parsed.data;
    const known = await db.getRepository(FlightEventEntity).findOneBy({ stationId, eventId: event.id });
    if (known) {
      results.push({ index, id, status: 'duplicate', message: 'This event id was already received; nothing was applied again.' });
      continue;
    }
    for (let attempt = 1; ; attempt++) {
      try {
        const applied = await db.transaction(async (em) => {
          const a = await applyEvent(em, stationId, event);
          await em.insert(FlightEventEntity, { stationId, eventId: event.id, flightId: a.flightId, type: event.type, occurredAt: new Date(event.occurredAt), status: a.status, summary: a.summary.slice(0, 200), payload: event });
          return a;
        });
        touchedFlights.add(applied.flightId);
        results.push({ index, id, status: applied.status, message: applied.summary });
      } catch (err) {
        if (isDuplicateKey(err)) results.push({ index, id, status: 'duplicate', message: 'This event id was already received; nothing was applied again.' });
        else if (isRetryable(err) && attempt < 4) continue;
        else if (err instanceof HttpError) results.push({ index, id, status: 'rejected', message: err.message, details: err.details });
        else throw err;
      }
      break;
    }
  }
  return { results, touchedFlights };
}
