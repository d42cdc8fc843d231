// socket.io shares the sign-in session: a handshake without a signed-in user is refused, and a user joins only the
// rooms of flights at their own stations. Each watch request checks the user as stored now, not as they were when
// the socket opened, and a change of stations or role makes open sockets leave what the user may no longer watch.
import type { Server as HttpServer } from 'node:http';
import type { RequestHandler } from 'express';
import passport from 'passport';
import { Server, type Socket } from 'socket.io';
import type { DataSource } from 'typeorm';
import { SOCKET_EVENTS, flightDeskRoom, flightRoom, stationRoom, type ClientToServerEvents, type ServerToClientEvents } from '@shared/events';
import { DENIAL_DESK_ROLES, type Role } from '@shared/schemas/common';
import { FlightEntity } from '../db/entities';
import { canSeeStation } from '../domain/station-scope';
import { loadActiveSessionUser } from '../modules/auth/session-user';

const worksDenials = (role: Role) => (DENIAL_DESK_ROLES as readonly Role[]).includes(role);

interface SocketData {
  userId: number;
  /** The station behind each flight room joined, so a change of stations knows which flight rooms to leave. */
  flightStations: Record<number, number>;
}
/** Between server processes (through the Redis adapter): a flight moved, with its new version when the forecast's. */
export interface InterServerEvents {
  'flight:moved': (flightId: number, version: number | null) => void;
}
/** Servers whose adapter reaches other processes (the Redis adapter); the in-memory one refuses server-side emits. */
export const sharedServers = new WeakSet<AppIo>();

type AppSocket = Socket<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;
export type AppIo = Server<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;

const userRoom = (userId: number) => `user:${userId}`;

function onlyForHandshake(middleware: RequestHandler) {
  return (req: { _query?: Record<string, string> } & Parameters<RequestHandler>[0], res: Parameters<RequestHandler>[1], next: (err?: unknown) => void) => {
    const isHandshake = req._query?.sid === undefined;
    if (isHandshake) middleware(req, res, next);
    else next();
  };
}

export function createSocketServer(http: HttpServer, deps: { db: DataSource; sessionMiddleware: RequestHandler }): AppIo {
  const io: AppIo = new Server(http, { serveClient: false, cors: { origin: false } });
  io.engine.use(onlyForHandshake(deps.sessionMiddleware));
  io.engine.use(onlyForHandshake(passport.session()));
  io.use((socket, next) => {
    const user = (socket.request as unknown as { user?: Express.User }).user;
    if (!user) return next(new Error('not_signed_in'));
    socket.data.userId = user.id;
    socket.data.flightStations = {};
    next();
  });

  io.on('connection', (socket: AppSocket) => {
    const userId = socket.data.userId;
    socket.join(userRoom(userId));
    // The user as stored now: a station taken away a moment ago is refused, and a deactivated user is let go.
    const currentUser = async () => {
      const user = await loadActiveSessionUser(deps.db, userId);
      if (!user) socket.disconnect(true);
      return user;
    };
    socket.on(SOCKET_EVENTS.watchStation, async (stationId, ack) => {
      const user = await currentUser();
      const ok = Boolean(user && typeof stationId === 'number' && canSeeStation(user, stationId));
      if (ok) socket.join(stationRoom(stationId));
      ack?.({ ok });
    });
    socket.on(SOCKET_EVENTS.watchFlight, async (flightId, ack) => {
      const user = await currentUser();
      const flight = user && typeof flightId === 'number' ? await deps.db.getRepository(FlightEntity).findOneBy({ id: flightId }) : null;
      const ok = Boolean(user && flight && canSeeStation(user, flight.stationId));
      if (ok && user && flight) {
        socket.data.flightStations[flight.id] = flight.stationId;
        socket.join(flightRoom(flight.id));
        if (worksDenials(user.role)) socket.join(flightDeskRoom(flight.id));
      }
      ack?.({ ok });
    });
    socket.on(SOCKET_EVENTS.unwatchFlight, (flightId) => {
      socket.leave(flightRoom(flightId));
      socket.leave(flightDeskRoom(flightId));
    });
  });
  return io;
}

export function disconnectUserSockets(io: AppIo, userId: number) {
  io.in(userRoom(userId)).disconnectSockets(true);
}

/**
 * After a user's stations or role changed: every open socket of theirs leaves the station and flight rooms the
 * stored user may no longer watch, at once; a user no longer active is disconnected.
 */
export async function refreshUserSockets(io: AppIo, db: DataSource, userId: number): Promise<void> {
  const user = await loadActiveSessionUser(db, userId);
  if (!user) return disconnectUserSockets(io, userId);
  for (const socket of await io.in(userRoom(userId)).fetchSockets()) {
    for (const room of socket.rooms) {
      const station = /^station:(\d+)$/.exec(room);
      const flight = /^flight:(\d+)(:desk)?$/.exec(room);
      const stationId = station ? Number(station[1]) : flight ? socket.data.flightStations?.[Number(flight[1])] : undefined;
      // A flight room whose station is unknown is left too: better a console that asks again than one that overhears.
      if ((station || flight) && (stationId === undefined || !canSeeStation(user, stationId))) socket.leave(room);
      else if (flight?.[2] && !worksDenials(user.role)) socket.leave(room);
    }
  }
}
