// The e-mail outbox end to end: rows written in a caller's transaction, a worker sending them over real SMTP to
// the local catcher (started here on ports 0), faults injected through the catcher's JSON API, and the notices
// routes. "Delivered exactly once" is counted in the catcher by the X-Bumpboard-Message-Id header.
// Outside sources: RFC 5321 section 4.2.1 (4yz replies are transient: retry; 5yz are permanent: stop) and
// section 3.8 (a server going away answers 421); MariaDB documentation, SELECT ... FOR UPDATE SKIP LOCKED
// (10.6 and later: locked rows are skipped, not waited for) — both from memory.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { outboxListSchema } from '@shared/schemas/volunteers';
import { createMailFake, type MailFake } from '../../mail-fake/src/app';
import { AuditLogEntity, FlightEntity, OutboxMessageEntity } from '../../server/src/db/entities';
import { createMailTransport, type MailTransport } from '../../server/src/integrations/mail/mail-transport';
import { claimDueMessages, markSent, releaseClaim } from '../../server/src/modules/outbox/outbox-claims';
import { createOutboxWorker, type OutboxWorkerOptions } from '../../server/src/modules/outbox/outbox-worker';
import { enqueueMessage } from '../../server/src/modules/outbox/outbox.service';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, RUN_ID, foreignStation, stationIdByIata } from './helpers';

let t: TestApp;
let mailFake: MailFake;
let smtpPort: number;
let catcherUrl: string;
let dataDir: string;
let bos: number;
let tos: number;
const flightIds: number[] = [];
const transports: MailTransport[] = [];

beforeAll(async () => {
  t = await startTestApp();
  dataDir = mkdtempSync(path.join(os.tmpdir(), 'bumpboard-outbox-test-'));
  mailFake = createMailFake({ dataDir });
  const ports = await mailFake.listen({ smtpPort: 0, httpPort: 0 });
  smtpPort = ports.smtpPort;
  catcherUrl = `http://127.0.0.1:${ports.httpPort}`;
  bos = await stationIdByIata(t.db, 'BOS');
  tos = (await foreignStation(t.db)).id;
  await assertNoOtherWorker();
});

afterAll(async () => {
  for (const transport of transports) transport.close();
  // Rows first, not left to ON DELETE CASCADE, so cleanup holds even on a schema without the foreign key.
  // Audit rows stay: the log is append-only.
  if (flightIds.length) {
    await t.db.query('DELETE FROM outbox_messages WHERE flight_id IN (?)', [flightIds]);
    await t.db.query('DELETE FROM flights WHERE id IN (?)', [flightIds]);
  }
  await mailFake.close();
  rmSync(dataDir, { recursive: true, force: true });
  await t.close();
});

/** A flight of this run only, so each scenario's worker sees only its own messages. */
async function makeFlight(stationId = bos, origin = 'BOS'): Promise<number> {
  const repo = t.db.getRepository(FlightEntity);
  const departure = new Date(Date.UTC(2033, 0, 1) + Math.floor(Math.random() * 360) * 86_400_000);
  const flight = await repo.save(repo.create({
    stationId, carrierCode: 'ZQ', flightNumber: String(1000 + Math.floor(Math.random() * 9000)), serviceDate: departure.toISOString().slice(0, 10),
    origin, destination: 'ORD', scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + 9_000_000),
    aircraftType: '320', seatsByCabin: { Y: 150 }, gate: null, state: 'scheduled', shock: null,
  }));
  flightIds.push(flight.id);
  return flight.id;
}

let sequence = 0;
function message(flightId: number, extra: { dedupeKey?: string; stationId?: number } = {}) {
  sequence += 1;
  return {
    stationId: extra.stationId ?? bos, flightId, passengerIds: [sequence], kind: 'volunteer-confirmation',
    to: `passenger-${RUN_ID}-${sequence}@bumpboard.test`, subject: `Outbox test ${RUN_ID} #${sequence}`,
    text: `Plain text ${sequence}`, html: `<p>HTML ${sequence}</p>`, dedupeKey: extra.dedupeKey ?? null,
  };
}

