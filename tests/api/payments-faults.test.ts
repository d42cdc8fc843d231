// Fault injection: a thousand issuances while 30 % of the provider calls fail in every way the stand-in offers
// (500 before and after the work, timeouts, dropped connections), webhooks come twice and out of order, and the
// server dies mid-run and a new one takes over on the same database. At the end the ledger and the provider agree
// exactly, each compensation has one cardholder and one card, and reconciliation finds no difference. A second run
// restarts the stand-in too, from its data directory.
// Outside sources: Stripe docs "Idempotent requests" (a retry with the same key returns the first result, so a
// request may be retried safely after a network error or a 500) and "Receive webhook events" (at-least-once
// delivery, no ordering guarantee); stripe-node 23.1 retries network errors and 5xx with backoff (maxNetworkRetries).
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ApiFaultSpec } from '../../payments-fake/src/faults/apiFaults';
import type { DataSource } from 'typeorm';
import { CompensationEntity, type FlightEntity, type StationEntity, type UserEntity } from '../../server/src/db/entities';
import { Client } from './harness';
import { insertUser, removeRunUsers, TEST_PASSWORD } from './helpers';
import {
  insertCompensations, paymentsTestStation, removeFlights, seedFlight, startFake, startPaymentsApp, until, WEBHOOK_SECRET, webhooksSettled,
  type PaymentsApp, type RunningFake,
} from './payments-harness';

const ISSUANCES = 1_000;
/** Six independent rules of p each fire on 1 - (1 - p)^6 of the calls: 0.058 gives 30 % (derived). */
const P_EACH = 0.058;
const FAULT_BUDGET = 100_000;
const FAULTS: ApiFaultSpec[] = [
  { kind: 'error500', phase: 'before' },
  { kind: 'error500', phase: 'after' },
  { kind: 'timeout', phase: 'after', holdMs: 900 },
  { kind: 'timeout', phase: 'before', holdMs: 900 },
  { kind: 'drop', phase: 'before' },
  { kind: 'drop', phase: 'after' },
].map((f, i) => ({ ...f, kind: f.kind as ApiFaultSpec['kind'], phase: f.phase as ApiFaultSpec['phase'], probability: P_EACH, seed: 1_000 + i, count: FAULT_BUDGET }));
// The crashed instance's claims are free again after 10 s: longer than an attempt's calls with their retries here.
const APP_OPTIONS = { worker: { pollMs: 50, retryAfterMs: 300, concurrency: 32 }, stripeTimeoutMs: 600, claimLeaseSeconds: 10 };

let setupDb: PaymentsApp;
let station: StationEntity;
/** The second run gets a station of its own, so each reconciliation sees only its own provider's cards. */
let restartStation: StationEntity;
let financeUser: UserEntity;
let agentUser: UserEntity;
const flightIds: number[] = [];

beforeAll(async () => {
  // A short-lived instance only to reach the database for set-up and checks; it talks to no provider.
  setupDb = await startPaymentsApp({ stripeApiUrl: 'http://127.0.0.1:9', startWorker: false });
  station = await paymentsTestStation(setupDb.db, 'PWM');
  restartStation = await paymentsTestStation(setupDb.db, 'AUG');
  // Rows an earlier, interrupted run of this suite may have left on its own test stations.
  const stale: { id: number }[] = await setupDb.db.query('SELECT id FROM flights WHERE station_id IN (?)', [[station.id, restartStation.id]]);
  await removeFlights(setupDb.db, stale.map((f) => f.id));
  agentUser = await insertUser(setupDb.db, { label: 'faults-agent', role: 'agent', stationIds: [station.id, restartStation.id] });
  financeUser = await insertUser(setupDb.db, { label: 'faults-finance', role: 'finance', stationIds: [station.id, restartStation.id] });
});

afterAll(async () => {
  await removeFlights(setupDb.db, flightIds);
  for (const s of [station, restartStation]) await setupDb.db.query(`DELETE FROM reconciliation_runs WHERE JSON_CONTAINS(station_ids, ?)`, [String(s.id)]);
  await removeRunUsers(setupDb.db);
  await setupDb.close();
});

