// How well a model's show probabilities and oversale odds matched what happened on flights held out of training.
import { brierScore, logLoss, oversaleBacktest, reliabilityBins, type OversaleOutcome } from '@shared/forecast';
import { SHOWED_OUTCOMES, type Calibration } from '@shared/schemas/learning';
import type { ShowUpProfile } from '@shared/schemas/show-up-profile';
import { computeFlightForecast } from '../forecast/flight-forecast';
import { passengerShowProbability, type PassengerState } from '../forecast/show-probability';
import type { RatesModel, TrainingFlight } from './train';

/** The moment the forecasts are checked at: three hours before departure (our own choice of a working moment). */
export const CHECK_HOURS_BEFORE = 3;
export const RELIABILITY_BINS = 10;

interface Scored {
  predicted: number[];
  observed: (0 | 1)[];
  oversale: OversaleOutcome[];
}

/** The flight as the desk saw it three hours out: checked in or not, connecting or not. */
function passengersAt(f: TrainingFlight): (PassengerState & { travelsTogether: boolean })[] {
  return f.outcomes.map((o, i) => ({
    id: i + 1, bookingId: i + 1, cabin: o.cabin, fareType: o.fareClass, status: o.checkedInT3 ? 'checked-in' : 'booked',
    checkedInAt: o.checkedInT3 ? o.checkedInAt : null, channel: o.channel,
    inboundFlight: o.connecting ? 'inbound' : null, inboundEstimatedArrival: null, travelsTogether: false,
  }));
}

function score(flights: TrainingFlight[], profileOf: (f: TrainingFlight) => ShowUpProfile, shockOf: (f: TrainingFlight) => number | null): Scored {
  const out: Scored = { predicted: [], observed: [], oversale: [] };
  for (const f of flights) {
    const now = new Date(f.scheduledDeparture.getTime() - CHECK_HOURS_BEFORE * 3_600_000);
    const profile = profileOf(f);
    const passengers = passengersAt(f);
    passengers.forEach((p, i) => {
      out.predicted.push(passengerShowProbability(p, profile, f.scheduledDeparture, now).probability);
      out.observed.push(SHOWED_OUTCOMES.has(f.outcomes[i].outcome) ? 1 : 0);
    });
    const rho = shockOf(f);
    const { forecast } = computeFlightForecast({
      passengers, seatsByCabin: f.seatsByCabin, departure: f.scheduledDeparture, now, profile, riskTolerance: 0.05,
      shock: rho ? { kind: 'beta-binomial', rho } : null,
    });
    const shows = f.outcomes.filter((o) => SHOWED_OUTCOMES.has(o.outcome)).length;
    out.oversale.push({ pOversale: forecast.pOversale, expectedDenied: forecast.expectedDenied, oversold: shows > forecast.capacity, beyondSeats: Math.max(0, shows - forecast.capacity) });
  }
  return out;
}

function calibrationOf(stationId: number, route: string | null, learned: Scored, handSet: Scored): Calibration {
  return {
    stationId, route, passengers: learned.predicted.length,
    learned: { brier: brierScore(learned.predicted, learned.observed), logLoss: logLoss(learned.predicted, learned.observed) },
    handSet: { brier: brierScore(handSet.predicted, handSet.observed), logLoss: logLoss(handSet.predicted, handSet.observed) },
    bins: reliabilityBins(learned.predicted, learned.observed, RELIABILITY_BINS),
    backtest: { learned: oversaleBacktest(learned.oversale), handSet: oversaleBacktest(handSet.oversale) },
  };
}

/** Calibration per station and per route of the held-out flights, for the learned model and the hand-set profile. */
export function evaluateModel(heldOut: TrainingFlight[], model: RatesModel, handSet: (stationId: number) => ShowUpProfile): Calibration[] {
  const out: Calibration[] = [];
  const learnedProfile = (f: TrainingFlight) => {
    const s = model.stations[String(f.stationId)];
    return s?.routes[f.destination] ?? s?.profile ?? handSet(f.stationId);
  };
  const learnedShock = (f: TrainingFlight) => model.stations[String(f.stationId)]?.shockRho ?? null;
  const hand = (f: TrainingFlight) => handSet(f.stationId);
  for (const stationId of [...new Set(heldOut.map((f) => f.stationId))].sort((a, b) => a - b)) {
    const mine = heldOut.filter((f) => f.stationId === stationId && f.outcomes.length > 0);
    if (!mine.length) continue;
    out.push(calibrationOf(stationId, null, score(mine, learnedProfile, learnedShock), score(mine, hand, () => null)));
    for (const route of [...new Set(mine.map((f) => f.destination))].sort()) {
      const flights = mine.filter((f) => f.destination === route);
      out.push(calibrationOf(stationId, route, score(flights, learnedProfile, learnedShock), score(flights, hand, () => null)));
    }
  }
  return out;
}
