// Invented closed-flight history for the demo (labelled demo), generated from known true rates so that the learning
// can be checked against them. The process, in full:
//  - each demo flight number flies once a day on each of the HISTORY_DAYS days before the load, same route and seats;
//  - bookings = seats x a load factor drawn uniformly from [0.85, 1.12]; each booking is one person, in J with the
//    share of J seats, on a flexible fare with chance 0.25, connecting with chance 0.2;
//  - each booking is made through a channel drawn with the demo shares (web 0.45, app 0.25, agency 0.2, corporate 0.1);
//  - the true booking show rate is TRUE_STATION_RATE + TRUE_ROUTE_OFFSET - 0.04 if connecting + 0.02 in J, times
//    0.93 on a flexible fare, times the channel's factor (`trueShowRate`); a missed connection counts as not shown;
//  - a day shock multiplies every rate of a flight by 1 + 0.03 z (z standard normal, clamped to +-3), an intra-class
//    correlation of about (0.03 x 0.88)^2 / (0.88 x 0.12) = 0.0066;
//  - a show checks in with chance 0.99, at a time drawn from the default check-in curve; a no-show with chance 0.02;
//  - shows beyond the seats become volunteers; a connecting no-show who never checked in is a missed connection.
import type { EntityManager } from 'typeorm';
import { DEFAULT_SHOW_UP_PROFILE } from '@shared/schemas/show-up-profile';
import type { BookingOutcomeValue } from '@shared/schemas/learning';
import { ClosedFlightEntity, StationEntity } from '../db/entities';
import { dayOfWeekIn } from '../modules/learning/outcomes.service';
import { seededRandom, type Random } from './random';
import { DEMO_CARRIER, DEMO_STATIONS } from './scenario';
import { DEMO_CHANNEL_SHARES } from './manifest';
import type { BookingChannel } from '@shared/schemas/booking-channel';

export const HISTORY_DAYS = 21;
export const TRUE_STATION_RATE: Record<string, number> = { BOS: 0.9, FCO: 0.87, YUL: 0.89 };
export const TRUE_ROUTE_OFFSET: Record<string, number> = { ORD: 0.01, DCA: -0.02, LIS: 0.02, HAM: 0, BRU: -0.03, YYZ: -0.01, YVR: 0.02 };
export const TRUE_FLEX_FACTOR = 0.93;

/** Invented: app bookers show a little more, corporate travellers (free to rebook) clearly less. */
export const TRUE_CHANNEL_FACTOR: Record<BookingChannel, number> = { web: 1, app: 1.03, agency: 0.98, corporate: 0.9 };

export function trueShowRate(station: string, route: string, connecting: boolean, cabin: string, fareClass: string, channel: BookingChannel): number {
  const q = TRUE_STATION_RATE[station] + (TRUE_ROUTE_OFFSET[route] ?? 0) - (connecting ? 0.04 : 0) + (cabin === 'J' ? 0.02 : 0);
  return q * (fareClass === 'flex' ? TRUE_FLEX_FACTOR : 1) * TRUE_CHANNEL_FACTOR[channel];
}

/** The true rate of a segment that mixes the channels in their demo shares. */
export function trueMixedShowRate(station: string, route: string, connecting: boolean, cabin: string, fareClass: string): number {
  return DEMO_CHANNEL_SHARES.reduce((s, [channel, share]) => s + share * trueShowRate(station, route, connecting, cabin, fareClass, channel), 0);
}

/** Chance that a show (a no-show) checks in at all (invented, as the rest). */
export const SHOW_CHECKS_IN = 0.99;
export const NO_SHOW_CHECKS_IN = 0.02;

function drawChannel(u: number): BookingChannel {
  for (const [channel, share] of DEMO_CHANNEL_SHARES) {
    if (u < share) return channel;
    u -= share;
  }
  return 'web';
}

export interface HistoryOutcome {
  pnr: string;
  cabin: string;
  fareClass: string;
  connecting: boolean;
  channel: BookingChannel;
  checkedInAt: Date | null;
  outcome: BookingOutcomeValue;
}

export interface HistoryFlight {
  station: string;
  flightNumber: string;
  destination: string;
  scheduledDeparture: Date;
  seatsByCabin: Record<string, number>;
  outcomes: HistoryOutcome[];
}

/** Minutes before departure at which a show checks in: the inverse of the default check-in curve at u. */
function checkInMinutes(u: number): number {
  const pts = DEFAULT_SHOW_UP_PROFILE.checkInCurve;
  for (let i = 1; i < pts.length; i++) {
    const [m0, g0] = pts[i - 1];
    const [m1, g1] = pts[i];
    if (u <= g1) return m0 - ((u - g0) / (g1 - g0)) * (m0 - m1);
  }
  return pts[pts.length - 1][0];
}

