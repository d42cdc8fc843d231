// The one place the server tells consoles that something changed. Called only after the change has committed;
// payloads are small ({ id }) and clients refetch through the API.
import { flightRoom, stationRoom } from '@shared/events';
import type { AppIo } from './socket-server';

export interface Publisher {
  flightChanged(flightId: number, stationId: number, topics?: string[]): void;
}

export const silentPublisher: Publisher = { flightChanged: () => undefined };

export function socketPublisher(getIo: () => AppIo | undefined): Publisher {
  return {
    flightChanged(flightId, stationId, topics) {
      const io = getIo();
      if (!io) return;
      io.to(flightRoom(flightId)).emit('flight:changed', { id: flightId, topics });
      io.to(stationRoom(stationId)).emit('station:changed', { id: stationId, topics: ['departures'] });
    },
  };
}
