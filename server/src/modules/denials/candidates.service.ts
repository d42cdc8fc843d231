// Who on a flight may be denied boarding involuntarily, in the station's priority order, and how many seats are short.
import { In, Not, type DataSource, type EntityManager } from 'typeorm';
import { describeRules, rankDenialCandidates, type DenialPassenger } from '@shared/denial';
import type { DenialCandidates, DenialCounts } from '@shared/schemas/denials';
import type { RegimeCode } from '@shared/schemas/common';
import {
  BookingEntity, DenialEntity, FlightEntity, FlightForecastEntity, PassengerEntity, StationEntity, VolunteerEntity,
} from '../../db/entities';
import { priorityRulesFor } from './priority-rules.service';
import { checkInDeadline, checkInTime, flightPresence } from './shortfall';

type Db = DataSource | EntityManager;

export const seatsOf = (flight: FlightEntity) => Object.values(flight.seatsByCabin).reduce((a, b) => a + b, 0);
export const flightLabel = (flight: FlightEntity) => `${flight.carrierCode} ${flight.flightNumber}`;

/** Passengers still on the flight: a cancelled booking or a passenger already offloaded is not. */
const ON_FLIGHT = Not(In(['cancelled', 'offloaded']));

async function acceptedVolunteerPassengers(db: Db, flightId: number): Promise<Set<number>> {
  const accepted = await db.getRepository(VolunteerEntity).findBy({ flightId, status: 'accepted' });
  return new Set(accepted.flatMap((v) => v.passengerIds));
}

/** Denials still in force on the flight: waiting for a supervisor (in a proposal not withdrawn) or authorized. */
export async function activeDenials(db: Db, flightId: number): Promise<DenialEntity[]> {
  return db.getRepository(DenialEntity).findBy({ flightId, status: In(['proposed', 'authorized']) });
}

/**
 * Passengers of these bookings who were denied boarding before: on this flight, or on another flight under the same
 * booking reference and name (the ticket travels with the PNR when a denied passenger is rebooked).
 */
async function deniedBefore(db: Db, flightId: number, passengers: PassengerEntity[], pnrOf: Map<number, string>): Promise<Set<number>> {
  const pnrs = [...new Set(passengers.map((p) => pnrOf.get(p.bookingId)).filter((p): p is string => p !== undefined))];
  if (pnrs.length === 0) return new Set();
  const rows: { passenger_ids: number[] | string }[] = await db.query(
    `SELECT d.passenger_ids FROM denials d JOIN bookings b ON b.id = d.booking_id WHERE d.status = 'authorized' AND (d.flight_id = ? OR b.pnr IN (?))`,
    [flightId, pnrs],
  );
  const deniedIds = rows.flatMap((r) => (typeof r.passenger_ids === 'string' ? (JSON.parse(r.passenger_ids) as number[]) : r.passenger_ids));
  if (deniedIds.length === 0) return new Set();
  const denied = await db.getRepository(PassengerEntity).findBy({ id: In(deniedIds) });
  const key = (p: PassengerEntity) => `${pnrOf.get(p.bookingId) ?? ''}|${p.firstName.toUpperCase()}|${p.lastName.toUpperCase()}`;
  const deniedPnrOf = new Map((await db.getRepository(BookingEntity).findBy({ id: In([...new Set(denied.map((p) => p.bookingId))]) })).map((b) => [b.id, b.pnr]));
  const deniedKeys = new Set(denied.map((p) => `${deniedPnrOf.get(p.bookingId) ?? ''}|${p.firstName.toUpperCase()}|${p.lastName.toUpperCase()}`));
  const deniedIdSet = new Set(deniedIds);
  return new Set(passengers.filter((p) => deniedIdSet.has(p.id) || deniedKeys.has(key(p))).map((p) => p.id));
}

export async function liveCounts(db: Db, flight: FlightEntity): Promise<DenialCounts> {
  const [presence, forecast] = await Promise.all([flightPresence(db, flight), db.getRepository(FlightForecastEntity).findOneBy({ flightId: flight.id })]);
  const checkedIn = presence.passengers.filter((p) => p.status === 'checked-in').length;
  const sum = (key: 'seats' | 'occupying' | 'acceptedVolunteerSeats' | 'seatsShort' | 'waitingProposalSeats' | 'seatsShortAfterProposals') =>
    presence.byCabin.reduce((total, c) => total + c[key], 0);
  return {
    seats: seatsOf(flight), checkedIn, boarded: presence.passengers.length - checkedIn, acceptedVolunteerSeats: sum('acceptedVolunteerSeats'),
    occupying: sum('occupying'), seatsShort: sum('seatsShort'), waitingProposalSeats: sum('waitingProposalSeats'),
    seatsShortAfterProposals: sum('seatsShortAfterProposals'), expectedShows: forecast?.forecast?.mean ?? null,
    checkInDeadline: presence.deadline.toISOString(), byCabin: presence.byCabin,
  };
}

export interface FlightRanking extends DenialCandidates {
  passengersById: Map<number, PassengerEntity>;
}