async function signIn(app: PaymentsApp, user: UserEntity): Promise<Client> {
  const c = new Client(app.app);
  const res = await c.signIn(user.email, TEST_PASSWORD);
  if (res.status !== 200) throw new Error(`sign-in as ${user.email} failed: ${res.status}`);
  return c;
}

async function clientsOf(app: PaymentsApp): Promise<{ agent: Client; finance: Client }> {
  return { agent: await signIn(app, agentUser), finance: await signIn(app, financeUser) };
}

/** Agents press "issue" on many rows at once; a request cut off by the crash is simply not answered. */
async function issueAll(agent: Client, ids: number[], lanes: number, stopAfter?: { count: number; then: () => Promise<void> }) {
  const queue = [...ids];
  let done = 0;
  let tripped = false;
  const lane = async () => {
    for (let id = queue.shift(); id !== undefined; id = queue.shift()) {
      if (tripped) return;
      await agent.post(`/api/compensations/${id}/issue`).then(() => undefined, () => undefined);
      done += 1;
      if (stopAfter && !tripped && done >= stopAfter.count) {
        tripped = true;
        await stopAfter.then();
      }
    }
  };
  await Promise.all(Array.from({ length: lanes }, lane));
}

async function states(db: DataSource, flight: FlightEntity): Promise<Record<string, number>> {
  const rows: { state: string; n: string }[] = await db.query('SELECT state, COUNT(*) AS n FROM compensations WHERE flight_id = ? GROUP BY state', [flight.id]);
  return Object.fromEntries(rows.map((r) => [r.state, Number(r.n)]));
}

/** Everything the two sides must agree on, checked row by row against the stand-in's own records. */
async function expectLedgerMatchesProvider(db: DataSource, fake: RunningFake, flight: FlightEntity, count: number) {
  const rows = await db.getRepository(CompensationEntity).findBy({ flightId: flight.id });
  expect(rows).toHaveLength(count);
  const ours = new Set(rows.map((r) => String(r.id)));
  const cards = [...fake.fake.store.state.cards.values()].filter((c) => ours.has(c.metadata.compensationId));
  const holders = [...fake.fake.store.state.cardholders.values()].filter((h) => ours.has(h.metadata.compensationId));
  // Issued once: exactly one card and one cardholder per compensation id at the provider.
  expect(cards).toHaveLength(count);
  expect(new Set(cards.map((c) => c.metadata.compensationId)).size).toBe(count);
  expect(holders).toHaveLength(count);
  const cardOf = new Map(cards.map((c) => [c.metadata.compensationId, c]));
  for (const row of rows) {
    const card = cardOf.get(String(row.id))!;
    expect(row.providerCardId, `compensation ${row.id}`).toBe(card.id);
    expect(row.providerCardholderId).toBe(card.cardholder);
    expect(card.spending_limits[0].amount).toBe(row.amountMinor);
    expect(card.currency.toUpperCase()).toBe(row.currency);
    const spent = [...fake.fake.store.state.transactions.values()].some((t) => t.card === card.id);
    const expected = card.status === 'canceled' ? 'voided' : spent ? 'settled' : 'issued';
    expect(row.state, `compensation ${row.id}`).toBe(expected);
  }
  const [{ receipts }] = await db.query('SELECT COUNT(*) AS receipts FROM outbox_messages WHERE flight_id = ? AND kind = ?', [flight.id, 'compensation-receipt']);
  expect(Number(receipts)).toBe(count);
}

async function reconcileClean(finance: Client, stationId: number) {
  const started = await finance.post('/api/finance/reconciliations', { stationId }).expect(202);
  let detail: { run: { status: string; differences: number; cardsSeen: number; pagesRead: number }; differences: unknown[] } | undefined;
  await until('the reconciliation run', async () => {
    detail = (await finance.get(`/api/finance/reconciliations/${started.body.run.id}`).expect(200)).body;
    return detail!.run.status !== 'running';
  }, 60_000, 200);
  expect(detail!.run.status).toBe('completed');
  expect(detail!.differences).toEqual([]);
  return detail!.run;
}

function firedFaults(fake: RunningFake): number {
  return fake.fake.faults.api.list().reduce((sum, rule) => sum + (FAULT_BUDGET - (rule.remaining ?? FAULT_BUDGET)), 0);
}

