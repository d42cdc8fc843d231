import { describe, expect, it } from 'vitest';
import { DEFAULT_SHOW_UP_PROFILE } from '@shared/schemas/show-up-profile';
import { SHOWED_OUTCOMES } from '@shared/schemas/learning';
import { generateHistory, trueMixedShowRate } from '../../demo/history';
import { DEMO_STATIONS } from '../../demo/scenario';
import { evaluateModel } from './evaluate';
import { learnModel, splitHeldOut, type TrainingFlight } from './train';

const NOW = new Date('2026-12-03T12:00:00Z');
const IATA = DEMO_STATIONS.map((s) => s.iata);

function trainingFlights(): TrainingFlight[] {
  return generateHistory(NOW).map((f, id) => ({
    id, stationId: IATA.indexOf(f.station) + 1, destination: f.destination, scheduledDeparture: f.scheduledDeparture, seatsByCabin: f.seatsByCabin,
    outcomes: f.outcomes.map((o) => ({ ...o, checkedInT3: o.checkedInAt !== null && o.checkedInAt.getTime() <= f.scheduledDeparture.getTime() - 3 * 3_600_000 })),
  }));
}

describe('learning from the demo history', () => {
  const flights = trainingFlights();
  const { training, heldOut } = splitHeldOut(flights);
  const model = learnModel(training, () => DEFAULT_SHOW_UP_PROFILE);

  it('holds out the latest fifth of the flights', () => {
    expect(heldOut.length).toBe(Math.round(flights.length * 0.2));
    expect(Math.min(...heldOut.map((f) => f.scheduledDeparture.getTime()))).toBeGreaterThanOrEqual(Math.max(...training.map((f) => f.scheduledDeparture.getTime())));
  });

  it('recovers the true booking show rates of every route within the expected error', () => {
    for (const station of DEMO_STATIONS) {
      const stationModel = model.stations[String(IATA.indexOf(station.iata) + 1)];
      for (const route of new Set(station.flights.map((f) => f.destination))) {
        for (const connecting of [false, true]) {
          const truth = trueMixedShowRate(station.iata, route, connecting, 'Y', 'standard');
          const n = training.filter((f) => f.stationId === IATA.indexOf(station.iata) + 1 && f.destination === route)
            .flatMap((f) => f.outcomes).filter((o) => o.connecting === connecting && o.cabin === 'Y' && o.fareClass === 'standard').length;
          // 4 binomial standard errors, widened by the day shock's design effect 1 + (m - 1) rho with about m = 60
          // such passengers per flight and rho 0.0066 (from the generator), plus 0.01 for the pull toward the parent.
          const bound = 4 * Math.sqrt((truth * (1 - truth) / n) * (1 + 59 * 0.0066)) + 0.01;
          const learned = stationModel.routes[route].bookingRates[connecting ? 'connecting' : 'local'].Y;
          expect(Math.abs(learned - truth), `${station.iata}-${route} ${connecting ? 'connecting' : 'local'}`).toBeLessThanOrEqual(bound);
        }
      }
      // The flexible-fare factor is 0.93 by construction; thousands of bookings put it within a few points.
      expect(Math.abs(stationModel.profile.flexibleFareFactor - 0.93)).toBeLessThan(0.03);
      // A day shock was put in (rho about 0.0066): the estimate finds one of that order.
      expect(stationModel.shockRho ?? 0).toBeLessThan(0.03);
    }
  });

  it('learns a check-in curve close to the one the history was drawn from', () => {
    const curve = model.stations['1'].routes.ORD.checkInCurve;
    const at = (m: number) => curve.find(([x]) => x === m)![1];
    // The default curve has 0.3 at 720 and 0.87 at 60 minutes; 99 % of shows check in, so shares are close to those.
    expect(Math.abs(at(720) - 0.3)).toBeLessThan(0.05);
    expect(Math.abs(at(60) - 0.87)).toBeLessThan(0.05);
  });

  it('scores the held-out flights for the learned rates and the hand-set profile', () => {
    const calibration = evaluateModel(heldOut, model, () => DEFAULT_SHOW_UP_PROFILE);
    const station = calibration.find((c) => c.stationId === 1 && c.route === null)!;
    const passengers = heldOut.filter((f) => f.stationId === 1).flatMap((f) => f.outcomes);
    expect(station.passengers).toBe(passengers.length);
    expect(station.bins.reduce((s, b) => s + b.count, 0)).toBe(passengers.length);
    expect(station.backtest.learned.flights).toBe(heldOut.filter((f) => f.stationId === 1).length);
    const shows = heldOut.filter((f) => f.stationId === 1).map((f) => f.outcomes.filter((o) => SHOWED_OUTCOMES.has(o.outcome)).length);
    const seats = heldOut.filter((f) => f.stationId === 1).map((f) => Object.values(f.seatsByCabin).reduce((a, b) => a + b, 0));
    expect(station.backtest.learned.actualDenied).toBe(shows.reduce((s, x, i) => s + Math.max(0, x - seats[i]), 0));
    for (const c of calibration) {
      expect(c.learned.brier).toBeGreaterThan(0);
      expect(c.learned.brier).toBeLessThan(0.25);
    }
    // Two exact forecasts for each of about 75 flights: a few seconds on a busy machine.
  }, 60_000);
});