export async function rankFlight(db: Db, flight: FlightEntity): Promise<FlightRanking> {
  const station = await db.getRepository(StationEntity).findOneByOrFail({ id: flight.stationId });
  const [stationRules, passengers, bookings, volunteers, active, counts, deadline] = await Promise.all([
    priorityRulesFor(db, flight.stationId),
    db.getRepository(PassengerEntity).find({ where: { flightId: flight.id, status: ON_FLIGHT }, order: { bookingId: 'ASC', pnrSequence: 'ASC' } }),
    db.getRepository(BookingEntity).findBy({ flightId: flight.id }),
    acceptedVolunteerPassengers(db, flight.id),
    activeDenials(db, flight.id),
    liveCounts(db, flight),
    checkInDeadline(db, flight),
  ]);
  const bookingById = new Map(bookings.map((b) => [b.id, b]));
  const pnrOf = new Map(bookings.map((b) => [b.id, b.pnr]));
  const denied = await deniedBefore(db, flight.id, passengers, pnrOf);
  const partySize = new Map<number, number>();
  for (const p of passengers) partySize.set(p.bookingId, (partySize.get(p.bookingId) ?? 0) + 1);

  // A tier the station has not listed ranks as the lowest status rather than failing the whole ranking.
  const unknownTiers = [...new Set(passengers.map((p) => p.frequentFlyerTier).filter((t): t is string => t !== null && !stationRules.tierOrder.includes(t)))];
  const tierOrder = [...unknownTiers, ...stationRules.tierOrder];

  const input: DenialPassenger[] = passengers.map((p) => ({
    id: String(p.id),
    pnr: pnrOf.get(p.bookingId) ?? '?',
    partyId: String(p.bookingId),
    partySize: partySize.get(p.bookingId),
    partySplitAgreed: bookingById.get(p.bookingId)?.travelsTogether === false,
    name: `${p.firstName} ${p.lastName}`,
    familyName: p.lastName,
    checkedInAt: checkInTime(p)?.toISOString() ?? (p.status === 'checked-in' ? deadline.toISOString() : null),
    boardedAt: p.status === 'boarded' ? (p.boardedAt ?? p.statusChangedAt ?? new Date()).toISOString() : null,
    fareMinor: p.fareMinor,
    frequentFlyerTier: p.frequentFlyerTier,
    ssrCodes: p.ssrCodes ?? [],
    isChild: p.isChild,
    alreadyDeniedOnTicket: denied.has(p.id),
    volunteered: volunteers.has(p.id),
    seatAssignedBeforeGate: p.seat !== null,
  }));
  const ranking = rankDenialCandidates(input, stationRules.rules, {
    tierOrder, currency: station.currency, stationTimeZone: station.timeZone, regime: station.regime as RegimeCode,
    checkInDeadline: deadline.toISOString(), now: new Date().toISOString(),
  });

  const passengersById = new Map(passengers.map((p) => [p.id, p]));
  const selectionOf = (ids: number[]) => {
    const d = active.find((x) => x.passengerIds.some((pid) => ids.includes(pid)));
    return d ? { denialId: d.id, proposalId: d.proposalId, status: d.status as 'proposed' | 'authorized' } : null;
  };
  const notes = (ids: number[]) => {
    const lines: string[] = [];
    for (const pid of ids) {
      const p = passengersById.get(pid);
      if (p && p.fareCurrency !== station.currency) lines.push(`${p.firstName} ${p.lastName}: fare recorded in ${p.fareCurrency}, compared as if in ${station.currency}`);
      if (p?.frequentFlyerTier && unknownTiers.includes(p.frequentFlyerTier)) lines.push(`tier ${p.frequentFlyerTier} is not in the station's tier list: ranked as the lowest status`);
    }
    return lines;
  };

  return {
    flight: { id: flight.id, label: flightLabel(flight), origin: flight.origin, destination: flight.destination, scheduledDeparture: flight.scheduledDeparture.toISOString(), stationId: flight.stationId },
    regime: station.regime,
    counts,
    rules: stationRules.rules,
    rulesText: describeRules(stationRules.rules, station.regime as RegimeCode),
    candidates: ranking.candidates.map((c) => {
      const ids = c.passengerIds.map(Number);
      return {
        position: c.position, unitId: c.unitId, bookingId: Number(c.partyId), pnr: c.pnr, passengerIds: ids, names: c.names,
        seatsFreed: c.seatsFreed, cabins: [...new Set(ids.map((id) => passengersById.get(id)?.cabin ?? '?'))].sort(), priorityGroup: c.priorityGroup,
        reasons: [...c.reasons, ...notes(ids)], selection: selectionOf(ids),
      };
    }),
    excluded: ranking.excluded.map((e) => ({
      passengerId: Number(e.passengerId), bookingId: Number(e.partyId), pnr: pnrOf.get(Number(e.partyId)) ?? '?', name: e.name, protection: e.protection, reason: e.reason,
    })),
    passengersById,
  };
}
