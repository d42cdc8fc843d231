// Each passenger's chance of showing at the gate, with the reason in plain words for the desk.
import { liveSegment, segmentRateKey, showProbabilityNotCheckedIn, type CheckInSegment } from '@shared/forecast';
import type { ShowUpProfile } from '@shared/schemas/show-up-profile';

export interface PassengerState {
  id: number;
  bookingId: number;
  cabin: string;
  fareType: string;
  status: 'booked' | 'checked-in' | 'boarded' | 'offloaded' | 'cancelled';
  inboundFlight: string | null;
  inboundEstimatedArrival: Date | null;
  /** Accepted as a volunteer: gives up the seat on this flight. */
  volunteered?: boolean;
  /** When the passenger checked in (null or absent: not known, taken as now for a checked-in passenger). */
  checkedInAt?: Date | null;
  /** Where the booking was made; null or absent when not known. */
  channel?: string | null;
}

export interface ShowEstimate {
  probability: number;
  why: string;
}

/** Linear interpolation of the check-in curve: the share of eventual shows already checked in τ minutes out. */
export function checkedInShare(profile: ShowUpProfile, minutesBefore: number): number {
  const pts = profile.checkInCurve;
  if (minutesBefore <= profile.checkInCloseMinutes) return 1;
  if (minutesBefore >= pts[0][0]) return pts[0][1];
  for (let i = 1; i < pts.length; i++) {
    const [m1, g1] = pts[i];
    if (minutesBefore >= m1) {
      const [m0, g0] = pts[i - 1];
      return g0 + ((m0 - minutesBefore) / (m0 - m1)) * (g1 - g0);
    }
  }
  return pts[pts.length - 1][1];
}

/**
 * Chance of making the connection from the inbound flight's estimated arrival. A piecewise-linear ramp of our own
 * (common practice, no published source): sure with 15 minutes to spare beyond the minimum connecting time, hopeless
 * when it lands 15 minutes too late, linear between.
 */
export function connectionProbability(profile: ShowUpProfile, departure: Date, inboundEta: Date | null): number {
  if (!inboundEta) return ON_TIME_CONNECTION;
  const slack = (departure.getTime() - inboundEta.getTime()) / 60_000 - profile.minimumConnectMinutes;
  if (slack >= 15) return ON_TIME_CONNECTION;
  if (slack <= -15) return 0.03;
  return 0.03 + ((slack + 15) / 30) * 0.94;
}

/** The chance of making the connection when the inbound is on time, the most `connectionProbability` gives. */
export const ON_TIME_CONNECTION = 0.97;

/**
 * What the connection does to a connecting passenger's show rate, on every path of the forecast. Rates that already
 * hold the usual share of missed connections (learned ones) are moved only by the inbound's news relative to an
 * on-time inbound; the hand-set rates are of passengers who made it, so the whole chance applies.
 */
export function connectionFactor(profile: ShowUpProfile, chance: number): number {
  return profile.ratesIncludeUsualConnection ? chance / ON_TIME_CONNECTION : chance;
}

const HORIZON_WORDS: Record<CheckInSegment['horizon'], string> = { booked: 'more than 24 h out', 'T-24h': 'by 24 h out', 'T-3h': 'by 3 h out', 'T-1h': 'by 1 h out', closed: 'when check-in closed' };

function segmentWhy(s: CheckInSegment): string {
  if (s.state === 'any') return 'Booked, more than 24 h out';
  return `${s.state === 'checked-in' ? 'Checked in' : 'Not checked in'} ${HORIZON_WORDS[s.horizon]}`;
}

/** The learned rate of the passenger's check-in segment now, when the profile has one for it. */
function segmentRate(p: PassengerState, profile: ShowUpProfile, departure: Date, now: Date, minutesBefore: number, connecting: boolean) {
  if (!profile.segmentRates) return null;
  const checkedInAt = p.status === 'checked-in' ? (p.checkedInAt ?? now) : null;
  const segment = liveSegment(minutesBefore, profile.checkInCloseMinutes, checkedInAt, departure);
  const fare = p.fareType === 'flex' ? 'flex' : 'standard';
  const channel = p.channel ?? 'unknown';
  const rate = profile.segmentRates[segmentRateKey(segment, connecting ? 'connecting' : 'local', fare, channel)];
  if (rate === undefined) return null;
  const described = [connecting ? 'connecting' : 'local', fare === 'flex' ? 'flexible fare' : null, channel === 'unknown' ? 'channel not given' : `via ${channel}`].filter(Boolean).join(', ');
  return { rate, segment, described };
}

const pct = (p: number) => `${Number((p * 100).toFixed(p > 0.99 && p < 1 ? 1 : 0))} %`;

export function passengerShowProbability(p: PassengerState, profile: ShowUpProfile, departure: Date, now: Date): ShowEstimate {
  if (p.volunteered) return { probability: 0, why: 'Volunteered to give up the seat.' };
  if (p.status === 'boarded') return { probability: 1, why: 'Boarded: boarding pass scanned.' };
  if (p.status === 'offloaded' || p.status === 'cancelled') return { probability: 0, why: p.status === 'offloaded' ? 'Offloaded.' : 'Booking cancelled.' };
  const minutesBefore = (departure.getTime() - now.getTime()) / 60_000;
  const connecting = Boolean(p.inboundFlight);
  // The chance is worked out once per passenger: the factor and the desk's words both read it.
  const chance = connecting ? connectionProbability(profile, departure, p.inboundEstimatedArrival) : 1;
  const connection = connecting ? connectionFactor(profile, chance) : 1;
  const connectionWhy = connecting ? ` Inbound ${p.inboundFlight}: ${pct(chance)} chance of making the connection.` : '';

  const learned = segmentRate(p, profile, departure, now, minutesBefore, connecting);
  if (learned) {
    return { probability: learned.rate * connection, why: `${segmentWhy(learned.segment)}: ${pct(learned.rate)} of such bookings showed (${learned.described}).${connectionWhy}` };
  }
  if (p.status === 'checked-in') {
    const probability = profile.checkedInShowRate * connection;
    return { probability, why: `Checked in: ${pct(profile.checkedInShowRate)} of checked-in passengers board.${connectionWhy}` };
  }
  const rates = connecting ? profile.bookingRates.connecting : profile.bookingRates.local;
  const base = rates[p.cabin] ?? rates.Y ?? Object.values(rates)[0] ?? 0.9;
  const q = Math.min(1, base * (p.fareType === 'flex' ? profile.flexibleFareFactor : 1));
  const g = checkedInShare(profile, minutesBefore);
  const probability = showProbabilityNotCheckedIn(q, g) * connection;
  const segment = `${connecting ? 'connecting' : 'local'} ${p.cabin}${p.fareType === 'flex' ? ', flexible fare' : ''}`;
  const why = g >= 1
    ? `Not checked in and check-in has closed.${connectionWhy}`
    : `Not checked in: booking rate ${pct(q)} (${segment}); ${pct(g)} of shows are usually checked in by now.${connectionWhy}`;
  return { probability, why };
}
