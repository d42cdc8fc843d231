// Passengers accommodated in another cabin than the one booked, recorded at the desk with the fare difference and
// what the station's rule says they are owed back; counted on the period report (Form 251 line 6, Art. 10).
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { CABIN_RANK, type CabinChangeView, type RecordCabinChangeBody } from '@shared/schemas/cabin-changes';
import type { RegimeCode } from '@shared/schemas/common';
import { CabinChangeEntity, PassengerEntity, StationEntity, type FlightEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../domain/errors';
import { findAirport, routeDistanceKm } from '../../reference/airports';
import { art10IntraCommunity } from './art10-scope';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { refundsAfterCabinChange } from '../refunds/refunds-due';
import { cabinChangeOwed } from './downgrade-rules';

type Cabin = keyof typeof CABIN_RANK;
const rankOf = (cabin: string) => CABIN_RANK[cabin as Cabin] as number | undefined;

/** Intra-Community as Art. 10(2)(b) reads it (not Art. 7's reading: see art10-scope.ts). */
function intraCommunity(regime: RegimeCode, flight: FlightEntity): boolean {
  if (regime === 'eu-261') return art10IntraCommunity(flight.origin, flight.destination);
  const uk = (iata: string) => findAirport(iata)?.country === 'United Kingdom';
  return uk(flight.origin) && uk(flight.destination);
}

interface Row {
  id: number; flight_id: number; passenger_id: number; first_name: string; last_name: string; booked_cabin: string; flown_cabin: string;
  direction: 'upgrade' | 'downgrade'; fare_difference_minor: number; currency: string; owed_minor: number; owed_rule: string; reason: string; created_at: Date;
}

const present = (r: Row): CabinChangeView => ({
  id: r.id, flightId: r.flight_id, passengerId: r.passenger_id, passengerName: `${r.first_name} ${r.last_name}`, bookedCabin: r.booked_cabin, flownCabin: r.flown_cabin,
  direction: r.direction, fareDifferenceMinor: r.fare_difference_minor, currency: r.currency, owedMinor: r.owed_minor, owedRule: r.owed_rule, reason: r.reason,
  createdAt: new Date(r.created_at).toISOString(),
});

const SELECT = `SELECT cc.*, p.first_name, p.last_name FROM cabin_changes cc JOIN passengers p ON p.id = cc.passenger_id`;

export async function listCabinChanges(db: DataSource, flight: FlightEntity): Promise<CabinChangeView[]> {
  const rows: Row[] = await db.query(`${SELECT} WHERE cc.flight_id = ? ORDER BY cc.id`, [flight.id]);
  return rows.map(present);
}

/** Records one cabin change (once per passenger and flight), with its audit row, in one transaction. */
export async function recordCabinChange(db: DataSource, user: SessionUser, flight: FlightEntity, body: RecordCabinChangeBody): Promise<CabinChangeView> {
  const id = await db.transaction(async (em) => {
    const passenger = await em.findOneBy(PassengerEntity, { id: body.passengerId });
    if (!passenger || passenger.flightId !== flight.id) throw notFound('Passenger');
    if (!(body.flownCabin in flight.seatsByCabin)) {
      throw badRequest(`flownCabin: this flight has no cabin ${body.flownCabin}`, [{ field: 'flownCabin', rule: `must be one of this flight's cabins: ${Object.keys(flight.seatsByCabin).join(', ')}` }]);
    }
    const booked = rankOf(passenger.cabin);
    const flown = rankOf(body.flownCabin)!;
    if (booked === undefined) throw conflict('unknown_cabin', `The passenger's booked cabin ${passenger.cabin} has no known rank; record the change by hand.`);
    if (booked === flown) throw badRequest('flownCabin: must differ from the cabin booked', [{ field: 'flownCabin', rule: `must differ from the cabin booked (${passenger.cabin})` }]);
    const station = await em.findOneByOrFail(StationEntity, { id: flight.stationId });
    const regime = station.regime as RegimeCode;
    const direction = flown > booked ? 'upgrade' : 'downgrade';
    const euStyle = regime === 'eu-261' || regime === 'uk-261';
    const owed = cabinChangeOwed({
      regime, direction, ticketPriceMinor: passenger.fareMinor, fareDifferenceMinor: body.fareDifferenceMinor,
      distanceKm: euStyle ? routeDistanceKm(flight.origin, flight.destination) : null, intraCommunity: euStyle ? intraCommunity(regime, flight) : false,
    });
    if (await em.existsBy(CabinChangeEntity, { flightId: flight.id, passengerId: passenger.id })) throw conflict('already_recorded', 'A cabin change is already recorded for this passenger on this flight.');
    const saved = await em.save(CabinChangeEntity, em.create(CabinChangeEntity, {
      stationId: flight.stationId, flightId: flight.id, passengerId: passenger.id, bookedCabin: passenger.cabin, flownCabin: body.flownCabin, direction,
      fareDifferenceMinor: body.fareDifferenceMinor, currency: passenger.fareCurrency, regime, owedMinor: owed.owedMinor, owedRule: owed.rule, reason: body.reason, recordedByUserId: user.id,
    }));
    await refundsAfterCabinChange(em, flight.id, passenger.id);
    await audit(em, { actor: user, action: 'cabin_change.recorded', entityType: 'cabin_change', entityId: saved.id, stationId: flight.stationId, after: { passengerId: passenger.id, bookedCabin: passenger.cabin, flownCabin: body.flownCabin, direction, fareDifferenceMinor: body.fareDifferenceMinor, owedMinor: owed.owedMinor, rule: owed.rule, reason: body.reason } });
    recordEffect(em, flightChanged(flight.id, flight.stationId, ['cabin-changes']));
    return saved.id;
  });
  const [row]: Row[] = await db.query(`${SELECT} WHERE cc.id = ?`, [id]);
  return present(row);
}
