// Plays the demo morning through the integration API, exactly as a departure-control feed would: check-ins along
// the station's curve (faster than real time, so the demo moves), parties checking in together, boarding near
// departure, and one inbound connection running late. It reads the manifest like a feed's own system would, and
// changes nothing except through the API.
import { readFileSync } from 'node:fs';
import { In, MoreThan, type DataSource } from 'typeorm';
import { createDataSource } from '../db/data-source';
import { BookingEntity, FlightEntity, PassengerEntity, StationEntity } from '../db/entities';
import { DEFAULT_SHOW_UP_PROFILE } from '@shared/schemas/show-up-profile';
import { showProbabilityNotCheckedIn } from '@shared/forecast';
import { seededRandom } from './random';

const MINUTE = 60_000;
const speed = Number(process.env.SIMULATOR_SPEED ?? 2);
const tickMs = Number(process.env.SIMULATOR_TICK_MS ?? 3000);
const apiUrl = process.env.APP_BASE_URL ?? 'http://127.0.0.1:4600';
const keys: Record<string, string> = JSON.parse(readFileSync(process.env.DEMO_KEYS_FILE ?? '.local/demo-feed-keys.json', 'utf8'));
const startedAt = Date.now();
let sequence = 0;
const lateInboundSent = new Set<number>();

const curve = DEFAULT_SHOW_UP_PROFILE.checkInCurve;

/** Share of eventual shows checked in by `minutesBefore` departure, on the station's default curve. */
function shareAt(minutesBefore: number) {
  if (minutesBefore >= curve[0][0]) return curve[0][1];
  for (let i = 1; i < curve.length; i++) {
    const [m0, g0] = curve[i - 1];
    const [m1, g1] = curve[i];
    if (minutesBefore >= m1) return g0 + ((m0 - minutesBefore) / (m0 - m1)) * (g1 - g0);
  }
  return 1;
}

/**
 * Whether and when a booking still unchecked at the simulator's start checks in, fixed per booking so restarts replay
 * the same morning. Drawn on the same Bayes update the forecast uses (a booking not yet checked in is less likely to
 * show), and on the rest of the curve after the start, so the demo neither overshoots nor stalls.
 */
function planFor(bookingId: number, minutesLeftAtStart: number) {
  const rng = seededRandom(bookingId * 7919);
  const startShare = shareAt(minutesLeftAtStart);
  const shows = rng.next() < showProbabilityNotCheckedIn(0.9, Math.min(startShare, 0.999));
  const share = startShare + rng.next() * (1 - startShare);
  let minutesBefore = curve[curve.length - 1][0];
  for (let i = 1; i < curve.length; i++) {
    const [m0, g0] = curve[i - 1];
    const [m1, g1] = curve[i];
    if (share <= g1) {
      minutesBefore = m0 + ((share - g0) / Math.max(1e-9, g1 - g0)) * (m1 - m0);
      break;
    }
  }
  return { shows, minutesBefore };
}

function event(type: string, flight: FlightEntity, extra: object) {
  return { id: `sim-${startedAt}-${++sequence}`, type, occurredAt: new Date().toISOString(), flight: { carrier: flight.carrierCode, number: flight.flightNumber, date: flight.serviceDate }, ...extra };
}

async function eventsForFlight(db: DataSource, flight: FlightEntity, now: number) {
  const events: object[] = [];
  const bookings = await db.getRepository(BookingEntity).findBy({ flightId: flight.id, status: 'active' });
  const passengers = await db.getRepository(PassengerEntity).findBy({ flightId: flight.id, status: In(['booked', 'checked-in']) });
  const byBooking = new Map<number, PassengerEntity[]>();
  for (const p of passengers) byBooking.set(p.bookingId, [...(byBooking.get(p.bookingId) ?? []), p]);
  const departure = flight.scheduledDeparture.getTime();
  for (const b of bookings) {
    const party = byBooking.get(b.id);
    if (!party) continue;
    const plan = planFor(b.id, (departure - startedAt) / MINUTE);
    const plannedAt = departure - plan.minutesBefore * MINUTE;
    const dueAt = startedAt + (plannedAt - startedAt) / speed;
    if (plan.shows && party.some((p) => p.status === 'booked') && dueAt <= now) events.push(event('passenger.checked-in', flight, { pnr: b.pnr }));
    // Boarding opens 40 minutes out; a share of the checked-in board at each tick.
    const boardingOpen = departure - now < 40 * MINUTE;
    if (boardingOpen && party.every((p) => p.status === 'checked-in') && seededRandom(b.id + now).next() < 0.15) events.push(event('passenger.boarded', flight, { pnr: b.pnr }));
  }
  const inbound = passengers.find((p) => p.inboundFlight && p.inboundEstimatedArrival);
  if (inbound && !lateInboundSent.has(flight.id) && bookings.length > Object.values(flight.seatsByCabin).reduce((a, s) => a + s, 0)) {
    lateInboundSent.add(flight.id);
    const late = new Date(flight.scheduledDeparture.getTime() - 20 * MINUTE).toISOString();
    events.push(event('inbound.updated', flight, { inboundFlight: inbound.inboundFlight, estimatedArrival: late }));
  }
  return events;
}

async function tick(db: DataSource) {
  const now = Date.now();
  const stations = await db.getRepository(StationEntity).find();
  for (const station of stations) {
    const key = keys[station.iata];
    if (!key) continue;
    const flights = await db.getRepository(FlightEntity).findBy({ stationId: station.id, scheduledDeparture: MoreThan(new Date(now)) });
    const events = (await Promise.all(flights.map((f) => eventsForFlight(db, f, now)))).flat().slice(0, 400);
    if (!events.length) continue;
    const res = await fetch(`${apiUrl}/api/integrations/events`, { method: 'POST', headers: { Authorization: `Bearer ${key}`, 'Content-Type': 'application/json' }, body: JSON.stringify({ events }) });
    if (!res.ok) console.error(`[simulator] ${station.iata}: feed answered ${res.status}`);
  }
}

const db = createDataSource(process.env.DATABASE_URL ?? '');
await db.initialize();
console.log(`[simulator] playing the demo morning through ${apiUrl}/api/integrations/events at ${speed}x`);
const timer = setInterval(() => void tick(db).catch((err) => console.error(`[simulator] ${err instanceof Error ? err.message : err}`)), tickMs);
const stop = async () => {
  clearInterval(timer);
  await db.destroy();
  process.exit(0);
};
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());
