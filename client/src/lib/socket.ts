// The one socket.io connection of the app. Sockets only say *what* changed; screens react by invalidating their
// queries and refetching through the API, so the data on screen always comes from one place.
import { useEffect, useEffectEvent, useSyncExternalStore } from 'react';
import { io, type Socket } from 'socket.io-client';
import { SOCKET_EVENTS, type ChangedPayload, type ClientToServerEvents, type ServerToClientEvents } from '@shared/events';

type AppSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

/** idle: nothing watched; connecting: first attempt; live; lost: dropped and retrying; restored: back, shown briefly. */
export type LiveState = 'idle' | 'connecting' | 'live' | 'lost' | 'restored';
export type RoomKind = 'flight' | 'station';

export interface LiveSnapshot {
  state: LiveState;
  /** When the last change notice arrived (epoch ms), or null. */
  lastNoticeAt: number | null;
  /** Per room ("flight:12"): true once the server let us in, false if it refused, null while asking. */
  rooms: Readonly<Record<string, boolean | null>>;
}

interface RoomListener {
  onChanged: (p: ChangedPayload) => void;
  onResync: () => void;
}

interface Room {
  kind: RoomKind;
  id: number;
  listeners: Set<RoomListener>;
}

const RESTORED_FOR_MS = 4_000;
/** A server-side refusal (signed out, kicked) is not retried by socket.io itself; we retry while a screen watches. */
const MANUAL_RETRY_MS = 5_000;
/** Leaving one live screen for another should not drop and rebuild the connection. */
const IDLE_DISCONNECT_MS = 5_000;

const rooms = new Map<string, Room>();
const subscribers = new Set<() => void>();
let snapshot: LiveSnapshot = { state: 'idle', lastNoticeAt: null, rooms: {} };
let socket: AppSocket | null = null;
let everConnected = false;
let restoredTimer: ReturnType<typeof setTimeout> | undefined;
let retryTimer: ReturnType<typeof setTimeout> | undefined;
let idleTimer: ReturnType<typeof setTimeout> | undefined;

const roomKey = (kind: RoomKind, id: number) => `${kind}:${id}`;

function update(patch: Partial<LiveSnapshot>) {
  snapshot = { ...snapshot, ...patch };
  subscribers.forEach((s) => s());
}

function setRoomStatus(key: string, ok: boolean | null) {
  const next = { ...snapshot.rooms };
  if (rooms.has(key)) next[key] = ok;
  else delete next[key];
  update({ rooms: next });
}

function join(s: AppSocket, key: string, room: Room) {
  setRoomStatus(key, null);
  const ack = (r: { ok: boolean }) => setRoomStatus(key, Boolean(r?.ok));
  if (room.kind === 'flight') s.emit(SOCKET_EVENTS.watchFlight, room.id, ack);
  else s.emit(SOCKET_EVENTS.watchStation, room.id, ack);
}

function scheduleManualRetry() {
  clearTimeout(retryTimer);
  retryTimer = setTimeout(() => {
    if (socket && rooms.size > 0 && !socket.connected && !socket.active) socket.connect();
  }, MANUAL_RETRY_MS);
}

function dispatch(kind: RoomKind, p: ChangedPayload) {
  update({ lastNoticeAt: Date.now() });
  rooms.get(roomKey(kind, p.id))?.listeners.forEach((l) => l.onChanged(p));
}

