// A stored recompute's notice: the new figures, the passengers and trail rows that changed, under the new version.
import type { DataSource } from 'typeorm';
import { announceCommitted, flightChanged, type FlightChanged } from '../../events';
import type { RecomputeOutcome } from './forecast.service';

export const forecastNotice = (o: RecomputeOutcome): FlightChanged => flightChanged(o.flightId, o.stationId, ['forecast', 'counts', 'events'], o.notice);

/** The scheduler's callback: the recompute has stored (and committed) its version, so the notice goes at once. */
export const announceRecomputes = (db: DataSource) => (o: RecomputeOutcome) => announceCommitted(db, forecastNotice(o));
