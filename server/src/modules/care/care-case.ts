// One denied passenger's case as care and choice see it: the compensation row names the passenger, the flight, the
// rule and whether they volunteered; the rebooking (of the volunteer or the denial) names the alternate they wait for.
import { In, type DataSource, type EntityManager } from 'typeorm';
import { careDue, choicesFor, type CareProposal, type ChoiceKind, type Regime } from '@shared/compensation';
import {
  BookingEntity, CompensationEntity, FlightEntity, PassengerEntity, RebookingEntity, StationEntity,
} from '../../db/entities';
import { journeyOf } from '../denials/compensation';

export interface CareCase {
  compensation: CompensationEntity;
  station: StationEntity;
  flight: FlightEntity;
  passenger: PassengerEntity;
  booking: BookingEntity;
  rebooking: RebookingEntity | null;
}

type Db = DataSource | EntityManager;

export async function rebookingOf(db: Db, c: Pick<CompensationEntity, 'sourceKind' | 'sourceId'>): Promise<RebookingEntity | null> {
  const where = c.sourceKind === 'denial' ? { denialId: c.sourceId } : { volunteerId: c.sourceId };
  return db.getRepository(RebookingEntity).findOne({ where, order: { id: 'DESC' } });
}

export async function loadCases(db: Db, compensations: CompensationEntity[]): Promise<CareCase[]> {
  if (!compensations.length) return [];
  const ids = (pick: (c: CompensationEntity) => number) => [...new Set(compensations.map(pick))];
  const [stations, flights, passengers, bookings] = await Promise.all([
    db.getRepository(StationEntity).findBy({ id: In(ids((c) => c.stationId)) }),
    db.getRepository(FlightEntity).findBy({ id: In(ids((c) => c.flightId)) }),
    db.getRepository(PassengerEntity).findBy({ id: In(ids((c) => c.passengerId)) }),
    db.getRepository(BookingEntity).findBy({ id: In(ids((c) => c.bookingId)) }),
  ]);
  const byId = <T extends { id: number }>(rows: T[]) => new Map(rows.map((r) => [r.id, r]));
  const [s, f, p, b] = [byId(stations), byId(flights), byId(passengers), byId(bookings)];
  return Promise.all(compensations.map(async (c) => ({
    compensation: c, station: s.get(c.stationId)!, flight: f.get(c.flightId)!, passenger: p.get(c.passengerId)!, booking: b.get(c.bookingId)!,
    rebooking: await rebookingOf(db, c),
  })));
}

export const regimeOf = (c: CareCase) => c.compensation.regime as Regime;
export const offersOf = (c: CareCase) => choicesFor(regimeOf(c));

/** What the rule owes this passenger while they wait, from the denied flight's departure to the alternate's. */
export function proposalFor(c: CareCase, choice: ChoiceKind | null): CareProposal {
  const regime = regimeOf(c);
  try {
    const scope = regime === 'eu-261' || regime === 'uk-261' ? journeyOf(c.station, c.flight, c.booking) : null;
    return careDue({
      regime, voluntary: c.compensation.voluntary, choice, waitFrom: c.flight.scheduledDeparture.toISOString(),
      alternateDeparture: c.rebooking ? c.rebooking.departure.toISOString() : null, timeZone: c.station.timeZone,
      ...(scope ? { distanceKm: scope.distanceKm, intraCommunity: scope.intraCommunity } : {}),
    });
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    // A case the rule cannot be applied to is shown with its reason, never hidden: the agent decides by hand.
    return { waitMinutes: null, nights: 0, items: [], notes: [`Care could not be proposed: ${err.message}`] };
  }
}