function ensureSocket(): AppSocket {
  if (socket) return socket;
  // Same origin, so the session cookie goes with the handshake and authenticates it.
  const s: AppSocket = io({ path: '/socket.io', withCredentials: true, autoConnect: false });
  s.on('connect', () => {
    const wasBack = everConnected;
    everConnected = true;
    clearTimeout(retryTimer);
    rooms.forEach((room, key) => join(s, key, room));
    if (wasBack) {
      update({ state: 'restored' });
      // Anything may have changed while we were away: every watching screen refetches all it shows.
      rooms.forEach((room) => room.listeners.forEach((l) => l.onResync()));
      clearTimeout(restoredTimer);
      restoredTimer = setTimeout(() => snapshot.state === 'restored' && update({ state: 'live' }), RESTORED_FOR_MS);
    } else {
      update({ state: 'live' });
    }
  });
  s.on('disconnect', (reason) => {
    if (reason === 'io client disconnect') {
      update({ state: 'idle' });
      return;
    }
    update({ state: 'lost' });
    if (reason === 'io server disconnect') scheduleManualRetry();
  });
  s.on('connect_error', () => {
    update({ state: 'lost' });
    if (!s.active) scheduleManualRetry();
  });
  s.on(SOCKET_EVENTS.flightChanged, (p) => dispatch('flight', p));
  s.on(SOCKET_EVENTS.stationChanged, (p) => dispatch('station', p));
  socket = s;
  return s;
}

function watch(kind: RoomKind, id: number, listener: RoomListener): () => void {
  const key = roomKey(kind, id);
  const s = ensureSocket();
  clearTimeout(idleTimer);
  let room = rooms.get(key);
  if (!room) {
    room = { kind, id, listeners: new Set() };
    rooms.set(key, room);
    if (s.connected) join(s, key, room);
    else setRoomStatus(key, null);
  }
  room.listeners.add(listener);
  if (!s.connected && !s.active) {
    if (snapshot.state === 'idle') update({ state: everConnected ? 'lost' : 'connecting' });
    s.connect();
  }
  return () => {
    const r = rooms.get(key);
    if (!r) return;
    r.listeners.delete(listener);
    if (r.listeners.size > 0) return;
    rooms.delete(key);
    setRoomStatus(key, null);
    if (kind === 'flight' && s.connected) s.emit(SOCKET_EVENTS.unwatchFlight, id);
    if (rooms.size === 0) {
      clearTimeout(idleTimer);
      idleTimer = setTimeout(() => {
        if (rooms.size > 0) return;
        clearTimeout(retryTimer);
        everConnected = false;
        s.disconnect();
        update({ state: 'idle' });
      }, IDLE_DISCONNECT_MS);
    }
  };
}

function subscribe(listener: () => void) {
  subscribers.add(listener);
  return () => {
    subscribers.delete(listener);
  };
}

/** The state of the live connection, for an indicator. */
export function useLiveSnapshot(): LiveSnapshot {
  return useSyncExternalStore(subscribe, () => snapshot);
}

/**
 * Watches a flight or a station while the calling screen is mounted. `onChanged` runs for each change notice of
 * that room; `onResync` after a reconnect, when the screen should refetch everything it shows. Returns whether the
 * server let us into the room (null while asking or while offline).
 */
export function useLiveRoom(kind: RoomKind, id: number | null, handlers: RoomListener): boolean | null {
  const onChanged = useEffectEvent((p: ChangedPayload) => handlers.onChanged(p));
  const onResync = useEffectEvent(() => handlers.onResync());
  useEffect(() => {
    if (id === null) return;
    return watch(kind, id, { onChanged: (p) => onChanged(p), onResync: () => onResync() });
  }, [kind, id]);
  const live = useLiveSnapshot();
  return id === null ? null : (live.rooms[roomKey(kind, id)] ?? null);
}

/** The words, icon and tone of a live indicator, so every live screen says the same thing the same way. */
export function describeLive(state: LiveState, joined: boolean | null): { tone: 'calm' | 'watch' | 'alert'; icon: string; text: string } {
  if (state === 'lost') return { tone: 'alert', icon: '⚠', text: 'Connection lost — reconnecting…' };
  if (state === 'restored') return { tone: 'calm', icon: '✓', text: 'Live again' };
  if (state === 'live' && joined === false) return { tone: 'watch', icon: '◆', text: 'Live updates refused for this screen — refresh to see changes' };
  if (state === 'live') return { tone: 'calm', icon: '●', text: 'Live' };
  return { tone: 'watch', icon: '…', text: 'Connecting…' };
}
