// Who acts on a committed change, in one place: the consoles' notices, the denial rankings held in memory and the
// forecast queue. (The outbox and payments workers subscribe themselves when they start.)
import type { DataSource } from 'typeorm';
import { domainEventsOf } from './events';
import { heldRankingsOf } from './modules/denials/candidates-held';
import type { ForecastScheduler } from './modules/forecast/forecast-scheduler';
import type { Publisher } from './realtime/publisher';

export function subscribeAppEffects(db: DataSource, publisher: Publisher, forecast: ForecastScheduler): () => void {
  const events = domainEventsOf(db);
  const unsubscribe = [
    events.subscribe('flight-changed', (e) => {
      // Rounds, proposals and denials feed the held denial ranking: the next read builds it anew. A forecast's own
      // notice (it carries the version) needs no such nudge: the ranking is keyed on that version already.
      if (!e.data) heldRankingsOf(db).flightMoved(e.flightId);
      publisher.flightChanged(e.flightId, e.stationId, e.topics, e.data, e.desk);
    }),
    events.subscribe('station-changed', (e) => publisher.stationChanged?.(e.stationId, e.topics)),
    events.subscribe('priority-rules-changed', (e) => heldRankingsOf(db).stationMoved(e.stationId)),
    events.subscribe('forecast-stale', (e) => forecast.markDirty(e.flightId)),
  ];
  return () => unsubscribe.forEach((off) => off());
}
