import { describe, expect, it } from 'vitest';
import { DEFAULT_SHOW_UP_PROFILE } from '@shared/schemas/show-up-profile';
import { SHOWED_OUTCOMES } from '@shared/schemas/learning';
import { generateHistory } from '../../demo/history';
import { DEMO_STATIONS } from '../../demo/scenario';
import { passengerShowProbability } from '../forecast/show-probability';
import { learnModel, type TrainingFlight } from './train';

const NOW = new Date('2026-12-03T12:00:00Z');
const IATA = DEMO_STATIONS.map((s) => s.iata);
const HOUR = 3_600_000;

function flightsOf(seed: number): TrainingFlight[] {
  return generateHistory(NOW, seed).map((f, id) => ({
    id, stationId: IATA.indexOf(f.station) + 1, destination: f.destination, scheduledDeparture: f.scheduledDeparture, seatsByCabin: f.seatsByCabin,
    outcomes: f.outcomes.map((o) => ({ ...o, checkedInT3: o.checkedInAt !== null && o.checkedInAt.getTime() <= f.scheduledDeparture.getTime() - 3 * HOUR })),
  }));
}

/**
 * A missed connection is already a "did not show" in the history the rates are learned from, so a learned rate holds
 * the usual share of missed connections. The forecast may then move a connecting passenger's chance only by what the
 * inbound's news says beyond the usual, never take the usual share off a second time.
 */
describe('the chance of making the connection, counted once', () => {
  const model = learnModel(flightsOf(1511), () => DEFAULT_SHOW_UP_PROFILE);
  // A second history from the same process, not trained on: the forecast's mean must match what happened.
  const checked = [2718, 2719, 2720, 2721].flatMap(flightsOf);

  it.each([[true, 'connecting'], [false, 'local']])('predicts the share of %s passengers (%s) who showed, on average, within the sampling error', (connecting) => {
    let predicted = 0;
    let showed = 0;
    let n = 0;
    for (const f of checked) {
      const profile = model.stations[String(f.stationId)].routes[f.destination];
      const now = new Date(f.scheduledDeparture.getTime() - 3 * HOUR);
      f.outcomes.forEach((o, i) => {
        if (o.connecting !== connecting) return;
        const state = {
          id: i + 1, bookingId: i + 1, cabin: o.cabin, fareType: o.fareClass, status: o.checkedInT3 ? 'checked-in' as const : 'booked' as const,
          checkedInAt: o.checkedInT3 ? o.checkedInAt : null, channel: o.channel,
          // The inbound is on time: no news beyond the usual.
          inboundFlight: connecting ? 'ZZ340' : null, inboundEstimatedArrival: connecting ? new Date(f.scheduledDeparture.getTime() - 2 * HOUR) : null,
        };
        predicted += passengerShowProbability(state, profile, f.scheduledDeparture, now).probability;
        showed += SHOWED_OUTCOMES.has(o.outcome) ? 1 : 0;
        n += 1;
      });
    }
    const observed = showed / n;
    // 4 binomial standard errors of the observed share, doubled for the day shock and the learning error of the
    // rates (both of the same order here; our own allowance). Counting the connection twice takes off about 3 %.
    const bound = 8 * Math.sqrt((observed * (1 - observed)) / n);
    expect(bound).toBeLessThan(0.02);
    expect(Math.abs(predicted / n - observed)).toBeLessThanOrEqual(bound);
  }, 60_000);
});
