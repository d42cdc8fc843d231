// Flights, bookings and passengers of our own for the denied-boarding API tests, written straight to the shared
// test database. Flight numbers 8xxx on a service date far ahead keep them off every demo departures board, and
// removeDenialFixtures() deletes exactly what a run created (audit rows stay: the log is append-only).
import type { OptionalFee } from '@shared/schemas/optional-fees';
import { removeFlights } from './volunteers-fixtures';
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { PriorityRulesBody } from '@shared/schemas/denials';
import { BookingEntity, DenialEntity, DenialProposalEntity, FlightEntity, PassengerEntity, StationEntity, UserEntity } from '../../server/src/db/entities';
import type { PassengerStatus } from '../../server/src/db/entities/passenger.entity';
import { presentSessionUser } from '../../server/src/modules/auth/session-user';
import { priorityRulesFor } from '../../server/src/modules/denials/priority-rules.service';
import { authorizeDenials, proposeDenials } from '../../server/src/modules/denials/proposals.service';
import { rebookDenial } from '../../server/src/modules/denials/rebook.service';
import { withFreeFlightNumber } from './free-flight-number';

const created: number[] = [];
const foreignProposals: number[] = [];

/** A random far-future day (60-700 days ahead) so parallel runs and the demo never share a flight key. */
function farDate(): Date {
  const days = 60 + Math.floor(Math.random() * 640);
  const d = new Date(Date.now() + days * 86_400_000);
  d.setUTCHours(14, 0, 0, 0);
  return d;
}

export interface FlightSpec {
  station: string;
  destination: string;
  seats?: number;
  /** Seats per cabin; overrides seats (which is all economy). */
  cabins?: Record<string, number>;
  blockMinutes?: number;
  /** Minutes after the first flight of the same test: for later alternates on the same route and day. */
  laterBy?: number;
  after?: FlightEntity;
  /** A fixed departure (e.g. a flight that already left), instead of a random far-future day. */
  departure?: Date;
}

export async function createFlight(db: DataSource, spec: FlightSpec): Promise<FlightEntity> {
  const station = await db.getRepository(StationEntity).findOneByOrFail({ iata: spec.station });
  const departure = spec.departure ?? (spec.after ? new Date(spec.after.scheduledDeparture.getTime() + (spec.laterBy ?? 120) * 60_000) : farDate());
  const block = spec.blockMinutes ?? 150;
  const flight = await withFreeFlightNumber({ from: 8000, size: 1000 }, (flightNumber) => db.getRepository(FlightEntity).save(db.getRepository(FlightEntity).create({
    stationId: station.id, carrierCode: 'ZZ', flightNumber, serviceDate: departure.toISOString().slice(0, 10), origin: spec.station,
    destination: spec.destination, scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + block * 60_000),
    aircraftType: '320', seatsByCabin: spec.cabins ?? { Y: spec.seats ?? 4 }, gate: 'T1', state: 'check-in-open', shock: null,
  })));
  created.push(flight.id);
  return flight;
}

export interface PassengerSpec {
  first: string;
  last: string;
  status?: PassengerStatus;
  /** Minutes before departure at which the passenger checked in. */
  checkedInBefore?: number;
  fareMinor?: number;
  fareCurrency?: string;
  ssr?: string[];
  tier?: string | null;
  isChild?: boolean;
  cabin?: string;
  optionalFees?: OptionalFee[];
}

let pnrCounter = 0;
export function uniquePnr(): string {
  pnrCounter += 1;
  const alphabet = 'ABCDEFGHJKLMNPQRSTUVWXYZ';
  let n = Date.now() * 7 + pnrCounter * 7919 + Math.floor(Math.random() * 1000);
  let code = '';
  for (let i = 0; i < 6; i++) {
    code += alphabet[n % alphabet.length];
    n = Math.floor(n / alphabet.length);
  }
  return code;
}

