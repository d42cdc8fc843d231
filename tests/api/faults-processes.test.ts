// Faults in the middle of the day's two consequential runs, a volunteer round and a payment run: the server killed
// with SIGKILL, MariaDB killed and restarted, the mail catcher and the payment stand-in failing. Afterwards nothing is
// lost, nothing is recorded, sent or paid twice, and what is still pending shows through the routes the screens read.
// Outside sources: MariaDB Knowledge Base, "InnoDB Recovery Modes" and innodb_flush_log_at_trx_commit (default 1: a
// committed transaction survives a crash, the redo log replays it), from memory; RFC 5322 section 3.6.4 (a message
// keeps its Message-ID however often it is sent); Stripe docs "Idempotent requests" (a retried key returns the first
// result).
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { In, type DataSource } from 'typeorm';
import { createMailFake, type MailFake } from '../../mail-fake/src/app';
import { CompensationEntity, OutboxMessageEntity, StationEntity, VolunteerEntity, type FlightEntity } from '../../server/src/db/entities';
import { createDataSource } from '../../server/src/db/data-source';
import { startFaultDatabase, startServerProcess, freePort, type FaultDatabase, type ServerProcess } from './faults-harness';
import { Client } from './harness';
import { insertUser, TEST_PASSWORD } from './helpers';
import { insertCompensations, seedFlight, startFake, WEBHOOK_SECRET, type RunningFake } from './payments-harness';
import { addSingles, makeFlight } from './volunteers-fixtures';

let db: FaultDatabase;
let ds: DataSource;
let mail: MailFake;
let mailDir: string;
let catcherUrl: string;
let provider: RunningFake;
let server: ServerProcess;
let serverEnv: Record<string, string>;
let station: StationEntity;
let agentEmail: string;

beforeAll(async () => {
  db = await startFaultDatabase();
  ds = createDataSource(db.url);
  await ds.initialize();
  station = await ds.getRepository(StationEntity).save({ iata: 'BGR', name: 'Bangor (fault test station)', timeZone: 'America/New_York', regime: 'us-dot', currency: 'USD' });
  agentEmail = (await insertUser(ds, { label: 'faults-agent', role: 'agent', stationIds: [station.id] })).email;
  mailDir = mkdtempSync(path.join(os.tmpdir(), 'bumpboard-faults-mail-'));
  mail = createMailFake({ dataDir: mailDir });
  const ports = await mail.listen({ smtpPort: 0, httpPort: 0 });
  catcherUrl = `http://127.0.0.1:${ports.httpPort}`;
  // The server keeps one port across restarts, so the provider's webhooks and the clients' cookies still reach it.
  const appPort = await freePort();
  provider = await startFake({ webhook: { url: `http://127.0.0.1:${appPort}/api/payments/webhook`, secret: WEBHOOK_SECRET } });
  serverEnv = {
    PORT: String(appPort), DATABASE_URL: db.url, SESSION_SECRET: 'fault-test-secret-fault-test-secret-42',
    SMTP_HOST: '127.0.0.1', SMTP_PORT: String(ports.smtpPort),
    STRIPE_API_URL: provider.url, STRIPE_SECRET_KEY: 'sk_test_bumpboard_fault_tests', STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    // Claims a killed server held are free again after this long (the default is two minutes).
    OUTBOX_LEASE_SECONDS: '5',
    PAYMENTS_LEASE_SECONDS: '5',
  };
  server = await startServerProcess(serverEnv);
}, 240_000);

afterAll(async () => {
  await server?.kill('SIGTERM');
  await provider?.stop();
  await mail?.close();
  if (mailDir) rmSync(mailDir, { recursive: true, force: true });
  await ds?.destroy();
  await db?.stop();
}, 60_000);

async function signedInRemote(email: string): Promise<Client> {
  const c = new Client(server.baseUrl);
  const res = await c.signIn(email, TEST_PASSWORD);
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return c;
}

type Answer = { status: number; body: { error?: string; message?: string; id?: number } } | null;

