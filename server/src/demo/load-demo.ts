import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import { BookingEntity, FlightEntity, IntegrationKeyEntity, PassengerEntity, StationEntity, UserEntity } from '../db/entities';
import type { FlightState } from '@shared/schemas/flights';
import { hashPassword } from '../modules/auth/password';
import { audit } from '../modules/audit/audit.service';
import { localDate } from '@shared/time';
import { createIntegrationKey } from '../modules/integrations/integration-keys.service';
import { deleteInDependencyOrder, flightsHeldByMoney } from './delete-in-order';
import { demoManifest } from './manifest';
import { seededRandom } from './random';
import { insertDemoHistory } from './history';
import { DEMO_CARRIER, DEMO_PASSWORD, DEMO_STATIONS, DEMO_USERS, type DemoFlight, type DemoStation } from './scenario';

const MINUTE = 60_000;

function stateAt(departsIn: number): FlightState {
  if (departsIn < -5) return 'departed';
  if (departsIn < 40) return 'boarding';
  return 'check-in-open';
}

async function insertFlight(em: EntityManager, station: StationEntity, demo: DemoStation, f: DemoFlight, now: Date, seed: number) {
  const departure = new Date(Math.round((now.getTime() + f.departsIn * MINUTE) / (5 * MINUTE)) * 5 * MINUTE);
  const serviceDate = localDate(departure, station.timeZone);
  // A flight kept for its money rows may hold this number and day already; it stays as it is.
  if (await em.existsBy(FlightEntity, { carrierCode: DEMO_CARRIER.code, flightNumber: f.number, serviceDate, origin: station.iata })) return;
  const flight = await em.save(em.create(FlightEntity, {
    stationId: station.id,
    carrierCode: DEMO_CARRIER.code,
    flightNumber: f.number,
    serviceDate,
    origin: station.iata,
    destination: f.destination,
    scheduledDeparture: departure,
    scheduledArrival: new Date(departure.getTime() + f.blockMinutes * MINUTE),
    aircraftType: f.aircraft,
    seatsByCabin: f.seats,
    gate: f.gate,
    state: stateAt(f.departsIn),
  }));
  const rng = seededRandom(seed);
  const seated = new Map<string, number>();
  // Checked-in passengers carry the seat check-in gave, filled front to back per cabin, six abreast (invented).
  const seatFor = (cabin: string, checkedIn: boolean) => {
    if (!checkedIn) return null;
    const n = seated.get(cabin) ?? 0;
    seated.set(cabin, n + 1);
    return `${(cabin === 'Y' ? 10 : 1) + Math.floor(n / 6)}${'ABCDEF'[n % 6]}`;
  };
  for (const b of demoManifest(rng, demo, f, departure, now)) {
    const booking = await em.save(em.create(BookingEntity, { flightId: flight.id, pnr: b.pnr, contactEmail: b.contactEmail, channel: b.channel, travelsTogether: true, status: 'active' }));
    await em.insert(PassengerEntity, b.passengers.map((p, i) => ({
      ...p,
      bookingId: booking.id,
      flightId: flight.id,
      pnrSequence: i + 1,
      fareCurrency: station.currency,
      seat: seatFor(p.cabin, Boolean(p.checkedInAt || p.boardedAt)),
      inboundEstimatedArrival: p.inboundScheduledArrival,
      status: p.boardedAt ? 'boarded' : p.checkedInAt ? 'checked-in' : 'booked',
    } as const)));
  }
}

/** True when the database holds no station yet: the demo is loaded only then (or when asked to refresh). */
export async function isEmpty(db: DataSource) {
  return (await db.getRepository(StationEntity).count()) === 0;
}

/** Loads the invented scenario: stations, demo users, and a morning of flights relative to `now`. */
export async function loadDemo(db: DataSource, now = new Date()) {
  const hashes = await Promise.all(DEMO_USERS.map(() => hashPassword(DEMO_PASSWORD)));
  await db.transaction(async (em) => {
    const stations: StationEntity[] = [];
    for (const s of DEMO_STATIONS) {
      stations.push(await em.save(em.create(StationEntity, { iata: s.iata, name: s.name, timeZone: s.timeZone, regime: s.regime, currency: s.currency, riskToleranceBp: 500 })));
    }
    for (const [i, u] of DEMO_USERS.entries()) {
      await em.save(em.create(UserEntity, { ...u, passwordHash: hashes[i], active: true, stations }));
    }
    await insertFlights(em, stations, now);
    // Closed flights to learn show rates from: kept when the day's flights are refreshed (they are not flight rows).
    await insertDemoHistory(em, now);
    await audit(em, { actor: { label: 'demo loader' }, action: 'demo.loaded', entityType: 'demo', entityId: 'scenario', after: { at: now.toISOString() } });
  });
}

async function insertFlights(em: EntityManager, stations: StationEntity[], now: Date) {
  let seed = 2026;
  for (const s of DEMO_STATIONS) {
    const station = stations.find((x) => x.iata === s.iata)!;
    for (const f of s.flights) await insertFlight(em, station, s, f, now, seed++);
  }
}

/**
 * The demo's feed keys, one per station, for the simulator. Created through the same service an admin uses, so the
 * simulator has no side door; the keys go to a git-ignored file and never into the database in clear.
 */
export async function createDemoFeedKeys(db: DataSource): Promise<Record<string, string>> {
  const keys: Record<string, string> = {};
  await db.getRepository(IntegrationKeyEntity).update({ name: 'Demo simulator', revokedAt: IsNull() }, { revokedAt: new Date() });
  for (const station of await db.getRepository(StationEntity).find()) {
    keys[station.iata] = (await createIntegrationKey(db, station.id, 'Demo simulator', { label: 'demo loader' })).key;
  }
  return keys;
}

/**
 * A demo left from another day has nothing moving: replace its flights with a fresh morning. Everything hanging off
 * an old flight goes first, in the order the foreign keys demand; flights a compensation stands on stay with their
 * whole chain, since money rows are never deleted.
 */
export async function refreshDemoFlights(db: DataSource, now = new Date()) {
  await db.transaction(async (em) => {
    const held = new Set(await flightsHeldByMoney(em));
    const old = (await em.find(FlightEntity, { select: { id: true } })).map((f) => f.id).filter((id) => !held.has(id));
    const deleted = await deleteInDependencyOrder(em, 'flights', old);
    const stations = await em.find(StationEntity);
    await insertFlights(em, stations, now);
    await audit(em, { actor: { label: 'demo loader' }, action: 'demo.refreshed', entityType: 'demo', entityId: 'scenario', after: { at: now.toISOString(), deleted, keptForMoney: [...held] } });
  });
}

/** Whether every demo flight has already left: the sign that the demo should be refreshed. */
export async function demoIsStale(db: DataSource, now = new Date()) {
  const latest = await db.getRepository(FlightEntity).createQueryBuilder('f').select('MAX(f.scheduled_departure)', 'latest').getRawOne<{ latest: Date | null }>();
  return !latest?.latest || new Date(latest.latest).getTime() < now.getTime();
}
