// Invented manifests: parties, families with children, connections, special-service requests, fares, and the
// check-in state each passenger would have reached by the moment the demo is loaded.
import type { OptionalFee } from '@shared/schemas/optional-fees';
import type { Random } from './random';
import { familyName, firstName, personName, pnr } from './people';
import type { DemoFlight, DemoStation } from './scenario';
import type { BookingChannel } from '@shared/schemas/booking-channel';

export interface DemoPassenger {
  firstName: string;
  lastName: string;
  cabin: string;
  fareMinor: number;
  fareType: string;
  ssrCodes: string[];
  optionalFees: OptionalFee[];
  frequentFlyerTier: string | null;
  isChild: boolean;
  inboundFlight: string | null;
  inboundScheduledArrival: Date | null;
  checkedInAt: Date | null;
  boardedAt: Date | null;
}

export interface DemoBooking {
  pnr: string;
  contactEmail: string;
  channel: BookingChannel;
  passengers: DemoPassenger[];
}

/**
 * Share of eventual shows already checked in, by minutes before departure: a plausible curve of our own
 * (common practice: online check-in opens 24 h out, most people check in on the day, the counter closes 30-45 min out).
 */
export const DEMO_CHECK_IN_CURVE: [minutesBefore: number, share: number][] = [
  [1440, 0], [720, 0.3], [240, 0.5], [120, 0.68], [60, 0.87], [45, 0.96], [30, 1],
];

function minutesBeforeForShare(share: number): number {
  for (let i = 1; i < DEMO_CHECK_IN_CURVE.length; i++) {
    const [m0, g0] = DEMO_CHECK_IN_CURVE[i - 1];
    const [m1, g1] = DEMO_CHECK_IN_CURVE[i];
    if (share <= g1) return m0 + ((share - g0) / (g1 - g0)) * (m1 - m0);
  }
  return 30;
}

const TIERS = ['silver', 'gold', 'platinum'] as const;

function passenger(rng: Random, station: DemoStation, cabin: string, lastName: string, child: boolean): DemoPassenger {
  const [lo, hi] = station.fareRange;
  const base = rng.int(lo, hi);
  const fare = cabin === 'J' ? base * 4 : base;
  return {
    firstName: firstName(rng),
    lastName,
    cabin,
    fareMinor: child ? Math.round(fare * 0.75) * 100 : fare * 100,
    fareType: cabin === 'J' ? 'flex' : rng.chance(0.25) ? 'flex' : rng.chance(0.1) ? 'award' : 'standard',
    ssrCodes: [],
    optionalFees: demoFees(station, fare),
    frequentFlyerTier: !child && rng.chance(0.18) ? rng.pick(TIERS) : null,
    isChild: child,
    inboundFlight: null,
    inboundScheduledArrival: null,
    checkedInAt: null,
    boardedAt: null,
  };
}

/**
 * Invented extras (about a third pay for a seat, a quarter for a bag; amounts of our own). Derived from the fare, not
 * drawn from the random stream, so adding them left every other demo value as it was.
 */
function demoFees(station: DemoStation, fare: number): OptionalFee[] {
  const fees: OptionalFee[] = [];
  if (fare % 3 === 0) fees.push({ kind: 'seat', amountMinor: (15 + (fare % 5) * 5) * 100, currency: station.currency });
  if (fare % 4 === 1) fees.push({ kind: 'bag', amountMinor: 3500, currency: station.currency });
  if (fare % 11 === 2) fees.push({ kind: 'priority', amountMinor: 1500, currency: station.currency });
  return fees;
}

export function demoManifest(rng: Random, station: DemoStation, flight: DemoFlight, departure: Date, now: Date): DemoBooking[] {
  const seats = Object.values(flight.seats).reduce((a, b) => a + b, 0);
  const target = Math.round(seats * flight.loadFactor);
  const bookings: DemoBooking[] = [];
  let people = 0;
  while (people < target) {
    const roll = rng.next();
    const cabin = flight.seats.J && rng.chance(flight.seats.J / seats) ? 'J' : 'Y';
    const family = roll > 0.93;
    const size = family ? rng.int(3, 4) : roll > 0.72 ? 2 : 1;
    const last = size > 1 ? familyName(rng) : personName(rng).lastName;
    const pax: DemoPassenger[] = [];
    for (let i = 0; i < Math.min(size, target - people); i++) pax.push(passenger(rng, station, family ? 'Y' : cabin, last, family && i >= 2));
    if (family && pax.length > 2) pax[pax.length - 1].ssrCodes.push(rng.chance(0.4) ? 'INFT' : 'CHLD');
    if (size === 1 && rng.chance(0.012)) pax[0].ssrCodes.push('UMNR');
    if (rng.chance(0.02)) pax[0].ssrCodes.push(rng.pick(['WCHR', 'WCHS', 'BLND', 'DEAF'] as const));
    if (rng.chance(0.14)) {
      const inboundArr = new Date(departure.getTime() - rng.int(55, 140) * 60_000);
      for (const p of pax) Object.assign(p, { inboundFlight: `ZZ${rng.int(300, 399)}`, inboundScheduledArrival: inboundArr });
    }
    settleCheckIn(rng, pax, departure, now);
    const code = pnr(rng);
    bookings.push({ pnr: code, channel: demoChannel(code), contactEmail: `${pax[0].firstName}.${last}.${code}@passengers.bumpboard.test`.toLowerCase(), passengers: pax });
    people += pax.length;
  }
  return bookings;
}

/** Demo share of bookings per channel (invented): half on the website, then app, agency and corporate. */
export const DEMO_CHANNEL_SHARES: ReadonlyArray<[BookingChannel, number]> = [['web', 0.45], ['app', 0.25], ['agency', 0.2], ['corporate', 0.1]];

/**
 * The channel of a demo booking, read from its PNR's letters rather than drawn from the random stream, so that every
 * other invented detail of the demo stays as it was before bookings had channels.
 */
export function demoChannel(code: string): BookingChannel {
  let h = 0;
  for (const ch of code) h = (h * 31 + ch.charCodeAt(0)) % 10_007;
  let u = h / 10_007;
  for (const [channel, share] of DEMO_CHANNEL_SHARES) {
    if (u < share) return channel;
    u -= share;
  }
  return 'web';
}

/** A party shows together; whether it has checked in (or boarded) by now follows the curve above. */
function settleCheckIn(rng: Random, pax: DemoPassenger[], departure: Date, now: Date) {
  const showProbability = pax[0].inboundFlight ? 0.84 : pax[0].fareType === 'flex' ? 0.86 : 0.93;
  if (!rng.chance(showProbability)) return;
  const checkInAt = new Date(departure.getTime() - minutesBeforeForShare(rng.next()) * 60_000);
  if (checkInAt > now) return;
  const minutesToGo = (departure.getTime() - now.getTime()) / 60_000;
  const boardingStarted = minutesToGo < 35;
  for (const p of pax) {
    p.checkedInAt = checkInAt;
    if (boardingStarted && (minutesToGo < 0 || rng.chance(Math.min(1, (35 - minutesToGo) / 25)))) {
      p.boardedAt = new Date(Math.min(now.getTime(), departure.getTime() - rng.int(2, 30) * 60_000));
    }
  }
}