function normal(r: Random): number {
  return Math.sqrt(-2 * Math.log(1 - r.next())) * Math.cos(2 * Math.PI * r.next());
}

/** The invented history, the same on every machine for the same `now`'s day. */
export function generateHistory(now: Date, seed = 1511): HistoryFlight[] {
  const r = seededRandom(seed);
  const flights: HistoryFlight[] = [];
  for (let day = HISTORY_DAYS; day >= 1; day--) {
    for (const s of DEMO_STATIONS) {
      for (const f of s.flights) {
        const departure = new Date(now.getTime() - day * 86_400_000 + f.departsIn * 60_000);
        const seats = Object.values(f.seats).reduce((a, b) => a + b, 0);
        const booked = Math.round(seats * (0.85 + 0.27 * r.next()));
        const factor = 1 + 0.03 * Math.max(-3, Math.min(3, normal(r)));
        const outcomes: HistoryOutcome[] = [];
        for (let i = 0; i < booked; i++) {
          const cabin = f.seats.J && r.next() < f.seats.J / seats ? 'J' : 'Y';
          const fareClass = r.chance(0.25) ? 'flex' : 'standard';
          const connecting = r.chance(0.2);
          const channel = drawChannel(r.next());
          const shows = r.chance(Math.min(0.995, trueShowRate(s.iata, f.destination, connecting, cabin, fareClass, channel) * factor));
          const checksIn = r.chance(shows ? SHOW_CHECKS_IN : NO_SHOW_CHECKS_IN);
          const checkedInAt = checksIn ? new Date(departure.getTime() - checkInMinutes(r.next()) * 60_000) : null;
          const outcome: BookingOutcomeValue = shows ? 'showed' : connecting && !checkedInAt ? 'missed-connection' : 'no-show';
          outcomes.push({ pnr: `H${(flights.length * 1000 + i).toString(36).toUpperCase().padStart(6, '0')}`.slice(0, 8), cabin, fareClass, connecting, channel, checkedInAt, outcome });
        }
        let extra = outcomes.filter((o) => o.outcome === 'showed').length - seats;
        for (const o of outcomes) if (extra > 0 && o.outcome === 'showed') { o.outcome = 'volunteered'; extra--; }
        flights.push({ station: s.iata, flightNumber: f.number, destination: f.destination, scheduledDeparture: departure, seatsByCabin: f.seats, outcomes });
      }
    }
  }
  return flights;
}

const HOUR = 3_600_000;

/** Inserts the history in batches: one statement per 200 flights and one per 5,000 outcomes. */
export async function insertDemoHistory(em: EntityManager, now: Date): Promise<{ flights: number; outcomes: number }> {
  const stations = new Map((await em.find(StationEntity)).map((s) => [s.iata, s]));
  const history = generateHistory(now);
  const rows: unknown[][] = [];
  for (let i = 0; i < history.length; i += 200) {
    const batch = history.slice(i, i + 200);
    const { identifiers } = await em.insert(ClosedFlightEntity, batch.map((f) => {
      const station = stations.get(f.station)!;
      return {
        flightId: null, stationId: station.id, carrierCode: DEMO_CARRIER.code, flightNumber: f.flightNumber,
        serviceDate: f.scheduledDeparture.toLocaleDateString('en-CA', { timeZone: station.timeZone }), origin: f.station, destination: f.destination,
        scheduledDeparture: f.scheduledDeparture, dayOfWeek: dayOfWeekIn(f.scheduledDeparture, station.timeZone), seatsByCabin: f.seatsByCabin, demo: true,
      };
    }));
    batch.forEach((f, k) => {
      const closedFlightId = Number(identifiers[k].id);
      const dep = f.scheduledDeparture.getTime();
      const by = (at: Date | null, hours: number) => at !== null && at.getTime() <= dep - hours * HOUR;
      for (const o of f.outcomes) {
        rows.push([closedFlightId, o.pnr, o.cabin, o.fareClass, o.connecting, o.channel, o.checkedInAt, by(o.checkedInAt, 24), by(o.checkedInAt, 3), by(o.checkedInAt, 1), o.outcome]);
      }
    });
  }
  // Plain multi-row statements: building tens of thousands of entities through the ORM took most of the load time.
  for (let i = 0; i < rows.length; i += 5000) {
    await em.query(
      "INSERT INTO booking_outcomes (closed_flight_id, pnr, cabin, fare_class, connecting, channel, checked_in_at, checked_in_t24, checked_in_t3, checked_in_t1, outcome, party_size) VALUES ?",
      [rows.slice(i, i + 5000).map((r) => [...r, 1])],
    );
  }
  return { flights: history.length, outcomes: rows.length };
}