/** A request whose answer may never come (the server died under it): null then, as a browser sees a dropped request. */
async function attempt(send: () => PromiseLike<{ status: number; body: unknown }>): Promise<Answer> {
  try {
    const res = await send();
    return { status: res.status, body: res.body as NonNullable<Answer>['body'] };
  } catch {
    return null;
  }
}

/** What clients met during the current test's fault: answers lost with the server, and our 503s. */
const seen = { lost: 0, unavailable: 0 };

/** What a client may see while a fault lasts: an answer of ours, or none. Never a bare 500 or a library's text. */
function expectOurs(answer: Answer) {
  if (!answer) seen.lost += 1;
  if (!answer || answer.status < 500) return;
  seen.unavailable += 1;
  expect(answer.status, JSON.stringify(answer.body)).toBe(503);
  expect(answer.body.error).toBe('database_unavailable');
}

/** Runs `work` over `items`, `width` at a time. */
async function inParallel<T>(items: T[], width: number, work: (item: T) => Promise<void>) {
  const queue = [...items];
  await Promise.all(Array.from({ length: width }, async () => {
    for (let item = queue.shift(); item !== undefined; item = queue.shift()) await work(item);
  }));
}

beforeEach(() => {
  seen.lost = 0;
  seen.unavailable = 0;
});

afterEach((context) => {
  // The figures the README reports: how hard each fault hit the clients.
  console.log(`[faults] ${context.task.name}: ${seen.lost} answers lost, ${seen.unavailable} answered 503 database_unavailable`);
});

async function restartServer() {
  await server.kill('SIGKILL');
  server = await startServerProcess(serverEnv);
}

// ── The volunteer round ─────────────────────────────────────────────────────────────────────────────────────

const NEEDED = 6;
const PASSENGERS = 24;

async function roundOn(agent: Client): Promise<{ flight: FlightEntity; roundId: number; passengerIds: number[] }> {
  const flight = await makeFlight(ds, { stationId: station.id, origin: 'BGR', destination: 'BOS' });
  const singles = await addSingles(ds, flight, PASSENGERS, 'Fault');
  const res = await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: NEEDED });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { flight, roundId: res.body.id, passengerIds: singles.map((s) => s.passengers[0].id) };
}

/**
 * One passenger's way through the round as the desk does it: record the offer, then accept it. Returns true once
 * the passenger's case is settled (accepted, or refused because the round is full), false when an answer was lost.
 */
async function volunteerThenAccept(agent: Client, roundId: number, flightId: number, passengerId: number): Promise<boolean> {
  const offered = await attempt(() => agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [passengerId] }));
  expectOurs(offered);
  if (!offered || offered.status >= 500) return false;
  let volunteerId = offered.status === 201 ? offered.body.id : undefined;
  if (volunteerId === undefined) {
    // Already recorded by an attempt whose answer was lost: the desk finds it in the round, as the screen shows it.
    expect(offered.status, JSON.stringify(offered.body)).toBe(409);
    const rounds = await attempt(() => agent.get(`/api/flights/${flightId}/rounds`));
    if (!rounds || rounds.status !== 200) return false;
    const list = (rounds.body as unknown as { rounds: { id: number; volunteers: { id: number; passengerIds: number[]; status: string }[] }[] }).rounds;
    const mine = list.find((r) => r.id === roundId)?.volunteers.find((v) => v.passengerIds.includes(passengerId));
    if (!mine) return false;
    if (mine.status !== 'offered') return true;
    volunteerId = mine.id;
  }
  const accepted = await attempt(() => agent.post(`/api/rounds/${roundId}/volunteers/${volunteerId}/accept`));
  expectOurs(accepted);
  if (!accepted || accepted.status >= 500) return false;
  if (accepted.status === 200) return true;
  expect(['round_full', 'already_decided'], JSON.stringify(accepted.body)).toContain(accepted.body.error);
  return true;
}

