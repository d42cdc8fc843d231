// A flight's proposals as the bump review and the flight desk show them: each denial with its passengers, the
// compensation (frozen once rebooked, otherwise a preview on a stated assumption), the seat held and the statements.
import { In, type DataSource } from 'typeorm';
import type { Denial, DenialCompensationSnapshot, DenialProposal, WaitingProposal } from '@shared/schemas/denials';
import {
  BookingEntity, DenialEntity, DenialProposalEntity, FlightEntity, OutboxMessageEntity, PassengerEntity, RebookingEntity, StationEntity, UserEntity,
} from '../../db/entities';
import { formatDuration } from '../../notices/format';
import { alternatesFor } from '../volunteers/rebooking.service';
import { CATEGORY_LABELS } from './category';
import { journeyOf, measuredWords, passengerCompensation, plannedDelayOnJourney } from './compensation';
import type { FareOnBoard, JourneyScope } from '@shared/compensation';
import { airportZone } from '../../reference/journey-airports';
import { enforcementBodyFor } from './enforcement-bodies';
import { denialDate } from './recorded.service';
import type { RegimeCode } from '@shared/schemas/common';

type Alternate = Awaited<ReturnType<typeof alternatesFor>>[number];

/** Where the station's rule measures this booking's journey, with the zones its times are typed in; null if unknown. */
function journeyFacts(station: StationEntity, flight: FlightEntity, booking: BookingEntity | undefined): Denial['journey'] {
  let scope: JourneyScope;
  try {
    scope = journeyOf(station, flight, booking);
  } catch {
    return null;
  }
  return {
    legDestination: flight.destination, legDestinationTimeZone: airportZone(flight.destination), finalDestination: scope.finalDestination,
    measuredTo: scope.measuredTo, measuredToTimeZone: airportZone(scope.measuredTo), measuredBecause: scope.measuredBecause,
    onward: scope.segments.slice(1).map((s) => `${s.carrier} ${s.number} ${s.origin}-${s.destination}`),
  };
}

function preview(station: StationEntity, flight: FlightEntity, d: DenialEntity, passengers: PassengerEntity[], alternates: Alternate[], booking: BookingEntity | undefined, onBoard: FareOnBoard[]): DenialCompensationSnapshot {
  const enforcement = enforcementBodyFor(station.regime as RegimeCode, flight.origin);
  if (d.status === 'removed') return { plannedArrivalDelayMinutes: null, basis: 'Removed from the selection: nothing is owed for this flight.', passengers: [], reviewFlags: [] };
  const alt = alternates.find((a) => a.freeSeats >= d.passengerIds.length) ?? null;
  const reviewFlags = [enforcement.reviewFlag];
  let delay = alt?.plannedArrivalDelayMinutes ?? null;
  let measured = '';
  try {
    if (alt) delay = plannedDelayOnJourney(station, flight, booking ?? null, new Date(alt.arrival));
    measured = `, ${measuredWords(journeyOf(station, flight, booking))}`;
  } catch (err) {
    reviewFlags.push(`The preview counts the delay at ${flight.destination}: ${err instanceof Error ? err.message : String(err)}`);
  }
  const basis = alt
    ? `Preview: assumes rebooking on ${alt.label} (the first alternate with ${d.passengerIds.length} free seat${d.passengerIds.length === 1 ? '' : 's'}), planned to arrive ${formatDuration(delay ?? 0)} after the original schedule${measured}. Fixed when the passenger is rebooked.`
    : 'Preview: no alternate of ours has enough free seats, so the amounts assume no alternate transportation is offered. Fixed when the passenger is rebooked.';
  const facts = { station, flight, deniedOn: denialDate(d, flight, station), booking, onBoard, plannedArrivalDelayMinutes: delay };
  return { plannedArrivalDelayMinutes: delay, basis, passengers: passengers.map((p) => passengerCompensation(facts, p)), reviewFlags };
}

