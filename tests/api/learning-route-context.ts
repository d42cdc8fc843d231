// A closed flight with one outcome at the own station and at the other one, for the learning rows of the route matrix.
import type { DataSource } from 'typeorm';
import { BookingOutcomeEntity, ClosedFlightEntity } from '../../server/src/db/entities';
import type { Scope } from './route-table';

export interface LearningRouteContext {
  closedFlightId(scope: Scope): number;
  outcomeId(scope: Scope): number;
}

async function closedFlight(db: DataSource, stationId: number, origin: string) {
  const { identifiers } = await db.getRepository(ClosedFlightEntity).insert({
    flightId: null, stationId, carrierCode: 'ZZ', flightNumber: '9901', serviceDate: '2026-01-05', origin, destination: 'OSL',
    scheduledDeparture: new Date('2026-01-05T09:00:00Z'), dayOfWeek: 1, seatsByCabin: { Y: 10 }, demo: false,
  });
  const closedFlightId = Number(identifiers[0].id);
  const outcome = await db.getRepository(BookingOutcomeEntity).insert({
    closedFlightId, passengerId: null, pnr: 'MTX001', cabin: 'Y', fareClass: 'standard', channel: 'unknown', connecting: false, partySize: 1,
    checkedInAt: null, checkedInT24: false, checkedInT3: false, checkedInT1: false, outcome: 'no-show',
  });
  return { closedFlightId, outcomeId: Number(outcome.identifiers[0].id) };
}

const made: number[] = [];

export async function learningRouteContext(db: DataSource, ids: { ownStationId: number; otherStationId: number }): Promise<LearningRouteContext> {
  const own = await closedFlight(db, ids.ownStationId, 'BOS');
  const other = await closedFlight(db, ids.otherStationId, 'TOS');
  made.push(own.closedFlightId, other.closedFlightId);
  return {
    closedFlightId: (scope) => (scope === 'own' ? own : other).closedFlightId,
    outcomeId: (scope) => (scope === 'own' ? own : other).outcomeId,
  };
}

export async function removeLearningRouteFixtures(db: DataSource): Promise<void> {
  if (made.length) await db.query('DELETE FROM closed_flights WHERE id IN (?)', [made]);
}
