// The consoles of the bench: a few signed-in sessions shared by many socket.io clients, each watching one flight as
// the flight desk does. Every client reports each "flight changed" message with the moment it arrived.
import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '@shared/events';

export type ConsoleSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

const SESSION_COOKIE = 'bumpboard.sid';
const CONNECT_TIMEOUT_MS = 10_000;
/** Connections opened at once: each handshake loads the session from the database. */
const CONNECT_BATCH = 20;

function sessionCookie(res: Response): string | null {
  for (const header of res.headers.getSetCookie()) {
    const pair = header.split(';')[0];
    if (pair.startsWith(`${SESSION_COOKIE}=`)) return pair;
  }
  return null;
}

/** Signs in over HTTP as the browser does (CSRF token first) and returns the session cookie. */
export async function signIn(appUrl: string, email: string, password: string): Promise<string> {
  const first = await fetch(`${appUrl}/api/auth/session`);
  if (!first.ok) throw new Error(`GET /api/auth/session answered ${first.status}`);
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  // Whatever the first answer sets (the CSRF token's binding; no session is stored before sign-in) goes back with it.
  const anonymous = first.headers.getSetCookie().map((h) => h.split(';')[0]).join('; ');
  const res = await fetch(`${appUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken, Cookie: anonymous },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email} answered ${res.status}: ${(await res.text()).slice(0, 200)}`);
  const cookie = sessionCookie(res);
  if (!cookie) throw new Error(`sign-in as ${email} set no session cookie`);
  return cookie;
}

export interface ConsoleOptions {
  appUrl: string;
  cookies: string[];
  flightIds: number[];
  clients: number;
  onChanged: (client: number, flightId: number, receivedAt: number) => void;
}

export interface Consoles {
  sockets: ConsoleSocket[];
  /** Clients that lost their connection after joining: their missed messages would show as lost updates. */
  disconnects(): number;
  closeAll(): void;
}

async function openOne(opts: ConsoleOptions, index: number, onDisconnect: () => void): Promise<ConsoleSocket> {
  const flightId = opts.flightIds[index % opts.flightIds.length];
  // No reconnection: a dropped client must show up in the figures, not quietly rejoin and miss messages.
  const socket: ConsoleSocket = io(opts.appUrl, {
    transports: ['websocket'],
    extraHeaders: { cookie: opts.cookies[index % opts.cookies.length] },
    forceNew: true,
    reconnection: false,
    timeout: CONNECT_TIMEOUT_MS,
  });
  try {
    await new Promise<void>((resolve, reject) => {
      socket.once('connect', () => resolve());
      socket.once('connect_error', (err) => reject(new Error(`socket client ${index} could not connect: ${err.message}`)));
    });
    const { ok } = await socket.timeout(CONNECT_TIMEOUT_MS).emitWithAck('flight:watch', flightId);
    if (!ok) throw new Error(`socket client ${index} was refused the room of flight ${flightId}`);
  } catch (err) {
    socket.disconnect();
    throw err;
  }
  socket.on('flight:changed', (p) => opts.onChanged(index, p.id, Date.now()));
  socket.on('disconnect', (reason) => {
    if (reason !== 'io client disconnect') onDisconnect();
  });
  return socket;
}

/** Opens every client (a batch at a time) and joins each to its flight's room; client i watches flight i mod n. */
export async function openConsoles(opts: ConsoleOptions): Promise<Consoles> {
  const sockets: ConsoleSocket[] = [];
  let dropped = 0;
  const closeAll = () => sockets.forEach((s) => s.disconnect());
  try {
    for (let start = 0; start < opts.clients; start += CONNECT_BATCH) {
      const batch = Array.from({ length: Math.min(CONNECT_BATCH, opts.clients - start) }, (_, k) => openOne(opts, start + k, () => dropped++));
      const settled = await Promise.allSettled(batch);
      for (const s of settled) if (s.status === 'fulfilled') sockets.push(s.value);
      const failed = settled.find((s) => s.status === 'rejected');
      if (failed) throw failed.reason;
    }
  } catch (err) {
    closeAll();
    throw err;
  }
  return { sockets, disconnects: () => dropped, closeAll };
}
