// A load balancer on loopback for the tests that run several app processes, built on http-proxy: sticky sessions by
// a cookie of its own (a client stays on the process that holds its socket.io session), the websocket upgrade routed
// the same way, and a process that refuses connections taken out of the rotation, its clients moved to a live one.
// It stands in for what nginx or a cloud balancer does in front of Bumpboard; nothing of it runs in production.
import { createServer, type IncomingMessage, type Server } from 'node:http';
import type { Duplex } from 'node:stream';
import httpProxy from 'http-proxy';

export const NODE_COOKIE = 'bb_node';
/** Which process answered, for the tests' own checks. */
export const NODE_HEADER = 'x-balancer-node';

export interface Balancer {
  url: string;
  /** Requests each process was sent (HTTP and websocket upgrades). */
  sent: number[];
  /** Processes taken out of the rotation after they refused a connection. */
  down: Set<number>;
  close(): Promise<void>;
}

interface Routed extends IncomingMessage {
  node?: number;
  /** The client had no cookie, or one for a process that is down: it gets one for this process. */
  newPin?: boolean;
}

function pinnedNode(req: IncomingMessage): number | null {
  const match = (req.headers.cookie ?? '').match(new RegExp(`(?:^|;\\s*)${NODE_COOKIE}=(\\d+)`));
  return match ? Number(match[1]) : null;
}

export async function startBalancer(targets: string[], port = 0): Promise<Balancer> {
  const proxy = httpProxy.createProxyServer({ xfwd: true, ws: true });
  const sent = targets.map(() => 0);
  const down = new Set<number>();
  let next = 0;

  function route(req: Routed): number | null {
    const pinned = pinnedNode(req);
    if (pinned !== null && pinned < targets.length && !down.has(pinned)) {
      req.node = pinned;
      return pinned;
    }
    // Round robin over the live processes for a new client, or one whose process went away.
    for (let i = 0; i < targets.length; i++) {
      const candidate = (next + i) % targets.length;
      if (down.has(candidate)) continue;
      next = candidate + 1;
      req.node = candidate;
      req.newPin = true;
      return candidate;
    }
    return null;
  }

  proxy.on('proxyRes', (proxyRes, req: Routed) => {
    proxyRes.headers[NODE_HEADER] = String(req.node);
    if (!req.newPin) return;
    const pin = `${NODE_COOKIE}=${req.node}; Path=/; HttpOnly; SameSite=Lax`;
    const existing = proxyRes.headers['set-cookie'] ?? [];
    proxyRes.headers['set-cookie'] = [...existing, pin];
  });

  // A process that refuses or drops the connection: out of the rotation; the client gets a 502 and retries, and its
  // next request goes to a live process (which a real balancer's health checks would also bring back later).
  proxy.on('error', (error: NodeJS.ErrnoException, req: Routed, res) => {
    if (req.node !== undefined && ['ECONNREFUSED', 'ECONNRESET', 'EPIPE'].includes(error.code ?? '')) down.add(req.node);
    if ('writeHead' in res) {
      if (!res.headersSent) res.writeHead(502, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ error: 'upstream_unavailable', message: 'The balancer could not reach an app process; please try again.' }));
    } else {
      (res as Duplex).destroy();
    }
  });

  const server: Server = createServer((req: Routed, res) => {
    const node = route(req);
    if (node === null) {
      res.writeHead(503, { 'content-type': 'application/json' }).end(JSON.stringify({ error: 'no_upstream', message: 'No app process is up.' }));
      return;
    }
    sent[node] += 1;
    proxy.web(req, res, { target: targets[node] });
  });
  server.on('upgrade', (req: Routed, socket: Duplex, head: Buffer) => {
    const node = route(req);
    if (node === null) return socket.destroy();
    sent[node] += 1;
    proxy.ws(req, socket, head, { target: targets[node] });
  });
  const sockets = new Set<Duplex>();
  server.on('connection', (s) => {
    sockets.add(s);
    s.once('close', () => sockets.delete(s));
  });
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  const address = server.address() as { port: number };
  return {
    url: `http://127.0.0.1:${address.port}`,
    sent,
    down,
    async close() {
      for (const s of sockets) s.destroy();
      await new Promise((resolve) => server.close(resolve));
      proxy.close();
    },
  };
}
