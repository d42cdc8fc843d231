// The one place the server tells consoles that something changed. Its only caller is the domain event dispatcher
// (app-effects.ts), so it runs only after the change has committed. A
// forecast's notice carries the flight's new version and what changed with it, so consoles patch instead of refetching.
import { ALERT_TOPIC, flightDeskRoom, flightRoom, stationRoom, type ChangedPayload } from '@shared/events';
import { sharedServers, type AppIo } from './socket-server';

export type NoticeData = Omit<ChangedPayload, 'id' | 'topics'>;

export interface Publisher {
  /** `deskData` goes only to the consoles that work the flight's denied boarding (the ranking). */
  flightChanged(flightId: number, stationId: number, topics?: string[], data?: NoticeData, deskData?: Pick<ChangedPayload, 'ranking'>): void;
  /** Something of the station's own moved (its alerts), with no flight's notice to carry it. */
  stationChanged?(stationId: number, topics: string[]): void;
}

export const silentPublisher: Publisher = { flightChanged: () => undefined };

/**
 * The flight topics whose changes may raise or close an alert: a volunteer's offer, an amount for a supervisor, a
 * denial proposal, a payment. The station's consoles then fetch their alerts again; a check-in does not make them.
 */
const TOPICS_THAT_MOVE_ALERTS = new Set(['rounds', 'approvals', 'denials', 'compensations']);

export const stationTopicsFor = (flightTopics: string[] | undefined) =>
  flightTopics?.some((t) => TOPICS_THAT_MOVE_ALERTS.has(t)) ? ['departures', ALERT_TOPIC] : ['departures'];

export function socketPublisher(getIo: () => AppIo | undefined): Publisher {
  return {
    flightChanged(flightId, stationId, topics, data, deskData) {
      const io = getIo();
      if (!io) return;
      const notice = { id: flightId, topics, ...data };
      if (deskData) {
        io.to(flightDeskRoom(flightId)).emit('flight:changed', { ...notice, ...deskData });
        io.to(flightRoom(flightId)).except(flightDeskRoom(flightId)).emit('flight:changed', notice);
      } else io.to(flightRoom(flightId)).emit('flight:changed', notice);
      io.to(stationRoom(stationId)).emit('station:changed', { id: stationId, topics: stationTopicsFor(topics) });
      // The other server processes drop what they hold of this flight from an older state (see peers.ts).
      if (sharedServers.has(io)) io.serverSideEmit('flight:moved', flightId, data?.version ?? null);
    },
    stationChanged(stationId, topics) {
      getIo()?.to(stationRoom(stationId)).emit('station:changed', { id: stationId, topics });
    },
  };
}
