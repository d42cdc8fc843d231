// The demo scenario: an invented carrier at three real airports under three regimes. Schedules are local wall-clock
// times relative to the moment the demo is loaded, so
// there is always a morning in progress: a few flights gone, one boarding, one heading for an oversale.
import type { RegimeCode } from '@shared/schemas/common';

export const DEMO_CARRIER = { code: 'ZZ', name: 'Larkfield Air (demo carrier)' } as const;
export const DEMO_PASSWORD = 'bumpboard-demo-2026';

export interface DemoStation {
  iata: string;
  name: string;
  timeZone: string;
  regime: RegimeCode;
  currency: string;
  fareRange: [number, number]; // economy one-way fares in major units
}

export interface DemoFlight {
  number: string;
  destination: string;
  /** Minutes from the moment the demo is loaded. */
  departsIn: number;
  blockMinutes: number;
  aircraft: string;
  seats: Record<string, number>;
  /** Bookings as a share of seats: above 1 is an oversold flight. */
  loadFactor: number;
  gate: string;
}

export const DEMO_STATIONS: (DemoStation & { flights: DemoFlight[] })[] = [
  {
    iata: 'BOS', name: 'Boston Logan International', timeZone: 'America/New_York', regime: 'us-dot', currency: 'USD', fareRange: [89, 420],
    flights: [
      { number: '101', destination: 'ORD', departsIn: -170, blockMinutes: 165, aircraft: '320', seats: { J: 12, Y: 138 }, loadFactor: 0.97, gate: 'B12' },
      { number: '103', destination: 'ORD', departsIn: -35, blockMinutes: 165, aircraft: '320', seats: { J: 12, Y: 138 }, loadFactor: 0.93, gate: 'B12' },
      { number: '221', destination: 'DCA', departsIn: 20, blockMinutes: 95, aircraft: 'E75', seats: { J: 12, Y: 64 }, loadFactor: 0.92, gate: 'B4' },
      { number: '105', destination: 'ORD', departsIn: 100, blockMinutes: 165, aircraft: '320', seats: { J: 12, Y: 138 }, loadFactor: 1.12, gate: 'B14' },
      { number: '223', destination: 'DCA', departsIn: 160, blockMinutes: 95, aircraft: 'E75', seats: { J: 12, Y: 64 }, loadFactor: 0.81, gate: 'B4' },
      { number: '611', destination: 'LIS', departsIn: 280, blockMinutes: 400, aircraft: '21N', seats: { J: 16, Y: 180 }, loadFactor: 1.04, gate: 'E7' },
      { number: '107', destination: 'ORD', departsIn: 420, blockMinutes: 165, aircraft: '320', seats: { J: 12, Y: 138 }, loadFactor: 0.93, gate: 'B12' },
    ],
  },
  {
    iata: 'FCO', name: 'Rome Fiumicino', timeZone: 'Europe/Rome', regime: 'eu-261', currency: 'EUR', fareRange: [49, 310],
    flights: [
      { number: '401', destination: 'HAM', departsIn: -120, blockMinutes: 140, aircraft: '320', seats: { J: 8, Y: 162 }, loadFactor: 0.95, gate: 'B22' },
      { number: '411', destination: 'BRU', departsIn: -20, blockMinutes: 130, aircraft: '319', seats: { Y: 144 }, loadFactor: 0.9, gate: 'B25' },
      { number: '403', destination: 'HAM', departsIn: 100, blockMinutes: 140, aircraft: '320', seats: { J: 8, Y: 162 }, loadFactor: 1.12, gate: 'B22' },
      { number: '421', destination: 'LIS', departsIn: 190, blockMinutes: 175, aircraft: '320', seats: { J: 8, Y: 162 }, loadFactor: 0.86, gate: 'C3' },
      { number: '405', destination: 'HAM', departsIn: 330, blockMinutes: 140, aircraft: '320', seats: { J: 8, Y: 162 }, loadFactor: 0.84, gate: 'B20' },
      { number: '413', destination: 'BRU', departsIn: 480, blockMinutes: 130, aircraft: '319', seats: { Y: 144 }, loadFactor: 0.91, gate: 'B25' },
    ],
  },
  {
    iata: 'YUL', name: 'Montréal–Trudeau', timeZone: 'America/Toronto', regime: 'ca-appr', currency: 'CAD', fareRange: [119, 520],
    flights: [
      { number: '801', destination: 'YYZ', departsIn: -140, blockMinutes: 80, aircraft: '223', seats: { J: 12, Y: 125 }, loadFactor: 0.94, gate: 'A51' },
      { number: '803', destination: 'YYZ', departsIn: -10, blockMinutes: 80, aircraft: '223', seats: { J: 12, Y: 125 }, loadFactor: 0.89, gate: 'A51' },
      { number: '851', destination: 'YVR', departsIn: 100, blockMinutes: 330, aircraft: '7M8', seats: { J: 16, Y: 153 }, loadFactor: 1.12, gate: 'A49' },
      { number: '805', destination: 'YYZ', departsIn: 210, blockMinutes: 80, aircraft: '223', seats: { J: 12, Y: 125 }, loadFactor: 0.9, gate: 'A53' },
      { number: '853', destination: 'YVR', departsIn: 390, blockMinutes: 330, aircraft: '7M8', seats: { J: 16, Y: 153 }, loadFactor: 0.87, gate: 'A49' },
    ],
  },
];

export const DEMO_USERS = [
  { email: 'agent@bumpboard.test', displayName: 'Alex Gatewood (demo agent)', role: 'agent' },
  { email: 'supervisor@bumpboard.test', displayName: 'Sam Okafor (demo supervisor)', role: 'supervisor' },
  { email: 'finance@bumpboard.test', displayName: 'Fran Lindqvist (demo finance)', role: 'finance' },
  { email: 'admin@bumpboard.test', displayName: 'Ada Marchetti (demo admin)', role: 'admin' },
] as const;