async function enqueueCommitted(flightId: number, extra: { dedupeKey?: string; stationId?: number } = {}): Promise<string> {
  return (await t.db.transaction((em) => enqueueMessage(em, message(flightId, extra)))).id;
}

function transport(): MailTransport {
  const made = createMailTransport({ SMTP_HOST: '127.0.0.1', SMTP_PORT: smtpPort, SMTP_SECURE: false, MAIL_FROM: 'Bumpboard <notices@bumpboard.test>' });
  transports.push(made);
  return made;
}

function worker(flightId: number, opts: OutboxWorkerOptions = {}, via: MailTransport = transport()) {
  const w = createOutboxWorker(t.db, via, { pollMs: 100, onlyFlightIds: [flightId], log: () => undefined, ...opts });
  w.start();
  return w;
}

async function deliveries(id: string): Promise<number> {
  const response = await fetch(`${catcherUrl}/api/messages?bumpboardMessageId=${encodeURIComponent(id)}`);
  return ((await response.json()) as { count: number }).count;
}

async function setFault(body: object): Promise<void> {
  const response = await fetch(`${catcherUrl}/api/faults`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  expect(response.status).toBe(200);
}

const row = (id: string) => t.db.getRepository(OutboxMessageEntity).findOneByOrFail({ id });

/** Bounded, so a broken worker fails the test instead of hanging it. */
async function waitFor(check: () => Promise<boolean>, timeoutMs: number, what: string): Promise<void> {
  await vi.waitFor(async () => {
    if (!(await check())) throw new Error(`${what}: not within ${timeoutMs} ms`);
  }, { timeout: timeoutMs, interval: 100 });
}

/**
 * Every count below assumes this file's workers are the only ones on the table. A server started on the same
 * database (server/src/main.ts runs a worker for all stations) would take these messages to its own catcher,
 * so that is detected and named instead of showing up as missing deliveries.
 */
async function assertNoOtherWorker(): Promise<void> {
  const flightId = await makeFlight();
  const probe = await enqueueCommitted(flightId);
  // three poll periods of a default worker (500 ms)
  await new Promise((resolve) => setTimeout(resolve, 1_500));
  const seen = await row(probe);
  await t.db.query('DELETE FROM outbox_messages WHERE id = ?', [probe]);
  if (seen.attempts > 0) {
    throw new Error('Another outbox worker is polling this database (a server running server/src/main.ts?). Stop it, or give the API tests a database of their own.');
  }
}

const allSent = (ids: string[]) => async () => (await Promise.all(ids.map(row))).every((r) => r.status === 'sent');

describe('enqueueing in the caller transaction', () => {
  it('delivers a committed message exactly once and never one whose transaction rolled back', async () => {
    const flightId = await makeFlight();
    let rolledBackId = '';
    await expect(t.db.transaction(async (em) => {
      rolledBackId = (await enqueueMessage(em, message(flightId))).id;
      throw new Error('the business action failed');
    })).rejects.toThrow('the business action failed');
    const committedId = await enqueueCommitted(flightId);
    const w = worker(flightId);
    try {
      await waitFor(allSent([committedId]), 10_000, 'committed message sent');
      const sent = await row(committedId);
      expect(sent).toMatchObject({ status: 'sent', attempts: 1, lastError: null });
      expect(sent.sentAt).toBeInstanceOf(Date);
      expect(await deliveries(committedId)).toBe(1);
      const [delivered] = mailFake.inbox.list({ bumpboardMessageId: committedId });
      expect(delivered.headers['Message-ID']).toBe(`<${committedId}@bumpboard>`);
      expect(delivered.from).toContain('notices@bumpboard.test');
      expect(delivered.html).toContain('<p>HTML');
      expect(await t.db.getRepository(OutboxMessageEntity).countBy({ id: rolledBackId })).toBe(0);
      expect(await deliveries(rolledBackId)).toBe(0);
    } finally {
      await w.stop();
    }
  });

  it('enqueues the same business fact once, however often it is reported', async () => {
    const flightId = await makeFlight();
    const dedupeKey = `outbox-test:${RUN_ID}:${flightId}`;
    const first = await t.db.transaction((em) => enqueueMessage(em, message(flightId, { dedupeKey })));
    const again = await t.db.transaction(async (em) => [await enqueueMessage(em, message(flightId, { dedupeKey })), await enqueueMessage(em, message(flightId, { dedupeKey }))]);
    expect(first.created).toBe(true);
    expect(again).toEqual([{ id: first.id, created: false }, { id: first.id, created: false }]);
    expect(await t.db.getRepository(OutboxMessageEntity).countBy({ dedupeKey })).toBe(1);
  });

  it('refuses a bad message in the caller transaction, naming the field', async () => {
    const flightId = await makeFlight();
    await expect(t.db.transaction((em) => enqueueMessage(em, { ...message(flightId), to: 'not an address' }))).rejects.toThrow(/^message\.to: must be an e-mail address/);
    await expect(t.db.transaction((em) => enqueueMessage(em, { ...message(flightId), kind: 'Volunteer Confirmation' }))).rejects.toThrow(/^message\.kind:/);
  });
});

describe('retries', () => {
  async function outage(seconds: number, timeoutMs: number) {
    const flightId = await makeFlight();
    const w = worker(flightId);
    try {
      const before = [await enqueueCommitted(flightId), await enqueueCommitted(flightId)];
      await waitFor(allSent(before), 10_000, 'messages before the outage sent');
      await setFault({ mode: 'down', seconds });
      const during = [await enqueueCommitted(flightId), await enqueueCommitted(flightId), await enqueueCommitted(flightId)];
      await waitFor(async () => (await Promise.all(during.map(row))).every((r) => r.attempts >= 2), 10_000, 'two refused tries');
      for (const r of await Promise.all(during.map(row))) {
        // a refused connection is transient: still pending, with the reason kept
        expect(r.status).toBe('pending');
        expect(r.lastError).toMatch(/ECONNREFUSED/);
        expect(await deliveries(r.id)).toBe(0);
      }
      await waitFor(allSent(during), timeoutMs, 'messages after the outage sent');
      for (const id of [...before, ...during]) expect(await deliveries(id)).toBe(1);
    } finally {
      await w.stop();
    }
  }

  it('rides out a 5 second outage of the mail server and delivers every notice exactly once', async () => {
    await outage(5, 20_000);
  }, 40_000);

  // Default backoff: tries at about 0, 1, 3, 7, 15 and 31 s (derived: 1 s doubling), so the sixth try lands
  // just after a 30 s outage ends.
  it('rides out a 30 second outage with the default backoff and delivers every notice exactly once', async () => {
    await outage(30, 45_000);
  }, 60_000);

  it('retries after a 4yz reply at RCPT TO and after DATA, then delivers once (RFC 5321 section 4.2.1)', async () => {
    const flightId = await makeFlight();
    await setFault({ mode: 'reject-4xx', count: 2 });
    const atRcpt = await enqueueCommitted(flightId);
    const w = worker(flightId);
    try {
      await waitFor(allSent([atRcpt]), 15_000, 'message sent after two 452 replies');
      expect(await row(atRcpt)).toMatchObject({ status: 'sent', attempts: 3, lastError: expect.stringMatching(/^452 /) });
      expect(await deliveries(atRcpt)).toBe(1);

      await setFault({ mode: 'reject-4xx', stage: 'data', code: 451, count: 1 });
      const atData = await enqueueCommitted(flightId);
      await waitFor(allSent([atData]), 15_000, 'message sent after a 451 reply to DATA');
      expect(await row(atData)).toMatchObject({ attempts: 2, lastError: expect.stringMatching(/^451 .*DATA/) });
      expect(await deliveries(atData)).toBe(1);
    } finally {
      await w.stop();
      await mailFake.faults.clear();
    }
  });

  it('stops after a bounded number of transient failures', async () => {
    const flightId = await makeFlight();
    await setFault({ mode: 'reject-4xx', count: 3 });
    const id = await enqueueCommitted(flightId);
    const w = worker(flightId, { maxAttempts: 3, backoff: { baseMs: 50, maxMs: 50 } });
    try {
      await waitFor(async () => (await row(id)).status === 'failed', 10_000, 'message given up');
      expect(await row(id)).toMatchObject({ attempts: 3, lastError: expect.stringMatching(/^gave up after 3 tries; last: 452 /) });
      expect(await deliveries(id)).toBe(0);
    } finally {
      await w.stop();
      await mailFake.faults.clear();
    }
  });
});

describe('a 5yz reply and the retry route', () => {
  let supervisor: Client;
  let agent: Client;
  beforeAll(async () => {
    [supervisor, agent] = await Promise.all([signedIn(t, DEMO.supervisor), signedIn(t, DEMO.agent)]);
  });

  it('marks the message failed with the reason shown, and a supervisor re-queues it (audited) for one delivery', async () => {
    const flightId = await makeFlight();
    await setFault({ mode: 'reject-5xx', count: 1 });
    const id = await enqueueCommitted(flightId);
    const w = worker(flightId);
    try {
      await waitFor(async () => (await row(id)).status === 'failed', 10_000, 'message failed');
      // permanent: one try only
      expect(await row(id)).toMatchObject({ attempts: 1, lastError: expect.stringMatching(/^550 .*RCPT TO/) });
      const listed = outboxListSchema.parse((await supervisor.get(`/api/flights/${flightId}/notices`).expect(200)).body);
      expect(listed.messages.find((m) => m.id === id)).toMatchObject({ status: 'failed', lastError: expect.stringMatching(/^550 /) });

      await agent.post(`/api/flights/${flightId}/notices/${id}/retry`).expect(403);
      const requeued = await supervisor.post(`/api/flights/${flightId}/notices/${id}/retry`).expect(200);
      expect(requeued.body).toMatchObject({ id, status: 'pending', attempts: 0 });
      await waitFor(allSent([id]), 10_000, 're-queued message sent');
      expect(await deliveries(id)).toBe(1);
      const trail = await t.db.getRepository(AuditLogEntity).findOneByOrFail({ entityType: 'outbox_message', entityId: id, action: 'notice.requeued' });
      expect(trail).toMatchObject({ actorLabel: DEMO.supervisor, stationId: bos, before: { status: 'failed', attempts: 1 } });

      // a sent message cannot be re-queued: that would mail it twice
      const again = await supervisor.post(`/api/flights/${flightId}/notices/${id}/retry`).expect(409);
      expect(again.body.error).toBe('notice_not_failed');
      await supervisor.post(`/api/flights/${flightId}/notices/00000000-0000-4000-8000-000000000000/retry`).expect(404);
      await supervisor.post(`/api/flights/${flightId}/notices/not-a-uuid/retry`).expect(400);
    } finally {
      await w.stop();
      await mailFake.faults.clear();
    }
  });
});

describe('several workers', () => {
  it('never lets two workers send the same message', async () => {
    const flightId = await makeFlight();
    const ids: string[] = [];
    for (let i = 0; i < 40; i += 1) ids.push(await enqueueCommitted(flightId));
    const calls: string[] = [];
    const counting = (inner: MailTransport): MailTransport => ({
      sendMail: (mail) => {
        calls.push(mail.headers['X-Bumpboard-Message-Id']);
        return inner.sendMail(mail);
      },
      close: () => inner.close(),
    });
    const workers = [worker(flightId, { batchSize: 3, pollMs: 10 }, counting(transport())), worker(flightId, { batchSize: 3, pollMs: 10 }, counting(transport()))];
    try {
      await waitFor(allSent(ids), 30_000, 'all 40 sent');
      // each message handed to SMTP once in all: no double claim, not even a double attempt
      expect(calls.length).toBe(40);
      expect(new Set(calls).size).toBe(40);
      for (const id of ids) expect(await deliveries(id)).toBe(1);
    } finally {
      await Promise.all(workers.map((w) => w.stop()));
    }
  }, 40_000);

  it('gives two simultaneous claims disjoint rows (SKIP LOCKED)', async () => {
    const flightId = await makeFlight();
    for (let i = 0; i < 12; i += 1) await enqueueCommitted(flightId);
    const opts = { limit: 8, leaseMs: 60_000, onlyFlightIds: [flightId] };
    const [a, b] = await Promise.all([claimDueMessages(t.db, opts), claimDueMessages(t.db, opts)]);
    const aIds = new Set(a.map((c) => c.id));
    expect(b.filter((c) => aIds.has(c.id))).toEqual([]);
    expect(a.length + b.length).toBe(12);
    // a claim leases the row: nothing is due again until the lease ends
    expect(await claimDueMessages(t.db, opts)).toEqual([]);
    for (const claim of [...a, ...b]) expect(await releaseClaim(t.db, claim)).toBe(true);
    expect((await claimDueMessages(t.db, { ...opts, limit: 20 })).length).toBe(12);
  });

  it('a worker whose lease ran out records nothing over the claim that took its row after', async () => {
    const flightId = await makeFlight();
    const id = await enqueueCommitted(flightId);
    const opts = { limit: 1, leaseMs: 60_000, onlyFlightIds: [flightId] };
    const [stale] = await claimDueMessages(t.db, opts);
    // The first worker hangs past its lease (time passing, set by hand): the row is due again.
    await t.db.query('UPDATE outbox_messages SET lease_until = UTC_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE id = ?', [id]);
    const [fresh] = await claimDueMessages(t.db, opts);
    expect([stale.attempt, fresh.attempt]).toEqual([1, 2]);
    expect(await markSent(t.db, stale)).toBe(false);
    expect(await row(id)).toMatchObject({ status: 'pending', attempts: 2 });
    expect(await markSent(t.db, fresh)).toBe(true);
    expect(await row(id)).toMatchObject({ status: 'sent', attempts: 2, claimedBy: null, leaseUntil: null });
  });

  it('stop() waits for the send in flight and hands back what it had not tried', async () => {
    const flightId = await makeFlight();
    const [first, second] = [await enqueueCommitted(flightId), await enqueueCommitted(flightId)];
    const real = transport();
    let started!: () => void;
    let release!: () => void;
    const sending = new Promise<void>((resolve) => (started = resolve));
    // The send finishes only once stop() has been asked for: stop() must wait for it, whatever the timing.
    const released = new Promise<void>((resolve) => (release = resolve));
    const slow: MailTransport = {
      sendMail: async (mail) => {
        started();
        await released;
        return real.sendMail(mail);
      },
      close: () => real.close(),
    };
    const w = worker(flightId, { batchSize: 2 }, slow);
    await sending;
    const stopping = w.stop();
    release();
    await stopping;
    const [a, b] = [await row(first), await row(second)];
    const [sent, handedBack] = a.status === 'sent' ? [a, b] : [b, a];
    expect(sent.status).toBe('sent');
    expect(await deliveries(sent.id)).toBe(1);
    expect(handedBack).toMatchObject({ status: 'pending', attempts: 0 });
    expect(await deliveries(handedBack.id)).toBe(0);
  });
});

describe('GET /api/flights/:flightId/notices', () => {
  it('lists a flight of the user station newest first, and hides other stations', async () => {
    const flightId = await makeFlight();
    const ids: string[] = [];
    for (let i = 0; i < 3; i += 1) {
      ids.push(await enqueueCommitted(flightId));
      // created_at has millisecond precision; messages of the same millisecond are equally new
      await new Promise((resolve) => setTimeout(resolve, 5));
    }
    const agent = await signedIn(t, DEMO.agent);
    const listed = outboxListSchema.parse((await agent.get(`/api/flights/${flightId}/notices`).expect(200)).body);
    expect(listed.messages.map((m) => m.id)).toEqual([...ids].reverse());
    expect(listed.messages[0]).toMatchObject({ kind: 'volunteer-confirmation', status: 'pending', attempts: 0, sentAt: null, passengerIds: [expect.any(Number)] });

    const otherFlightId = await makeFlight(tos, 'TOS');
    await enqueueCommitted(otherFlightId, { stationId: tos });
    const hidden = await agent.get(`/api/flights/${otherFlightId}/notices`).expect(404);
    expect(hidden.body.error).toBe('not_found');
    await agent.get('/api/flights/999999999/notices').expect(404);
    await (await signedIn(t, DEMO.finance)).get(`/api/flights/${flightId}/notices`).expect(403);
    await new Client(t.app).get(`/api/flights/${flightId}/notices`).expect(401);
    const supervisor = await signedIn(t, DEMO.supervisor);
    await supervisor.post(`/api/flights/${otherFlightId}/notices/${ids[0]}/retry`).expect(404);
  });
});
