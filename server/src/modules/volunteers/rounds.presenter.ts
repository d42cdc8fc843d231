import { In, type DataSource } from 'typeorm';
import type { Round, Volunteer } from '@shared/schemas/volunteers';
import { BookingEntity, OfferApprovalEntity, PassengerEntity, RebookingEntity, VolunteerEntity, VolunteerRoundEntity } from '../../db/entities';

/** Rounds of a flight with their volunteers, names and seat holds, newest round first. */
export async function presentRounds(db: DataSource, flightId: number): Promise<Round[]> {
  const rounds = await db.getRepository(VolunteerRoundEntity).find({ where: { flightId }, order: { openedAt: 'DESC', id: 'DESC' } });
  if (!rounds.length) return [];
  const roundIds = rounds.map((r) => r.id);
  const [volunteers, approvals] = await Promise.all([
    db.getRepository(VolunteerEntity).find({ where: { roundId: In(roundIds) }, order: { createdAt: 'ASC' } }),
    db.getRepository(OfferApprovalEntity).findBy({ roundId: In(roundIds), status: 'pending' }),
  ]);
  const bookingIds = [...new Set(volunteers.map((v) => v.bookingId))];
  const [bookings, passengers, holds] = await Promise.all([
    bookingIds.length ? db.getRepository(BookingEntity).findBy({ id: In(bookingIds) }) : [],
    bookingIds.length ? db.getRepository(PassengerEntity).findBy({ bookingId: In(bookingIds) }) : [],
    volunteers.length ? db.getRepository(RebookingEntity).findBy({ volunteerId: In(volunteers.map((v) => v.id)) }) : [],
  ]);
  const pnr = new Map(bookings.map((b) => [b.id, b.pnr]));
  const name = new Map(passengers.map((p) => [p.id, `${p.firstName} ${p.lastName}`]));
  const hold = new Map(holds.map((h) => [h.volunteerId, h]));
  const present = (v: VolunteerEntity): Volunteer => {
    const h = hold.get(v.id);
    return {
      id: v.id, bookingId: v.bookingId, pnr: pnr.get(v.bookingId) ?? '', names: v.passengerIds.map((id) => name.get(id) ?? `passenger ${id}`), passengerIds: v.passengerIds,
      askMinor: v.askMinor, source: v.source, status: v.status, agreedMinor: v.agreedMinor, acceptedAt: v.acceptedAt?.toISOString() ?? null,
      rebooking: h ? { flight: h.label, departure: h.departure.toISOString(), arrival: h.arrival.toISOString(), plannedArrivalDelayMinutes: h.plannedArrivalDelayMinutes } : null,
      pendingApproval: ((a) => (a ? { id: a.id, offerMinor: a.offerMinor, requestedBy: a.requestedByLabel, requestedAt: a.requestedAt.toISOString() } : null))(
        approvals.find((a) => a.kind === 'sealed-accept' && a.subjectId === v.id),
      ),
      createdAt: v.createdAt.toISOString(),
    };
  };
  return rounds.map((r) => {
    const mine = volunteers.filter((v) => v.roundId === r.id);
    const pending = approvals.find((a) => a.roundId === r.id && (a.kind === 'opening-offer' || a.kind === 'raise'));
    return {
      id: r.id, flightId: r.flightId, kind: r.kind, status: r.status, currency: r.currency, offerMinor: r.offerMinor, extras: r.extras,
      volunteersNeeded: r.volunteersNeeded,
      accepted: mine.filter((v) => v.status === 'accepted').reduce((a, v) => a + v.passengerIds.length, 0),
      pendingApproval: pending ? { id: pending.id, kind: pending.kind as 'opening-offer' | 'raise', offerMinor: pending.offerMinor, requestedBy: pending.requestedByLabel, requestedAt: pending.requestedAt.toISOString() } : null,
      openedBy: r.openedByLabel, openedAt: r.openedAt.toISOString(), closedAt: r.closedAt?.toISOString() ?? null,
      // Sealed asks are shown lowest first: the agent accepts from the top.
      volunteers: mine.map(present).sort((a, b) => (r.kind === 'sealed' ? (a.askMinor ?? Infinity) - (b.askMinor ?? Infinity) : 0)),
    };
  });
}
