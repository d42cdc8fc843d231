// The flight's figures from its passengers: parties as units that show together, the common shock if set, the
// volunteer target at the station's risk tolerance, and per-cabin views.
import { oversaleRisk, showUpDistribution, volunteerTarget, type CommonShock, type ShowUpUnit } from '@shared/forecast';
import type { Forecast } from '@shared/schemas/flight-desk';
import type { ShowUpProfile } from '@shared/schemas/show-up-profile';
import { passengerShowProbability, type PassengerState, type ShowEstimate } from './show-probability';

export interface ForecastInput {
  passengers: (PassengerState & { travelsTogether: boolean })[];
  seatsByCabin: Record<string, number>;
  departure: Date;
  now: Date;
  profile: ShowUpProfile;
  riskTolerance: number;
  shock: CommonShock | null;
}

export interface CabinFigures {
  cabin: string;
  seats: number;
  booked: number;
  checkedIn: number;
  boarded: number;
  expectedShows: number;
  pOversale: number;
}

export interface FlightForecastResult {
  forecast: Forecast;
  cabins: CabinFigures[];
  estimates: Map<number, ShowEstimate>;
}

/**
 * A party books together and, while every member is in the same state, shows together: one unit of its size.
 * Members in different states (one checked in, one not) are no longer moving as one and count individually.
 */
function unitsOf(passengers: ForecastInput['passengers'], estimates: Map<number, ShowEstimate>): ShowUpUnit[] {
  const byBooking = new Map<number, ForecastInput['passengers']>();
  for (const p of passengers) {
    if (p.status === 'cancelled') continue;
    const list = byBooking.get(p.bookingId) ?? [];
    list.push(p);
    byBooking.set(p.bookingId, list);
  }
  const units: ShowUpUnit[] = [];
  for (const party of byBooking.values()) {
    const probs = party.map((p) => estimates.get(p.id)!.probability);
    const together = party.length > 1 && party[0].travelsTogether && probs.every((x) => Math.abs(x - probs[0]) < 1e-12);
    if (together) units.push({ size: party.length, showProbability: probs[0] });
    else for (const x of probs) units.push({ size: 1, showProbability: x });
  }
  return units;
}

export function computeFlightForecast(input: ForecastInput): FlightForecastResult {
  const estimates = new Map<number, ShowEstimate>();
  for (const p of input.passengers) estimates.set(p.id, passengerShowProbability(p, input.profile, input.departure, input.now));
  const live = input.passengers.filter((p) => p.status !== 'cancelled');
  const capacity = Object.values(input.seatsByCabin).reduce((a, b) => a + b, 0);
  const pmf = showUpDistribution(unitsOf(live, estimates), input.shock ?? undefined);
  const risk = oversaleRisk(pmf, capacity);
  const forecast: Forecast = {
    computedAt: input.now.toISOString(),
    capacity,
    pmf: Array.from(pmf),
    ...risk,
    volunteerTarget: volunteerTarget(pmf, capacity, input.riskTolerance),
    riskTolerance: input.riskTolerance,
    shock: input.shock,
  };
  const cabins = Object.entries(input.seatsByCabin).map(([cabin, seats]) => {
    const inCabin = live.filter((p) => p.cabin === cabin);
    // Per-cabin odds ignore the shock: they say where the pressure is, the flight total says how much.
    const cabinPmf = showUpDistribution(unitsOf(inCabin, estimates));
    return {
      cabin,
      seats,
      booked: inCabin.length,
      checkedIn: inCabin.filter((p) => p.status === 'checked-in' || p.status === 'boarded').length,
      boarded: inCabin.filter((p) => p.status === 'boarded').length,
      expectedShows: inCabin.reduce((a, p) => a + estimates.get(p.id)!.probability, 0),
      pOversale: oversaleRisk(cabinPmf, seats).pOversale,
    };
  });
  return { forecast, cabins, estimates };
}
