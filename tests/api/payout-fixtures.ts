// Shared by the passenger payment-link tests: the payments stand-in, an app wired to it with a clock the test
// steps, the mail catcher fed by a real outbox worker, and every log line the server writes, so a test can grep
// all of it for a card or account number.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { vi } from 'vitest';
import { createMailFake, type MailFake } from '../../mail-fake/src/app';
import { createMailTransport, type MailTransport } from '../../server/src/integrations/mail/mail-transport';
import { createOutboxWorker, type OutboxWorker } from '../../server/src/modules/outbox/outbox-worker';
import { signedIn, type Client } from './harness';
import { DEMO } from './helpers';
import { insertCompensations, paymentsTestStation, removeFlights, seedFlight, startFake, startPaymentsApp, WEBHOOK_SECRET, type PaymentsApp, type RunningFake } from './payments-harness';
import { StationEntity, type CompensationEntity } from '../../server/src/db/entities';

export interface LinkWorld {
  fake: RunningFake;
  app: PaymentsApp;
  agent: Client;
  mail: MailFake;
  clock: { ms: number };
  /** Every line the server logged: the runtime's log and anything printed to the console. */
  logs: string[];
  flightIds: number[];
  /** Delivers every queued mail of this world's flights to the catcher and waits until it is there. */
  deliverMail(): Promise<void>;
  /** Everything the catcher holds, as one text (headers, text and HTML bodies). */
  mailText(): string;
  close(): Promise<void>;
}

export async function startLinkWorld(opts: { webhooks?: boolean; station?: string } = {}): Promise<LinkWorld> {
  const logs: string[] = [];
  for (const method of ['log', 'info', 'warn', 'error', 'debug'] as const) {
    const original = console[method].bind(console);
    vi.spyOn(console, method).mockImplementation((...args: unknown[]) => {
      logs.push(args.map(String).join(' '));
      original(...args);
    });
  }
  const clock = { ms: Date.now() };
  const fake = await startFake({ webhookRetry: { maxAttempts: 6, baseDelayMs: 50, maxDelayMs: 500 } });
  const app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false, log: (line) => logs.push(line), now: () => clock.ms });
  if (opts.webhooks) fake.fake.webhooks.setEndpoint({ url: app.webhookUrl, secret: WEBHOOK_SECRET });
  const dataDir = mkdtempSync(path.join(os.tmpdir(), 'bumpboard-links-mail-'));
  const mail = createMailFake({ dataDir });
  const ports = await mail.listen({ smtpPort: 0, httpPort: 0 });
  const transport: MailTransport = createMailTransport({ SMTP_HOST: '127.0.0.1', SMTP_PORT: ports.smtpPort, SMTP_SECURE: false, MAIL_FROM: 'Bumpboard <notices@bumpboard.test>' });
  const agent = await signedIn({ app: app.app } as Parameters<typeof signedIn>[0], DEMO.agent);
  const flightIds: number[] = [];
  let worker: OutboxWorker | null = null;
  return {
    fake, app, agent, mail, clock, logs, flightIds,
    async deliverMail() {
      await worker?.stop();
      worker = createOutboxWorker(app.db, transport, { pollMs: 50, onlyFlightIds: [...flightIds], log: (line) => logs.push(line) });
      worker.start();
      await vi.waitFor(async () => {
        const [left]: { n: number | string }[] = await app.db.query("SELECT COUNT(*) AS n FROM outbox_messages WHERE flight_id IN (?) AND status <> 'sent'", [flightIds]);
        if (Number(left.n) > 0) throw new Error('mail still queued');
      }, { timeout: 20_000, interval: 100 });
    },
    mailText() {
      return JSON.stringify(mail.inbox.list()) + readFileSync(path.join(dataDir, 'messages.jsonl'), 'utf8');
    },
    async close() {
      await worker?.stop();
      transport.close();
      await removeFlights(app.db, flightIds);
      await app.close();
      await fake.stop();
      await mail.close();
      rmSync(dataDir, { recursive: true, force: true });
      vi.restoreAllMocks();
    },
  };
}

/** Compensations 'due' on a new flight of a BOS-like station the demo agent works at. */
export async function dueAt(world: LinkWorld, n: number, over: (i: number) => Partial<CompensationEntity> = () => ({})) {
  const station = await world.app.db.getRepository(StationEntity).findOneByOrFail({ iata: 'BOS' });
  const { flight, passengers } = await seedFlight(world.app.db, station, { passengers: n });
  world.flightIds.push(flight.id);
  const rows = await insertCompensations(world.app.db, flight, passengers, over);
  const bookings: { id: number; pnr: string }[] = await world.app.db.query('SELECT id, pnr FROM bookings WHERE flight_id = ?', [flight.id]);
  const proofOf = (i: number) => ({ pnr: bookings.find((b) => b.id === passengers[i].bookingId)!.pnr, lastName: passengers[i].lastName });
  return { flight, rows, proofOf };
}

export { paymentsTestStation };

/** The passenger's public API, as their phone calls it: JSON body, no cookie. */
export async function publicPost(world: LinkWorld, path: string, body: object): Promise<{ status: number; body: Record<string, unknown> }> {
  const res = await fetch(`${world.app.baseUrl}/api/public/payments${path}`, { method: 'POST', headers: { 'content-type': 'application/json', accept: 'application/json' }, body: JSON.stringify(body) });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

/** The token from the last link of this kind in the queued mail of a compensation. */
export async function linkToken(world: LinkWorld, compensationId: number, page: 'card' | 'payout'): Promise<string> {
  const rows: { text: string }[] = await world.app.db.query('SELECT text FROM outbox_messages WHERE flight_id IN (?) ORDER BY created_at DESC', [world.flightIds]);
  const pattern = new RegExp(`/${page}/([\\w-]{20,100})`);
  for (const row of rows) {
    if (!row.text.includes(`C-${compensationId}`)) continue;
    const match = pattern.exec(row.text);
    if (match) return match[1];
  }
  throw new Error(`no ${page} link mailed for compensation ${compensationId}`);
}
