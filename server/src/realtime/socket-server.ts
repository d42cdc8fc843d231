// socket.io shares the sign-in session: a handshake without a signed-in user is refused, and a user joins only the
// rooms of flights at their own stations.
import type { Server as HttpServer } from 'node:http';
import type { RequestHandler } from 'express';
import passport from 'passport';
import { Server, type Socket } from 'socket.io';
import type { DataSource } from 'typeorm';
import { SOCKET_EVENTS, flightRoom, stationRoom, type ClientToServerEvents, type ServerToClientEvents } from '@shared/events';
import { FlightEntity } from '../db/entities';
import { canSeeStation } from '../http/require-role';

type AppSocket = Socket<ClientToServerEvents, ServerToClientEvents>;
export type AppIo = Server<ClientToServerEvents, ServerToClientEvents>;

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
    socket.data.user = user;
    next();
  });

  io.on('connection', (socket: AppSocket) => {
    const user = socket.data.user as Express.User;
    socket.join(`user:${user.id}`);
    socket.on(SOCKET_EVENTS.watchStation, (stationId, ack) => {
      const ok = typeof stationId === 'number' && canSeeStation(user, stationId);
      if (ok) socket.join(stationRoom(stationId));
      ack?.({ ok });
    });
    socket.on(SOCKET_EVENTS.watchFlight, async (flightId, ack) => {
      const flight = typeof flightId === 'number' ? await deps.db.getRepository(FlightEntity).findOneBy({ id: flightId }) : null;
      const ok = Boolean(flight && canSeeStation(user, flight.stationId));
      if (ok) socket.join(flightRoom(flightId));
      ack?.({ ok });
    });
    socket.on(SOCKET_EVENTS.unwatchFlight, (flightId) => {
      socket.leave(flightRoom(flightId));
    });
  });
  return io;
}

export function disconnectUserSockets(io: AppIo, userId: number) {
  io.in(`user:${userId}`).disconnectSockets(true);
}