export async function presentProposals(db: DataSource, flight: FlightEntity): Promise<{ regime: string; proposals: DenialProposal[] }> {
  const station = await db.getRepository(StationEntity).findOneByOrFail({ id: flight.stationId });
  const proposals = await db.getRepository(DenialProposalEntity).find({ where: { flightId: flight.id }, order: { proposedAt: 'DESC', id: 'DESC' } });
  if (proposals.length === 0) return { regime: station.regime, proposals: [] };
  const denials = await db.getRepository(DenialEntity).find({ where: { proposalId: In(proposals.map((p) => p.id)) }, order: { position: 'ASC', id: 'ASC' } });
  const passengerIds = denials.flatMap((d) => d.passengerIds);
  const messageIds = denials.flatMap((d) => d.statementMessageIds ?? []);
  const userIds = [...new Set([...denials.flatMap((d) => [d.selectedByUserId, d.authorizedByUserId]), ...proposals.map((p) => p.decidedByUserId)].filter((x): x is number => x !== null))];
  const [passengers, bookings, rebookings, messages, users] = await Promise.all([
    passengerIds.length ? db.getRepository(PassengerEntity).findBy({ id: In(passengerIds) }) : [],
    db.getRepository(BookingEntity).findBy({ id: In([...new Set(denials.map((d) => d.bookingId)), 0]) }),
    denials.length ? db.getRepository(RebookingEntity).findBy({ denialId: In(denials.map((d) => d.id)) }) : [],
    messageIds.length ? db.getRepository(OutboxMessageEntity).findBy({ id: In(messageIds) }) : [],
    userIds.length ? db.getRepository(UserEntity).findBy({ id: In(userIds) }) : [],
  ]);
  const needsPreview = denials.some((d) => !d.compensation && d.status !== 'removed');
  const alternates = needsPreview ? await alternatesFor(db, flight) : [];
  const onBoard = needsPreview ? await db.getRepository(PassengerEntity).find({ where: { flightId: flight.id }, select: { cabin: true, fareMinor: true, fareCurrency: true, fareType: true } }) : [];
  const passengerById = new Map(passengers.map((p) => [p.id, p]));
  const bookingById = new Map(bookings.map((b) => [b.id, b]));
  const userLabel = (id: number | null) => (id === null ? null : users.find((u) => u.id === id)?.displayName ?? `user ${id}`);

  const present = (d: DenialEntity): Denial => {
    const people = d.passengerIds.map((id) => passengerById.get(id)).filter((p): p is PassengerEntity => p !== undefined);
    const rebooking = rebookings.find((r) => r.denialId === d.id) ?? null;
    const booking = bookingById.get(d.bookingId);
    const own = messages.filter((m) => (d.statementMessageIds ?? []).includes(m.id));
    const compensation = d.compensation ? { ...d.compensation, settled: true } : { ...preview(station, flight, d, people, alternates, booking, onBoard), settled: false };
    return {
      id: d.id, proposalId: d.proposalId, bookingId: d.bookingId, pnr: booking?.pnr ?? '?', passengerIds: d.passengerIds,
      names: people.map((p) => `${p.firstName} ${p.lastName}`), position: d.position, reasons: d.reasons, status: d.status,
      selectedBy: userLabel(d.selectedByUserId) ?? '', selectedByUserId: d.selectedByUserId, authorizedBy: userLabel(d.authorizedByUserId),
      authorizedAt: d.authorizedAt?.toISOString() ?? null, changeReason: d.changeReason, category: d.category, categoryLabel: d.category ? CATEGORY_LABELS[d.category] : null,
      compensation,
      journey: journeyFacts(station, flight, booking),
      rebooking: rebooking
        ? { flight: rebooking.label, departure: rebooking.departure.toISOString(), arrival: rebooking.arrival.toISOString(), plannedArrivalDelayMinutes: rebooking.plannedArrivalDelayMinutes }
        : null,
      statements: people.map((p) => {
        const m = own.find((x) => x.passengerIds.includes(p.id));
        const status = m ? m.status : d.compensation ? 'no-address' : 'not-yet';
        return { passengerId: p.id, name: `${p.firstName} ${p.lastName}`, to: m?.toAddress ?? booking?.contactEmail ?? null, status };
      }),
    };
  };

  return {
    regime: station.regime,
    proposals: proposals.map((p) => {
      const own = denials.filter((d) => d.proposalId === p.id);
      return {
        id: p.id, flightId: p.flightId, stationId: p.stationId, status: p.status, seatsNeeded: p.seatsNeeded,
        seatsSelected: own.filter((d) => d.status !== 'removed').reduce((sum, d) => sum + d.passengerIds.length, 0),
        reason: p.reason, proposedBy: p.proposedByLabel, proposedByUserId: p.proposedByUserId, proposedAt: p.proposedAt.toISOString(),
        decidedBy: userLabel(p.decidedByUserId), decidedAt: p.decidedAt?.toISOString() ?? null, denials: own.map(present),
      };
    }),
  };
}

/** Proposals at a station that still wait for a supervisor, oldest first: the first to decide is the first proposed. */
export async function waitingProposals(db: DataSource, stationId: number): Promise<WaitingProposal[]> {
  const proposals = await db.getRepository(DenialProposalEntity).find({ where: { stationId, status: In(['proposed', 'changed']) }, order: { proposedAt: 'ASC', id: 'ASC' } });
  if (proposals.length === 0) return [];
  const [flights, denials] = await Promise.all([
    db.getRepository(FlightEntity).findBy({ id: In(proposals.map((p) => p.flightId)) }),
    db.getRepository(DenialEntity).findBy({ proposalId: In(proposals.map((p) => p.id)), status: In(['proposed', 'authorized']) }),
  ]);
  return proposals.map((p) => {
    const f = flights.find((x) => x.id === p.flightId)!;
    return {
      id: p.id, flightId: p.flightId, flight: `${f.carrierCode} ${f.flightNumber}`, destination: f.destination, scheduledDeparture: f.scheduledDeparture.toISOString(),
      status: p.status, seatsNeeded: p.seatsNeeded, seatsSelected: denials.filter((d) => d.proposalId === p.id).reduce((sum, d) => sum + d.passengerIds.length, 0),
      reason: p.reason, proposedBy: p.proposedByLabel, proposedAt: p.proposedAt.toISOString(),
    };
  });
}
