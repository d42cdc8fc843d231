// A stored recompute's notice: the new figures, the passengers and trail rows that changed, under the new version.
import { flightChanged, type FlightChanged } from '../../events';
import type { RecomputeOutcome } from './forecast.service';

export const forecastNotice = (o: RecomputeOutcome): FlightChanged => flightChanged(o.flightId, o.stationId, ['forecast', 'counts', 'events'], o.notice);
