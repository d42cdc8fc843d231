// Who is present for a flight and how many seats each cabin is short. A denial needs a real shortfall in the cabin:
// passengers present and eligible (checked in by the deadline, or boarded) minus seats, after accepted volunteers.
// One computation for the counts on screen, the proposal and the authorization, so they cannot disagree.
import { In, type DataSource, type EntityManager } from 'typeorm';
import type { CabinCounts } from '@shared/schemas/denials';
import { DenialEntity, DenialProposalEntity, FlightEntity, PassengerEntity, VolunteerEntity } from '../../db/entities';
import { badRequest, conflict } from '../../domain/errors';
import { showUpProfileFor } from '../forecast/profile.service';

type Db = DataSource | EntityManager;

/** The check-in deadline: scheduled departure minus the station's check-in close. */
export async function checkInDeadline(db: Db, flight: FlightEntity): Promise<Date> {
  const profile = await showUpProfileFor(db, flight.stationId);
  return new Date(flight.scheduledDeparture.getTime() - profile.checkInCloseMinutes * 60_000);
}

/** When the passenger checked in; a check-in the feed sent without a time counts from the status change. */
export const checkInTime = (p: PassengerEntity): Date | null => (p.status === 'checked-in' || p.status === 'boarded' ? p.checkedInAt ?? p.statusChangedAt ?? null : null);

/** Present: boarded, or checked in by the deadline. Anyone else is not at the flight and is never a denied passenger. */
export function isPresent(p: PassengerEntity, deadline: Date): boolean {
  if (p.status === 'boarded') return true;
  if (p.status !== 'checked-in') return false;
  const at = checkInTime(p);
  return at === null || at.getTime() <= deadline.getTime();
}

export interface FlightPresence {
  deadline: Date;
  passengers: PassengerEntity[];
  volunteers: Set<number>;
  byCabin: CabinCounts[];
}

async function waitingDenialPassengers(db: Db, flightId: number): Promise<number[]> {
  const open = await db.getRepository(DenialProposalEntity).findBy({ flightId, status: In(['proposed', 'changed']) });
  if (open.length === 0) return [];
  const denials = await db.getRepository(DenialEntity).findBy({ proposalId: In(open.map((p) => p.id)), status: 'proposed' });
  return denials.flatMap((d) => d.passengerIds);
}

export async function flightPresence(db: Db, flight: FlightEntity): Promise<FlightPresence> {
  const [deadline, passengers, accepted, waiting] = await Promise.all([
    checkInDeadline(db, flight),
    db.getRepository(PassengerEntity).findBy({ flightId: flight.id, status: In(['checked-in', 'boarded']) }),
    db.getRepository(VolunteerEntity).findBy({ flightId: flight.id, status: 'accepted' }),
    waitingDenialPassengers(db, flight.id),
  ]);
  const volunteers = new Set(accepted.flatMap((v) => v.passengerIds));
  const waitingIds = new Set(waiting);
  const cabins = [...new Set([...Object.keys(flight.seatsByCabin), ...passengers.map((p) => p.cabin)])].sort();
  const byCabin = cabins.map((cabin) => {
    const inCabin = passengers.filter((p) => p.cabin === cabin);
    const seats = flight.seatsByCabin[cabin] ?? 0;
    const eligible = inCabin.filter((p) => isPresent(p, deadline));
    const occupying = eligible.filter((p) => !volunteers.has(p.id)).length;
    const seatsShort = Math.max(0, occupying - seats);
    const waitingProposalSeats = inCabin.filter((p) => waitingIds.has(p.id)).length;
    return {
      cabin, seats, occupying, acceptedVolunteerSeats: inCabin.filter((p) => volunteers.has(p.id)).length, seatsShort,
      waitingProposalSeats, seatsShortAfterProposals: Math.max(0, seatsShort - waitingProposalSeats),
    };
  });
  return { deadline, passengers, volunteers, byCabin };
}

const describeCabin = (c: CabinCounts) =>
  `cabin ${c.cabin}: ${c.occupying} present and eligible after ${c.acceptedVolunteerSeats} accepted volunteer${c.acceptedVolunteerSeats === 1 ? '' : 's'}, on ${c.seats} seats`;

/** The cabin a proposal is for: the one named, or the only one short. Refuses when nothing is short. */
export function cabinForProposal(presence: FlightPresence, requested: string | undefined, seatsNeeded: number): CabinCounts {
  const short = presence.byCabin.filter((c) => c.seatsShortAfterProposals > 0);
  let cabin: CabinCounts | undefined;
  if (requested !== undefined) {
    cabin = presence.byCabin.find((c) => c.cabin === requested);
    if (!cabin) {
      throw badRequest(`cabin: this flight has no cabin ${requested}; it has ${presence.byCabin.map((c) => c.cabin).join(', ')}`, [{ field: 'cabin', rule: 'must be a cabin of this flight' }]);
    }
  } else if (short.length > 1) {
    throw badRequest(`cabin: cabins ${short.map((c) => c.cabin).join(' and ')} are both short; say which one this proposal is for`, [{ field: 'cabin', rule: 'required when more than one cabin is short' }]);
  } else {
    cabin = short[0] ?? presence.byCabin[0];
  }
  if (!cabin || cabin.seatsShortAfterProposals === 0) {
    const what = cabin ? describeCabin(cabin) : 'no cabin';
    throw conflict('no_shortfall', `Nothing to deny: ${what}${cabin && cabin.waitingProposalSeats > 0 ? `, ${cabin.waitingProposalSeats} already in a waiting proposal` : ''}. A denial needs more passengers present than seats.`);
  }
  if (seatsNeeded > cabin.seatsShortAfterProposals) {
    throw badRequest(
      `seatsNeeded: ${seatsNeeded} is more than the ${cabin.seatsShortAfterProposals} seat${cabin.seatsShortAfterProposals === 1 ? '' : 's'} short now (${describeCabin(cabin)})`,
      [{ field: 'seatsNeeded', rule: `must not exceed the seats short in cabin ${cabin.cabin} (${cabin.seatsShortAfterProposals})` }],
    );
  }
  return cabin;
}

/**
 * At authorization, the same facts again: every passenger still present, and each denial still needed (its cabin
 * still short once the denials authorized before it in this request are counted).
 */
export function assertStillNeeded(presence: FlightPresence, denials: { id: number; passengerIds: number[] }[]): void {
  const byId = new Map(presence.passengers.map((p) => [p.id, p]));
  const short = new Map(presence.byCabin.map((c) => [c.cabin, c.seatsShort]));
  for (const d of denials) {
    const members = d.passengerIds.map((id) => byId.get(id));
    const gone = d.passengerIds.filter((id, i) => {
      const p = members[i];
      return !p || p.status !== 'checked-in' || !isPresent(p, presence.deadline) || presence.volunteers.has(id);
    });
    if (gone.length > 0) {
      throw conflict('not_present', `Denial ${d.id}: passenger ${gone.join(', ')} is no longer checked in and waiting at the gate (boarded, offloaded, a volunteer or a no-show). Change the selection instead.`);
    }
    const cabins = [...new Set(members.map((p) => p!.cabin))];
    if (!cabins.some((c) => (short.get(c) ?? 0) > 0)) {
      throw conflict('no_shortfall', `Denial ${d.id}: cabin ${cabins.join('/')} is no longer short (${cabins.map((c) => describeCabin(presence.byCabin.find((x) => x.cabin === c)!)).join('; ')}). Withdraw or change the selection.`);
    }
    for (const p of members) short.set(p!.cabin, (short.get(p!.cabin) ?? 0) - 1);
  }
}