export async function addBooking(
  db: DataSource,
  flight: FlightEntity,
  passengers: PassengerSpec[],
  opts: { pnr?: string; email?: string | null; travelsTogether?: boolean } = {},
): Promise<{ booking: BookingEntity; passengers: PassengerEntity[] }> {
  const pnr = opts.pnr ?? uniquePnr();
  const booking = await db.getRepository(BookingEntity).save(db.getRepository(BookingEntity).create({
    flightId: flight.id, pnr, contactEmail: opts.email === undefined ? `${pnr.toLowerCase()}@passengers.bumpboard.test` : opts.email,
    travelsTogether: opts.travelsTogether ?? true, status: 'active',
  }));
  const rows = await db.getRepository(PassengerEntity).save(passengers.map((p, i) => {
    const status = p.status ?? 'checked-in';
    const checkedIn = status === 'checked-in' || status === 'boarded' ? new Date(flight.scheduledDeparture.getTime() - (p.checkedInBefore ?? 60) * 60_000) : null;
    return db.getRepository(PassengerEntity).create({
      bookingId: booking.id, flightId: flight.id, pnrSequence: i + 1, firstName: p.first, lastName: p.last, cabin: p.cabin ?? 'Y',
      fareMinor: p.fareMinor ?? 20_000, fareCurrency: p.fareCurrency ?? 'USD', fareType: 'standard', ssrCodes: p.ssr ?? [], optionalFees: p.optionalFees ?? [], frequentFlyerTier: p.tier ?? null,
      isChild: p.isChild ?? false, inboundFlight: null, inboundScheduledArrival: null, inboundEstimatedArrival: null, seat: null, status,
      checkedInAt: checkedIn, boardedAt: status === 'boarded' ? new Date(flight.scheduledDeparture.getTime() - 20 * 60_000) : null, statusChangedAt: checkedIn,
    });
  }));
  return { booking, passengers: rows };
}

/** n travellers on their own, checked in one minute apart, each with an address. */
export async function addSingles(db: DataSource, flight: FlightEntity, n: number, fare = { fareMinor: 20_000, fareCurrency: 'USD' }) {
  const out = [];
  for (let i = 0; i < n; i++) out.push(await addBooking(db, flight, [{ first: `Solo${i + 1}`, last: 'Traveller', checkedInBefore: 90 - i, ...fare }]));
  return out;
}

export async function sessionUserOf(db: DataSource, email: string): Promise<SessionUser> {
  const u = await db.getRepository(UserEntity).findOneOrFail({ where: { email }, relations: { stations: true } });
  return presentSessionUser(u);
}

export async function removeDenialFixtures(db: DataSource): Promise<void> {
  if (foreignProposals.length > 0) {
    await db.query('DELETE FROM denials WHERE proposal_id IN (?)', [foreignProposals]);
    await db.query('DELETE FROM denial_proposals WHERE id IN (?)', [foreignProposals]);
    foreignProposals.length = 0;
  }
  if (created.length === 0) return;
  await removeFlights(db, [...created]);
  created.length = 0;
}

/** Objects the route matrix calls the denial routes on. Pools hand out a fresh object per request where a call changes it. */
export interface DenialRouteContext {
  ownRules: PriorityRulesBody;
  /** A flight with a candidate and no waiting proposal. */
  nextProposeFlight(): number;
  /** A waiting proposal of the agent's, with one denial, for a supervisor to change. */
  nextChangeProposal(): { proposalId: number; denialId: number };
  /** An authorized denial not yet rebooked. */
  nextRebookDenial(): number;
  /** Proposed by the agent: authorizing it again is a no-op, so every allowed role gets 200. */
  authorizeProposalId: number;
  /** Withdrawing it again is a no-op. */
  withdrawProposalId: number;
  /** Rebooked, so its statement exists. */
  statementDenialId: number;
  /** A proposal and a denial at the station no demo user belongs to. */
  other: { proposalId: number; denialId: number };
  /** A passenger still on the flight, for a refusal of carriage. */
  nextRefusal(): { flightId: number; passengerId: number };
  /** A passenger of a flight that left two hours ago, checked in on time, for a denial recorded after the fact. */
  nextRecorded(): { flightId: number; passengerId: number; occurredAt: string };
}

function pool<T>(items: T[], what: string): () => T {
  return () => {
    const next = items.shift();
    if (next === undefined) throw new Error(`the route matrix used up its ${what}; make the pool larger`);
    return next;
  };
}