/** Runs the round with `fault` struck after `after` settled passengers, then retries every case left open. */
async function roundThrough(fault: () => Promise<void>, after: number) {
  const agent = await signedInRemote(agentEmail);
  const { flight, roundId, passengerIds } = await roundOn(agent);
  const open = new Set(passengerIds);
  let settled = 0;
  let struck: Promise<void> | null = null;
  try {
    await inParallel(passengerIds, 4, async (id) => {
      if (await volunteerThenAccept(agent, roundId, flight.id, id)) open.delete(id);
      settled += 1;
      if (settled === after) struck = fault();
    });
  } finally {
    // Even when a check failed: a restart still under way would leave a server nobody stops.
    await struck;
  }
  // The desk retries what it has no answer for, with the same session: it outlived the fault.
  for (let pass = 0; pass < 5 && open.size; pass++) {
    for (const id of [...open]) if (await volunteerThenAccept(agent, roundId, flight.id, id)) open.delete(id);
  }
  expect([...open]).toEqual([]);
  return { flight, roundId, passengerIds };
}

async function expectRoundWhole(flightId: number, roundId: number, passengerIds: number[]) {
  const volunteers = await ds.getRepository(VolunteerEntity).findBy({ roundId });
  const offeredBy = volunteers.flatMap((v) => v.passengerIds);
  expect(new Set(offeredBy).size, 'one offer per passenger').toBe(offeredBy.length);
  expect(offeredBy.every((id) => passengerIds.includes(id))).toBe(true);
  const accepted = volunteers.filter((v) => v.status === 'accepted');
  expect(accepted).toHaveLength(NEEDED);
  const comps = await ds.getRepository(CompensationEntity).findBy({ flightId, sourceKind: 'volunteer' });
  expect(comps.map((c) => c.sourceId).sort()).toEqual(accepted.map((v) => v.id).sort());
  const notices = await ds.getRepository(OutboxMessageEntity).findBy({ flightId, kind: 'volunteer-confirmation' });
  expect(notices.map((n) => n.dedupeKey).sort()).toEqual(accepted.map((v) => `volunteer-confirmation:${v.id}`).sort());
  return notices;
}

/** Every notice delivered; the catcher holds each under one Message-ID (a resend after a crash keeps its id). */
async function expectDeliveredOnce(notices: OutboxMessageEntity[]) {
  await expect.poll(async () => (await ds.getRepository(OutboxMessageEntity).findBy({ id: In(notices.map((n) => n.id)) })).every((n) => n.status === 'sent'), { timeout: 60_000 }).toBe(true);
  const inbox = (await (await fetch(`${catcherUrl}/api/messages`)).json()) as { messages: { headers: Record<string, string> }[] };
  const ids = notices.map((n) => n.id);
  const delivered = inbox.messages.map((m) => m.headers['X-Bumpboard-Message-Id']).filter((id) => ids.includes(id));
  expect(new Set(delivered)).toEqual(new Set(ids));
}

describe('a volunteer round under faults', () => {
  it('the server killed with SIGKILL mid-round: every case settles once, one compensation and one notice each', async () => {
    const { flight, roundId, passengerIds } = await roundThrough(restartServer, 5);
    const notices = await expectRoundWhole(flight.id, roundId, passengerIds);
    await expectDeliveredOnce(notices);
  }, 240_000);

  it('MariaDB killed and restarted mid-round: answers say the database is unavailable, then the round completes once', async () => {
    const { flight, roundId, passengerIds } = await roundThrough(async () => {
      db.crash();
      await db.restart();
    }, 5);
    // The fault struck requests in flight (else this test proves nothing), and each got our answer.
    expect(seen.unavailable + seen.lost).toBeGreaterThan(0);
    const notices = await expectRoundWhole(flight.id, roundId, passengerIds);
    await expectDeliveredOnce(notices);
    // The server itself lived through it and answers again.
    expect(server.child.exitCode).toBeNull();
    expect((await fetch(`${server.baseUrl}/api/health`)).status).toBe(200);
  }, 240_000);

  it('the mail catcher down: confirmations wait as pending, the desk sees them pending, then each goes once', async () => {
    const down = await fetch(`${catcherUrl}/api/faults`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ mode: 'down', seconds: 600 }) });
    expect(down.status).toBeLessThan(300);
    const { flight, roundId, passengerIds } = await roundThrough(async () => undefined, -1);
    const notices = await expectRoundWhole(flight.id, roundId, passengerIds);
    const agent = await signedInRemote(agentEmail);
    await expect.poll(async () => {
      const list = (await agent.get(`/api/flights/${flight.id}/notices`)).body as { messages?: { status: string; attempts: number }[] };
      return (list.messages ?? []).filter((n) => n.status === 'pending' && n.attempts >= 1).length;
    }, { timeout: 60_000 }).toBe(NEEDED);
    expect((await fetch(`${catcherUrl}/api/faults`, { method: 'DELETE' })).status).toBeLessThan(300);
    await expectDeliveredOnce(notices);
  }, 240_000);
});

