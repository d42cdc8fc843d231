import { QueryClient } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import { compactForecast, type ChangedPayload } from '@shared/events';
import type { FlightDesk, Forecast } from '@shared/schemas/flight-desk';
import { passenger } from '../model/test-passenger';
import { flightKeys } from './flight-desk';
import { applyFlightNotice, mergePassengers, stepFor } from './live-patch';

const forecast = (pOversale: number): Forecast => ({
  computedAt: '2026-12-03T08:00:00.000Z', capacity: 2, pmf: [0.25, 0.5, 0.25], pOversale, pFullOrOver: 0.25, expectedDenied: 0,
  mean: 1, sd: 0.7, median: 1, volunteerTarget: 0, riskTolerance: 0.05, shock: null,
});

const desk = (version: number, checkedIn: number): FlightDesk => ({
  version,
  flight: { id: 7, carrierCode: 'ZZ', flightNumber: '101', serviceDate: '2026-12-03', origin: 'AAA', destination: 'BBB', scheduledDeparture: '2026-12-03T10:00:00.000Z', scheduledArrival: '2026-12-03T12:00:00.000Z', gate: null, state: 'check-in-open', aircraftType: null, seatsByCabin: { Y: 2 } },
  station: { id: 1, iata: 'AAA', name: 'A', timeZone: 'UTC', regime: 'US', currency: 'USD' },
  cabins: [], totals: { seats: 2, booked: 2, checkedIn, boarded: 0 }, forecast: forecast(0),
});

function notice(version: number, over: Partial<ChangedPayload> = {}): ChangedPayload {
  const { station: _s, ...figures } = desk(version, 2);
  return { id: 7, version, desk: { ...figures, forecast: compactForecast(forecast(0.25)) }, passengers: [], events: [], point: null, ...over };
}

function seeded(version: number) {
  const qc = new QueryClient();
  qc.setQueryData(flightKeys.detail(7), desk(version, 1));
  qc.setQueryData(flightKeys.passengers(7), { version, passengers: [passenger({ id: 1, lastName: 'Adler' }), passenger({ id: 2, lastName: 'Zorn' })] });
  qc.setQueryData(flightKeys.events(7), { version, events: [{ id: 10 }] });
  qc.setQueryData(flightKeys.forecastHistory(7), { version, points: [] });
  return qc;
}

describe('stepFor', () => {
  it('patches the next version, refetches past a gap, ignores the old and the never fetched', () => {
    expect(stepFor(4, 5)).toBe('patch');
    expect(stepFor(4, 6)).toBe('refetch');
    expect(stepFor(4, 4)).toBe('skip');
    expect(stepFor(4, 3)).toBe('skip');
    expect(stepFor(undefined, 5)).toBe('skip');
  });
});

describe('applyFlightNotice', () => {
  it('patches every list of the desk to the next version without asking for anything', () => {
    const qc = seeded(4);
    const moved = passenger({ id: 2, lastName: 'Zorn', status: 'checked-in' });
    const point = { at: '2026-12-03T08:00:00.000Z', pOversale: 0.25, expectedDenied: 0, checkedIn: 2, booked: 2 };
    const refetch = applyFlightNotice(qc, 7, notice(5, { passengers: [moved], events: [{ id: 11, eventId: 'e', type: 't', occurredAt: '', receivedAt: '', status: 'applied', summary: '' }], point }));
    expect(refetch).toEqual([]);
    const d = qc.getQueryData<FlightDesk>(flightKeys.detail(7))!;
    expect(d.version).toBe(5);
    expect(d.totals.checkedIn).toBe(2);
    expect(d.station.iata).toBe('AAA');
    // The window travels; the desk holds the whole distribution again.
    expect(d.forecast?.pmf).toEqual([0.25, 0.5, 0.25]);
    expect(d.forecast?.pOversale).toBe(0.25);
    const list = qc.getQueryData<{ version: number; passengers: { id: number; status: string }[] }>(flightKeys.passengers(7))!;
    expect(list.version).toBe(5);
    expect(list.passengers.map((p) => [p.id, p.status])).toEqual([[1, 'booked'], [2, 'checked-in']]);
    expect(qc.getQueryData<{ events: { id: number }[] }>(flightKeys.events(7))!.events.map((e) => e.id)).toEqual([11, 10]);
    expect(qc.getQueryData<{ points: unknown[] }>(flightKeys.forecastHistory(7))!.points).toEqual([point]);
  });

  it('refetches every list after a missed version, and only the lists the server could not diff', () => {
    expect(applyFlightNotice(seeded(4), 7, notice(6))).toHaveLength(4);
    const qc = seeded(4);
    expect(applyFlightNotice(qc, 7, notice(5, { passengers: null }))).toEqual([[...flightKeys.passengers(7)]]);
    expect(qc.getQueryData<FlightDesk>(flightKeys.detail(7))!.version).toBe(5);
  });

  it('leaves the cache alone for an older notice and for notices without a version', () => {
    const qc = seeded(4);
    expect(applyFlightNotice(qc, 7, notice(4))).toEqual([]);
    expect(applyFlightNotice(qc, 7, { id: 7, topics: ['rounds'] })).toEqual([]);
    expect(qc.getQueryData<FlightDesk>(flightKeys.detail(7))!.totals.checkedIn).toBe(1);
  });
});

describe('mergePassengers', () => {
  it('replaces rows in place and files a new passenger under their name', () => {
    const held = [passenger({ id: 1, lastName: 'Adler' }), passenger({ id: 3, lastName: 'Zorn' })];
    const merged = mergePassengers(held, [passenger({ id: 3, lastName: 'Zorn', status: 'boarded' }), passenger({ id: 2, lastName: 'Meier' })]);
    expect(merged.map((p) => [p.id, p.status])).toEqual([[1, 'booked'], [2, 'booked'], [3, 'boarded']]);
  });
});
