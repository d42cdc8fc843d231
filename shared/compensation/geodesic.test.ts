import { describe, expect, it } from 'vitest';
import { bandEdgeWarning, greatCircleKm } from './geodesic';

// Coordinates as in OpenFlights data/airports.dat (rows 1555 FCO, 342 HAM, 302 BRU).
const FCO = { lat: 41.8002778, lon: 12.2388889 };
const HAM = { lat: 53.630401611328, lon: 9.9882297515869 };
const BRU = { lat: 50.9014015198, lon: 4.48443984985 };

describe('greatCircleKm (WGS84 geodesic)', () => {
  it.each([
    ['Rome Fiumicino - Hamburg', FCO, HAM, 1326],
    ['Rome Fiumicino - Brussels', FCO, BRU, 1173],
    ['Brussels - Hamburg', BRU, HAM, 483],
  ])('%s rounds to %d km (CJEU C-559/16 Bossen)', (_route, from, to, km) => {
    expect(Math.round(greatCircleKm(from, to))).toBe(km);
  });

  it('Flinders Peak - Buninyong is 54.972271 km (Geoscience Australia worked example, from memory)', () => {
    const dms = (degrees: number, minutes: number, seconds: number) => Math.sign(degrees) * (Math.abs(degrees) + minutes / 60 + seconds / 3600);
    const flindersPeak = { lat: dms(-37, 57, 3.7203), lon: dms(144, 25, 29.5244) };
    const buninyong = { lat: dms(-37, 39, 10.1561), lon: dms(143, 55, 35.3839) };
    expect(greatCircleKm(flindersPeak, buninyong)).toBeCloseTo(54.972271, 5);
  });

  it('is symmetric and zero for the same point', () => {
    expect(greatCircleKm(FCO, HAM)).toBeCloseTo(greatCircleKm(HAM, FCO), 9);
    expect(greatCircleKm(FCO, FCO)).toBe(0);
  });

  it('refuses coordinates out of range, naming the field', () => {
    expect(() => greatCircleKm({ lat: 91, lon: 0 }, HAM)).toThrow(/^from\.lat:/);
    expect(() => greatCircleKm(FCO, { lat: 0, lon: Number.NaN })).toThrow(/^to\.lon:/);
  });
});

describe('bandEdgeWarning', () => {
  it.each([
    [1494.9, null],
    [1495, 1500],
    [1500, 1500],
    [1505, 1500],
    [1505.1, null],
    [3496, 3500],
    [3505, 3500],
    [1326, null],
  ])('%d km -> edge %s (common practice: 5 km review margin)', (km, edge) => {
    const warning = bandEdgeWarning(km);
    expect(warning?.edgeKm ?? null).toBe(edge);
  });

  it('refuses a negative distance', () => {
    expect(() => bandEdgeWarning(-1)).toThrow(/^distanceKm:/);
  });
});