// ── The payment run ─────────────────────────────────────────────────────────────────────────────────────────

const PAYMENTS = 40;

async function paymentRun(fault: () => Promise<void>, after: number) {
  const { flight, passengers } = await seedFlight(ds, station, { passengers: PAYMENTS, destination: 'BOS' });
  const comps = await insertCompensations(ds, flight, passengers);
  const agent = await signedInRemote(agentEmail);
  let answered = 0;
  let struck: Promise<void> | null = null;
  try {
    await inParallel(comps, 4, async (c) => {
      expectOurs(await attempt(() => agent.post(`/api/compensations/${c.id}/issue`)));
      answered += 1;
      if (answered === after) struck = fault();
    });
  } finally {
    await struck;
  }
  // Whatever never reached 'issuing' is asked again; what did is the worker's to finish on its fixed keys.
  for (let pass = 0; pass < 5; pass++) {
    const due = await ds.getRepository(CompensationEntity).findBy({ id: In(comps.map((c) => c.id)), state: 'due' });
    if (!due.length) break;
    for (const c of due) expectOurs(await attempt(() => agent.post(`/api/compensations/${c.id}/issue`)));
  }
  return { flight, comps };
}

async function expectPaidOnce(comps: CompensationEntity[]) {
  const ids = comps.map((c) => c.id);
  await expect.poll(async () => (await ds.getRepository(CompensationEntity).findBy({ id: In(ids) })).filter((c) => c.state === 'issued').length, { timeout: 120_000 }).toBe(ids.length);
  const ours = new Set(ids.map(String));
  const cards = [...provider.fake.store.state.cards.values()].filter((card) => ours.has(card.metadata.compensationId));
  const holders = [...provider.fake.store.state.cardholders.values()].filter((h) => ours.has(h.metadata.compensationId));
  expect(cards.map((card) => card.metadata.compensationId).sort()).toEqual([...ours].sort());
  expect(holders).toHaveLength(ids.length);
  for (const row of await ds.getRepository(CompensationEntity).findBy({ id: In(ids) })) {
    const card = cards.find((c) => c.metadata.compensationId === String(row.id))!;
    expect(row.providerCardId, `compensation ${row.id}`).toBe(card.id);
    expect(card.spending_limits[0].amount).toBe(row.amountMinor);
  }
}

describe('a payment run under faults', () => {
  it('the server killed with SIGKILL mid-run: every compensation is paid by exactly one card of its amount', async () => {
    const { comps } = await paymentRun(restartServer, 12);
    await expectPaidOnce(comps);
  }, 240_000);

  it('MariaDB killed and restarted mid-run: exactly one card each, no answer but ours while it was down', async () => {
    const { comps } = await paymentRun(async () => {
      db.crash();
      await db.restart();
    }, 12);
    expect(seen.unavailable + seen.lost).toBeGreaterThan(0);
    await expectPaidOnce(comps);
  }, 240_000);

  it('the provider failing every call: the desk sees the payments pending with the reason, then each is paid once', async () => {
    provider.fake.faults.api.add({ kind: 'error500', phase: 'before', probability: 1, count: 100_000 });
    const { flight, comps } = await paymentRun(async () => undefined, -1);
    const desk = await signedInRemote(agentEmail);
    await expect.poll(async () => {
      const list = (await desk.get(`/api/flights/${flight.id}/compensations`)).body as { compensations?: { state: string; lastError: string | null }[] };
      return (list.compensations ?? []).filter((c) => c.state === 'issuing' && c.lastError).length;
    }, { timeout: 60_000 }).toBe(PAYMENTS);
    provider.fake.faults.api.clear();
    await expectPaidOnce(comps);
  }, 240_000);
});