describe('a thousand issuances under provider faults, duplicated and reordered webhooks, and a server crash', () => {
  let fake: RunningFake;
  let flight: FlightEntity;

  beforeAll(async () => {
    fake = await startFake({ webhookRetry: { maxAttempts: 15, baseDelayMs: 50, maxDelayMs: 1_000, requestTimeoutMs: 5_000 } });
    const seeded = await seedFlight(setupDb.db, station, { passengers: ISSUANCES });
    flight = seeded.flight;
    flightIds.push(flight.id);
    await insertCompensations(setupDb.db, flight, seeded.passengers, (i) => (i % 3 === 0 ? { voluntary: false, sourceKind: 'denial', band: 'us-200pct', ruleRef: '14 CFR 250.5(a)(2)' } : {}));
  });

  afterAll(async () => {
    await fake.stop();
  });

  it('ends with ledger and provider in exact agreement, each compensation issued once', async () => {
    let appA: PaymentsApp | null = await startPaymentsApp({ stripeApiUrl: fake.url, ...APP_OPTIONS });
    const port = appA.port;
    fake.fake.webhooks.setEndpoint({ url: appA.webhookUrl, secret: WEBHOOK_SECRET });
    for (const rule of FAULTS) fake.fake.faults.api.add(rule);
    fake.fake.faults.webhooks.add({ kind: 'duplicate', probability: 0.15, seed: 7, count: FAULT_BUDGET });
    fake.fake.faults.webhooks.add({ kind: 'delay', probability: 0.05, seed: 8, delayMs: 150, count: FAULT_BUDGET });
    const reorderer = setInterval(() => fake.fake.faults.webhooks.add({ kind: 'reorder', count: 6, maxHoldMs: 400 }), 700);

    const ids = (await setupDb.db.getRepository(CompensationEntity).find({ where: { flightId: flight.id }, order: { id: 'ASC' } })).map((r) => r.id);
    const a = await clientsOf(appA);
    let appB: PaymentsApp | null = null;
    try {
      // Halfway through, the server dies with requests and provider calls in flight.
      await issueAll(a.agent, ids, 24, {
        count: ISSUANCES / 2,
        then: async () => {
          await appA!.crash();
          appA = null;
        },
      });
      const midway = await states(setupDb.db, flight);
      expect(midway.due ?? 0).toBeGreaterThan(0);
      // Calls were in flight when it died: those rows wait in 'issuing' for the next server's sweep.
      expect(midway.issuing ?? 0).toBeGreaterThan(0);

      // A new instance on the same port and database: its worker takes up every row left 'issuing' (the crashed
      // instance's claims once their lease ends).
      appB = await startPaymentsApp({ stripeApiUrl: fake.url, port, ...APP_OPTIONS });
      const b = await clientsOf(appB);
      const stillDue = (await setupDb.db.getRepository(CompensationEntity).findBy({ flightId: flight.id, state: 'due' })).map((r) => r.id);
      await issueAll(b.agent, stillDue, 24);
      await until('every compensation issued', async () => {
        const s = await states(setupDb.db, flight);
        return (s.issued ?? 0) === ISSUANCES;
      }, 180_000, 250);
      const fired = firedFaults(fake);
      console.info(`[payments-faults] ${fired} provider calls failed on purpose; ${midway.issuing} issuances were cut off by the crash`);
      // Roughly 30 % of at least two calls per issuance (derived: 0.3 × 2,000 = 600; the bound leaves room for chance).
      expect(fired).toBeGreaterThan(400);

      // The faults stop; passengers spend some cards and finance voids others while webhooks are still disturbed.
      fake.fake.faults.api.clear();
      const cards = [...fake.fake.store.state.cards.values()].filter((c) => ids.includes(Number(c.metadata.compensationId)));
      for (const card of cards.slice(0, 100)) fake.fake.settle(card.id, { amount: 1_000 });
      const toVoid = cards.slice(100, 120).map((c) => Number(c.metadata.compensationId));
      for (const id of toVoid) await b.finance.post(`/api/compensations/${id}/void`, { reason: 'Fault suite: issued in error' }).expect(200);
      clearInterval(reorderer);
      await until('the webhooks to drain', () => webhooksSettled(fake.fake), 120_000, 200);
      const end = await states(setupDb.db, flight);
      expect(end).toEqual({ issued: ISSUANCES - 120, settled: 100, voided: 20 });

      const deliveries = fake.fake.webhooks.deliveries();
      expect(deliveries.filter((d) => d.status === 'failed')).toEqual([]);
      // Duplicates were sent, yet every event was stored once.
      expect(deliveries.filter((d) => d.duplicate).length).toBeGreaterThan(0);
      const eventIds = [...new Set(deliveries.map((d) => d.eventId))];
      const [{ stored }] = await setupDb.db.query('SELECT COUNT(*) AS stored FROM provider_events WHERE event_id IN (?)', [eventIds]);
      expect(Number(stored)).toBe(eventIds.length);

      await expectLedgerMatchesProvider(setupDb.db, fake, flight, ISSUANCES);
      const run = await reconcileClean(b.finance, station.id);
      // The provider's list was read page by page (limit 100, starting_after, has_more).
      expect(run.cardsSeen).toBeGreaterThanOrEqual(ISSUANCES);
      expect(run.pagesRead).toBeGreaterThanOrEqual(ISSUANCES / 100);
    } finally {
      clearInterval(reorderer);
      await (appA as PaymentsApp | null)?.close();
      await (appB as PaymentsApp | null)?.close();
    }
  }, 420_000);
});

