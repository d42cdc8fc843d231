// The one place the server tells consoles that something changed. Called only after the change has committed. A
// forecast's notice carries the flight's new version and what changed with it, so consoles patch instead of refetching.
import { flightRoom, stationRoom, type ChangedPayload } from '@shared/events';
import { sharedServers, type AppIo } from './socket-server';

export type NoticeData = Omit<ChangedPayload, 'id' | 'topics'>;

export interface Publisher {
  flightChanged(flightId: number, stationId: number, topics?: string[], data?: NoticeData): void;
}

export const silentPublisher: Publisher = { flightChanged: () => undefined };

export function socketPublisher(getIo: () => AppIo | undefined): Publisher {
  return {
    flightChanged(flightId, stationId, topics, data) {
      const io = getIo();
      if (!io) return;
      io.to(flightRoom(flightId)).emit('flight:changed', { id: flightId, topics, ...data });
      io.to(stationRoom(stationId)).emit('station:changed', { id: stationId, topics: ['departures'] });
      // The other server processes drop what they hold of this flight from an older state (see peers.ts).
      if (sharedServers.has(io)) io.serverSideEmit('flight:moved', flightId, data?.version ?? null);
    },
  };
}
