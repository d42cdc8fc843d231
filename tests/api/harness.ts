// Runs the real app in-process on the test MariaDB (DATABASE_URL from `npm test`), with a supertest agent per user.
import 'reflect-metadata';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { loadEnv } from '../../server/src/config/env';
import { createDataSource } from '../../server/src/db/data-source';
import { createApp } from '../../server/src/app';
import { createSessionSetup } from '../../server/src/http/session';
import { createSignInThrottle, type SignInThrottle } from '../../server/src/modules/auth/throttle';
import { createForecastScheduler, type ForecastScheduler } from '../../server/src/modules/forecast/forecast-scheduler';
import { createSocketServer, disconnectUserSockets, refreshUserSockets, type AppIo } from '../../server/src/realtime/socket-server';
import { socketPublisher, type Publisher } from '../../server/src/realtime/publisher';

export const DEMO_PASSWORD = 'bumpboard-demo-2026';

export interface TestApp {
  app: ReturnType<typeof createApp>;
  db: DataSource;
  http: Server;
  baseUrl: string;
  /** The socket server, when asked for: wired like the real one to sign-out, deactivation and access changes. */
  io?: AppIo;
  /** The app's forecast scheduler: `await t.forecast.flush()` waits for the recomputes a change queued. */
  forecast: ForecastScheduler;
  close(): Promise<void>;
}

export interface TestAppOptions {
  throttle?: SignInThrottle;
  /** Environment overrides, e.g. TRUST_PROXY or NODE_ENV. */
  env?: Record<string, string>;
  sockets?: boolean;
  /** With sockets: consoles hear change notices as from the real server (silent otherwise, as most tests want). */
  live?: boolean;
  /** Hears every notice the app sends, instead of the sockets (tests that count notices). */
  publisher?: Publisher;
}

export async function startTestApp(opts: TestAppOptions = {}): Promise<TestApp> {
  // The API tests stand for clients at many addresses behind one loopback proxy, unless a test says otherwise.
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', TRUST_PROXY: 'loopback', SESSION_SECRET: process.env.SESSION_SECRET ?? 'test-secret-test-secret-test-secret-42', STATIC_DIR: 'no-static-in-api-tests', ...opts.env });
  const db = createDataSource(env.DATABASE_URL);
  await db.initialize();
  const session = createSessionSetup(env);
  const ioRef: { io?: AppIo } = {};
  const forecast = createForecastScheduler(db, () => undefined);
  const app = createApp({
    env,
    db,
    session,
    forecast,
    throttle: opts.throttle ?? createSignInThrottle({ perAccount: 1000, perAddress: 10_000 }),
    demo: true,
    ...(opts.live ? { publisher: socketPublisher(() => ioRef.io) } : {}),
    ...(opts.publisher ? { publisher: opts.publisher } : {}),
    disconnectUser: (id) => ioRef.io && disconnectUserSockets(ioRef.io, id),
    userAccessChanged: (id) => void (ioRef.io && refreshUserSockets(ioRef.io, db, id)),
  });
  const http = createServer(app);
  if (opts.sockets) ioRef.io = createSocketServer(http, { db, sessionMiddleware: session.middleware });
  await new Promise<void>((r) => http.listen(0, '127.0.0.1', r));
  const baseUrl = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
  return {
    app,
    db,
    http,
    baseUrl,
    io: ioRef.io,
    forecast,
    async close() {
      await forecast.flush();
      forecast.stop();
      if (ioRef.io) await ioRef.io.close();
      await new Promise((r) => http.close(r));
      await session.close();
      await db.destroy();
    },
  };
}

/** A browser-like client: keeps its cookie and sends the CSRF token on every change. */
export class Client {
  readonly agent: ReturnType<typeof request.agent>;
  csrf = '';
  /** An app in this process, or the base URL of a server running in another. */
  constructor(app: TestApp['app'] | string) {
    this.agent = request.agent(app);
  }
  async refreshCsrf() {
    const res = await this.agent.get('/api/auth/session').expect(200);
    this.csrf = res.body.csrfToken;
    return res.body;
  }
  async signIn(email: string, password = DEMO_PASSWORD) {
    await this.refreshCsrf();
    const res = await this.agent.post('/api/auth/sign-in').set('X-CSRF-Token', this.csrf).send({ email, password });
    if (res.status === 200) this.csrf = res.body.csrfToken;
    return res;
  }
  get(path: string) {
    return this.agent.get(path);
  }
  post(path: string, body: unknown = {}) {
    return this.agent.post(path).set('X-CSRF-Token', this.csrf).send(body as object);
  }
  patch(path: string, body: unknown = {}) {
    return this.agent.patch(path).set('X-CSRF-Token', this.csrf).send(body as object);
  }
  put(path: string, body: unknown = {}) {
    return this.agent.put(path).set('X-CSRF-Token', this.csrf).send(body as object);
  }
  delete(path: string) {
    return this.agent.delete(path).set('X-CSRF-Token', this.csrf);
  }
}

export async function signedIn(app: TestApp, email: string) {
  const c = new Client(app.app);
  const res = await c.signIn(email);
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return c;
}

/** A multipart upload of one file, with the client's cookie and CSRF token, as a browser's form would send it. */
export function upload(c: Client, path: string, file: { field?: string; name: string; content: string | Buffer; type?: string }) {
  const content = typeof file.content === 'string' ? Buffer.from(file.content, 'utf8') : file.content;
  return c.agent
    .post(path)
    .set('X-CSRF-Token', c.csrf)
    .attach(file.field ?? 'file', content, { filename: file.name, contentType: file.type ?? 'text/csv' });
}
