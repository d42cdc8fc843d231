// socket.io event names and payloads. Sockets only say *what* changed ({ id }); clients refetch through the API.
export const SOCKET_EVENTS = {
  watchStation: 'station:watch',
  watchFlight: 'flight:watch',
  unwatchFlight: 'flight:unwatch',
  flightChanged: 'flight:changed',
  stationChanged: 'station:changed',
} as const;

export const flightRoom = (flightId: number) => `flight:${flightId}`;
export const stationRoom = (stationId: number) => `station:${stationId}`;

export interface ChangedPayload {
  id: number;
  /** What moved, so a client can refetch only that: counts, forecast, rounds, denials… */
  topics?: string[];
}

export interface ServerToClientEvents {
  'flight:changed': (p: ChangedPayload) => void;
  'station:changed': (p: ChangedPayload) => void;
}

export interface ClientToServerEvents {
  'station:watch': (stationId: number, ack?: (r: { ok: boolean }) => void) => void;
  'flight:watch': (flightId: number, ack?: (r: { ok: boolean }) => void) => void;
  'flight:unwatch': (flightId: number) => void;
}