/** Builds the denial objects for the route matrix: own-station ones through the services, the other station's by hand. */
export async function denialRouteContext(db: DataSource, otherFlight: FlightEntity, poolSize = 7): Promise<DenialRouteContext> {
  const [agent, supervisor] = await Promise.all([sessionUserOf(db, 'agent@bumpboard.test'), sessionUserOf(db, 'supervisor@bumpboard.test')]);
  const body = { seatsNeeded: 1, reason: 'route matrix fixture' };
  // One seat and two passengers present: one short, so a proposal has a real shortfall to cover.
  const singleFlight = async () => {
    const flight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1 });
    await addSingles(db, flight, 2);
    return flight;
  };
  const proposeFlights: number[] = [];
  const changeProposals: { proposalId: number; denialId: number }[] = [];
  for (let i = 0; i < poolSize; i++) {
    proposeFlights.push((await singleFlight()).id);
    const { proposal } = await proposeDenials(db, agent, (await singleFlight()).id, body);
    const [denial] = await db.getRepository(DenialEntity).findBy({ proposalId: proposal.id });
    changeProposals.push({ proposalId: proposal.id, denialId: denial.id });
  }
  const authorizeProposalId = (await proposeDenials(db, agent, (await singleFlight()).id, body)).proposal.id;
  const withdrawProposalId = (await proposeDenials(db, agent, (await singleFlight()).id, body)).proposal.id;

  const rebookFlight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1 });
  await addSingles(db, rebookFlight, poolSize + 2);
  const { proposal } = await proposeDenials(db, agent, rebookFlight.id, { seatsNeeded: poolSize + 1, reason: 'route matrix fixture' });
  await authorizeDenials(db, supervisor, proposal.id, undefined);
  const rebookDenials = (await db.getRepository(DenialEntity).findBy({ proposalId: proposal.id })).map((d) => d.id);
  const statementDenialId = rebookDenials.pop()!;
  await rebookDenial(db, agent, statementDenialId, { noAlternate: true });

  const otherProposal = await db.getRepository(DenialProposalEntity).save({
    flightId: otherFlight.id, stationId: otherFlight.stationId, status: 'proposed', seatsNeeded: 1, proposedByUserId: agent.id, proposedByLabel: 'route matrix',
    decidedByUserId: null, decidedAt: null, reason: 'route matrix fixture at another station',
  });
  foreignProposals.push(otherProposal.id);
  const [otherParty] = await addSingles(db, otherFlight, 1);
  const otherDenial = await db.getRepository(DenialEntity).save({
    proposalId: otherProposal.id, flightId: otherFlight.id, stationId: otherFlight.stationId, bookingId: otherParty.booking.id, passengerIds: otherParty.passengers.map((p) => p.id), position: 1, reasons: [],
    status: 'authorized', selectedByUserId: agent.id, authorizedByUserId: supervisor.id, authorizedAt: new Date(), changeReason: null, category: null,
    compensation: null, statementMessageIds: null,
  });
  const refusalFlight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 150 });
  const refusals = (await addSingles(db, refusalFlight, poolSize)).map((b) => ({ flightId: refusalFlight.id, passengerId: b.passengers[0].id }));
  const left = new Date(Date.now() - 2 * 3_600_000);
  const recordedFlight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 150, departure: left });
  const occurredAt = new Date(left.getTime() - 10 * 60_000).toISOString();
  const recorded = (await addSingles(db, recordedFlight, poolSize)).map((b) => ({ flightId: recordedFlight.id, passengerId: b.passengers[0].id, occurredAt }));
  const rules = await priorityRulesFor(db, rebookFlight.stationId);
  return {
    nextRefusal: pool(refusals, 'passengers to refuse'),
    nextRecorded: pool(recorded, 'passengers to record a denial for'),
    ownRules: { rules: rules.rules, tierOrder: rules.tierOrder },
    nextProposeFlight: pool(proposeFlights, 'flights to propose on'),
    nextChangeProposal: pool(changeProposals, 'proposals to change'),
    nextRebookDenial: pool(rebookDenials, 'denials to rebook'),
    authorizeProposalId, withdrawProposalId, statementDenialId,
    other: { proposalId: otherProposal.id, denialId: otherDenial.id },
  };
}