describe('a restart of both the server and the stand-in, from the stand-in’s data directory', () => {
  const COUNT = 60;
  let dataDir: string;
  let flight: FlightEntity;

  beforeAll(async () => {
    dataDir = mkdtempSync(path.join(os.tmpdir(), 'bumpboard-payments-faults-'));
    const seeded = await seedFlight(setupDb.db, restartStation, { passengers: COUNT });
    flight = seeded.flight;
    flightIds.push(flight.id);
    await insertCompensations(setupDb.db, flight, seeded.passengers);
  });

  afterAll(() => {
    rmSync(dataDir, { recursive: true, force: true });
  });

  it('loses nothing and issues nothing twice', async () => {
    const retry = { webhookRetry: { maxAttempts: 15, baseDelayMs: 50, maxDelayMs: 1_000, requestTimeoutMs: 5_000 } };
    let fake: RunningFake | null = await startFake({ dataDir, ...retry });
    let app: PaymentsApp | null = await startPaymentsApp({ stripeApiUrl: fake.url, ...APP_OPTIONS });
    const appPort = app.port;
    const fakePort = fake.port;
    fake.fake.webhooks.setEndpoint({ url: app.webhookUrl, secret: WEBHOOK_SECRET });
    for (const rule of FAULTS) fake.fake.faults.api.add(rule);
    fake.fake.faults.webhooks.add({ kind: 'duplicate', probability: 0.2, seed: 11, count: FAULT_BUDGET });
    const ids = (await setupDb.db.getRepository(CompensationEntity).findBy({ flightId: flight.id })).map((r) => r.id);
    try {
      const first = await clientsOf(app);
      await issueAll(first.agent, ids, 8, {
        count: COUNT / 2,
        then: async () => {
          await app!.crash();
          await fake!.stop();
          app = null;
          fake = null;
        },
      });
      // The stand-in comes back from its state file (fault rules live in memory only, so they are set again).
      fake = await startFake({ dataDir, ...retry }, fakePort);
      for (const rule of FAULTS) fake.fake.faults.api.add(rule);
      app = await startPaymentsApp({ stripeApiUrl: fake.url, port: appPort, ...APP_OPTIONS });
      const second = await clientsOf(app);
      const stillDue = (await setupDb.db.getRepository(CompensationEntity).findBy({ flightId: flight.id, state: 'due' })).map((r) => r.id);
      await issueAll(second.agent, stillDue, 8);
      await until('every compensation issued', async () => ((await states(setupDb.db, flight)).issued ?? 0) === COUNT, 120_000, 250);
      fake.fake.faults.api.clear();
      await until('the webhooks to drain', () => webhooksSettled(fake!.fake), 60_000, 200);
      await expectLedgerMatchesProvider(setupDb.db, fake, flight, COUNT);
      await reconcileClean(second.finance, restartStation.id);
    } finally {
      await (app as PaymentsApp | null)?.close();
      await (fake as RunningFake | null)?.stop();
    }
  }, 300_000);
});
