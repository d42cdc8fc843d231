// Bumpboard as several processes, for real: two app processes (node with tsx, as `npm start` runs them) behind a
// balancer on loopback with sticky sessions, sharing one MariaDB of their own and one Redis (Debian's redis-server,
// installed and started by our scripts). The feed posts to the first; a console connected through the balancer to
// the second sees the notices; the first is killed with SIGKILL mid-burst while an agent pinned to it runs a
// volunteer round and a payment run. Afterwards every event is applied once (counts exact), every confirmation is
// mailed and every compensation paid by exactly one card.
// Outside sources: socket.io docs "Using multiple nodes" (sticky sessions; the Redis adapter relays room broadcasts
// between servers), from memory; RFC 5322 section 3.6.4 (a message keeps its Message-ID however often it is sent);
// Stripe docs "Idempotent requests" (a retried key returns the first result).
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { ChildProcess } from 'node:child_process';
import { io as connect, type Socket } from 'socket.io-client';
import { In, type DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { ChangedPayload, ClientToServerEvents, ServerToClientEvents } from '@shared/events';
import { flightDeskSchema } from '@shared/schemas/flight-desk';
import { createMailFake, type MailFake } from '../../mail-fake/src/app';
import { createDataSource } from '../../server/src/db/data-source';
import { CompensationEntity, OutboxMessageEntity, PassengerEntity, StationEntity, VolunteerEntity, type FlightEntity } from '../../server/src/db/entities';
import { createIntegrationKey } from '../../server/src/modules/integrations/integration-keys.service';
// @ts-expect-error a plain Node script of ours, without type declarations
import { startPrivateRedis } from '../../server/scripts/lib/redis.mjs';
import { NODE_COOKIE, NODE_HEADER, startBalancer, type Balancer } from './cluster-balancer';
import { freePort, startFaultDatabase, startServerProcess, type FaultDatabase, type ServerProcess } from './faults-harness';
import { Client } from './harness';
import { insertUser, TEST_PASSWORD } from './helpers';
import { insertCompensations, seedFlight, startFake, WEBHOOK_SECRET, type RunningFake } from './payments-harness';
import { addSingles, makeFlight, uniquePnr } from './volunteers-fixtures';

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

let db: FaultDatabase;
let ds: DataSource;
let redis: { url: string; child: ChildProcess } | undefined;
let mail: MailFake | undefined;
let mailDir = '';
let catcherUrl = '';
let provider: RunningFake | undefined;
let balancer: Balancer | undefined;
const servers: ServerProcess[] = [];
const sockets: ClientSocket[] = [];
let station: StationEntity;
let agentEmail: string;
let feedKey: string;

beforeAll(async () => {
  db = await startFaultDatabase('cluster-db');
  ds = createDataSource(db.url);
  await ds.initialize();
  station = await ds.getRepository(StationEntity).save({ iata: 'PVD', name: 'Providence (cluster test station)', timeZone: 'America/New_York', regime: 'us-dot', currency: 'USD' });
  agentEmail = (await insertUser(ds, { label: 'cluster-agent', role: 'agent', stationIds: [station.id] })).email;
  feedKey = (await createIntegrationKey(ds, station.id, 'cluster feed', { label: 'cluster test' })).key;
  redis = await startPrivateRedis({ port: await freePort(), dir: '.local/test/cluster-redis' });
  mailDir = mkdtempSync(path.join(os.tmpdir(), 'bumpboard-cluster-mail-'));
  mail = createMailFake({ dataDir: mailDir });
  const mailPorts = await mail.listen({ smtpPort: 0, httpPort: 0 });
  catcherUrl = `http://127.0.0.1:${mailPorts.httpPort}`;
  // The provider's webhooks reach the app through the balancer, as they would in production.
  const balancerPort = await freePort();
  provider = await startFake({ webhook: { url: `http://127.0.0.1:${balancerPort}/api/payments/webhook`, secret: WEBHOOK_SECRET } });
  const env = {
    DATABASE_URL: db.url, REDIS_URL: redis!.url, SESSION_SECRET: 'cluster-test-secret-cluster-test-secret-42', SIMULATOR: 'off',
    SMTP_HOST: '127.0.0.1', SMTP_PORT: String(mailPorts.smtpPort),
    STRIPE_API_URL: provider.url, STRIPE_SECRET_KEY: 'sk_test_bumpboard_cluster_tests', STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    // What a killed process held is taken up by the other after this long (the defaults are minutes).
    OUTBOX_LEASE_SECONDS: '5', PAYMENTS_LEASE_SECONDS: '5', RECOMPUTE_LEASE_SECONDS: '2',
  };
  for (const started of await Promise.allSettled([startServerProcess(env), startServerProcess(env)])) {
    if (started.status === 'fulfilled') servers.push(started.value);
  }
  if (servers.length !== 2) throw new Error('an app process did not start');
  balancer = await startBalancer(servers.map((s) => s.baseUrl), balancerPort);
}, 240_000);

afterAll(async () => {
  for (const s of sockets) s.disconnect();
  await balancer?.close();
  for (const server of servers) await server.kill('SIGTERM');
  await provider?.stop();
  await mail?.close();
  if (mailDir) rmSync(mailDir, { recursive: true, force: true });
  if (redis && redis.child.exitCode === null) {
    const exited = new Promise((resolve) => redis!.child.once('exit', resolve));
    redis.child.kill('SIGTERM');
    await exited;
  }
  await ds?.destroy();
  await db?.stop();
}, 60_000);

/** The process a client of the balancer is pinned to (0 or 1), from the balancer's answer. */
const nodeOf = (res: { headers: Record<string, unknown> }) => Number(res.headers[NODE_HEADER]);

/** Signs in through the balancer; the client keeps the balancer's pin with its session cookie. */
async function signedInThroughBalancer(): Promise<{ client: Client; node: number; cookie: string }> {
  const client = new Client(balancer!.url);
  const res = await client.signIn(agentEmail, TEST_PASSWORD);
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  const node = nodeOf(res);
  const session = ((res.headers['set-cookie'] as unknown as string[]) ?? []).find((c) => c.startsWith('bumpboard.sid='))!.split(';')[0];
  return { client, node, cookie: `${session}; ${NODE_COOKIE}=${node}` };
}

/** A feed client: keeps the balancer's cookie like any cookie-keeping HTTP client, and retries a batch it has no answer for. */
function feedClient(pinTo: number) {
  let cookie = `${NODE_COOKIE}=${pinTo}`;
  const answeredBy: number[] = [];
  return {
    answeredBy,
    async post(events: unknown[]) {
      await vi.waitFor(async () => {
        const res = await fetch(`${balancer!.url}/api/integrations/events`, {
          method: 'POST', headers: { authorization: `Bearer ${feedKey}`, 'content-type': 'application/json', cookie }, body: JSON.stringify({ events }),
        });
        const pin = res.headers.getSetCookie().find((c) => c.startsWith(`${NODE_COOKIE}=`));
        if (pin) cookie = pin.split(';')[0];
        if (res.status !== 200) throw new Error(`feed answered ${res.status}`);
        const body = (await res.json()) as { rejected: number };
        // A batch repeated after a lost answer: its events are already there and count as duplicates, not errors.
        expect(body.rejected).toBe(0);
        answeredBy.push(Number(res.headers.get(NODE_HEADER)));
      }, { timeout: 60_000, interval: 100 });
    },
  };
}

function bookingAndCheckIn(flight: FlightEntity, n: number, runTag: string) {
  const pnr = uniquePnr();
  const ref = { carrier: flight.carrierCode, number: flight.flightNumber, date: flight.serviceDate };
  const at = new Date().toISOString();
  return [
    { id: `${runTag}-b${n}`, type: 'booking.added', occurredAt: at, flight: ref, pnr, contactEmail: null,
      passengers: [{ firstName: `Feed${n}`, lastName: 'Cluster', cabin: 'Y', fareMinor: 19_900, fareCurrency: 'USD' }] },
    { id: `${runTag}-c${n}`, type: 'passenger.checked-in', occurredAt: at, flight: ref, pnr, sequence: 1 },
  ];
}

/** Retries a desk request whose answer was lost with its process, as the screen's own retry does. */
async function untilAnswered<T extends { status: number }>(send: () => PromiseLike<T>): Promise<T> {
  let answer: T | undefined;
  await vi.waitFor(async () => {
    const res = await send();
    if (res.status >= 500) throw new Error(`answered ${res.status}`);
    answer = res;
  }, { timeout: 60_000, interval: 100 });
  return answer!;
}

const NEEDED = 4;

describe('two app processes behind a balancer, one killed mid-burst', () => {
  it('loses nothing: every event applied once, notices on the other process, each mail and payment once', async () => {
    // ── Who is where: the agent on the first process, the console on the second (round robin of new clients).
    const agent = await signedInThroughBalancer();
    const consoleUser = await signedInThroughBalancer();
    expect([agent.node, consoleUser.node]).toEqual([0, 1]);

    const feedFlight = await makeFlight(ds, { stationId: station.id, origin: 'PVD', destination: 'BWI', seats: 400 });
    const roundFlight = await makeFlight(ds, { stationId: station.id, origin: 'PVD', destination: 'DCA' });
    const singles = await addSingles(ds, roundFlight, 8, 'Cluster');
    const paid = await seedFlight(ds, station, { passengers: 12, destination: 'ORD' });
    const comps = await insertCompensations(ds, paid.flight, paid.passengers);

    const socket: ClientSocket = connect(balancer!.url, { transports: ['websocket'], extraHeaders: { cookie: consoleUser.cookie }, reconnection: false });
    sockets.push(socket);
    const notices: ChangedPayload[] = [];
    socket.on('flight:changed', (p) => p.id === feedFlight.id && notices.push(p));
    await new Promise<void>((resolve, reject) => {
      socket.on('connect', () => resolve());
      socket.on('connect_error', reject);
    });
    expect(await new Promise<boolean>((r) => socket.emit('flight:watch', feedFlight.id, (a) => r(a.ok)))).toBe(true);

    // ── Before the fault: an event posted to the first process reaches the console on the second.
    const runTag = `cluster-${feedFlight.id}`;
    const feed = feedClient(0);
    await feed.post(bookingAndCheckIn(feedFlight, 0, runTag));
    expect(feed.answeredBy).toEqual([0]);
    await expect.poll(() => notices.at(-1)?.desk?.totals.checkedIn, { timeout: 30_000 }).toBe(1);

    // ── The burst: the feed, a volunteer round and a payment run at once; the first process dies partway through
    // each. Each stream goes on past its share only once the kill is under way, so all three are cut mid-run
    // whatever the machine's speed, and their next requests race the dying process.
    const BATCHES = 16;
    const PER_BATCH = 5;
    const progress = { batches: 0, issued: 0, accepted: 0 };
    const SHARE = { batches: 5, issued: 6, accepted: 2 };
    let killed: Promise<void> | null = null;
    const issuedBy: number[] = [];
    const acceptedBy: number[] = [];
    async function killPoint(reached: boolean) {
      if (!reached) return;
      if (!killed && progress.batches >= SHARE.batches && progress.issued >= SHARE.issued && progress.accepted >= SHARE.accepted) {
        // SIGKILL, by the child's PID: no clean stop, whatever it was doing is cut off.
        killed = servers[0].kill('SIGKILL');
      }
      await vi.waitFor(() => expect(killed).not.toBeNull(), { timeout: 120_000, interval: 20 });
    }
    const feeding = (async () => {
      for (let b = 0; b < BATCHES; b++) {
        const events = Array.from({ length: PER_BATCH }, (_, i) => bookingAndCheckIn(feedFlight, 1 + b * PER_BATCH + i, runTag)).flat();
        await feed.post(events);
        progress.batches += 1;
        await killPoint(progress.batches === SHARE.batches);
      }
    })();
    const round = await untilAnswered(() => agent.client.post(`/api/flights/${roundFlight.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: NEEDED }));
    expect(round.status, JSON.stringify(round.body)).toBe(201);
    const roundId = round.body.id as number;
    const volunteering = (async () => {
      for (const single of singles) {
        const passengerId = single.passengers[0].id;
        const offered = await untilAnswered(() => agent.client.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [passengerId] }));
        // 409: recorded by a try whose answer was lost with the first process.
        expect([201, 409], JSON.stringify(offered.body)).toContain(offered.status);
      }
      const list = await untilAnswered(() => agent.client.get(`/api/flights/${roundFlight.id}/rounds`));
      const volunteers = (list.body.rounds as { id: number; volunteers: { id: number; status: string }[] }[]).find((r) => r.id === roundId)!.volunteers;
      for (const v of volunteers) {
        const accepted = await untilAnswered(() => agent.client.post(`/api/rounds/${roundId}/volunteers/${v.id}/accept`));
        acceptedBy.push(nodeOf(accepted));
        if (accepted.status !== 200) expect(['round_full', 'already_decided'], JSON.stringify(accepted.body)).toContain(accepted.body.error);
        progress.accepted += 1;
        await killPoint(progress.accepted === SHARE.accepted);
      }
    })();
    const paying = (async () => {
      for (const c of comps) {
        const issued = await untilAnswered(() => agent.client.post(`/api/compensations/${c.id}/issue`));
        expect(issued.status, JSON.stringify(issued.body)).toBeLessThan(300);
        issuedBy.push(nodeOf(issued));
        progress.issued += 1;
        await killPoint(progress.issued === SHARE.issued);
      }
    })();
    await Promise.all([feeding, volunteering, paying]);
    await killed;
    expect(servers[0].child.signalCode).toBe('SIGKILL');
    // Each stream was served by the first process, then by the second once the first was gone; the balancer took
    // the dead one out of its rotation.
    for (const servedBy of [feed.answeredBy, issuedBy, acceptedBy]) {
      expect(servedBy[0]).toBe(0);
      expect(servedBy.at(-1)).toBe(1);
    }
    expect(balancer!.down.has(0)).toBe(true);

    // ── Nothing lost: every event applied once, the counts exact on the console and on the desk.
    const expected = 1 + BATCHES * PER_BATCH;
    const applied: { n: number; ids: number }[] = await ds.query('SELECT COUNT(*) AS n, COUNT(DISTINCT event_id) AS ids FROM flight_events WHERE flight_id = ?', [feedFlight.id]);
    expect(Number(applied[0].n)).toBe(2 * expected);
    expect(Number(applied[0].ids)).toBe(2 * expected);
    const passengers = await ds.getRepository(PassengerEntity).findBy({ flightId: feedFlight.id });
    expect(passengers).toHaveLength(expected);
    expect(passengers.every((p) => p.status === 'checked-in')).toBe(true);
    await expect.poll(() => notices.at(-1)?.desk?.totals, { timeout: 60_000 }).toMatchObject({ booked: expected, checkedIn: expected });
    const desk = flightDeskSchema.parse((await consoleUser.client.get(`/api/flights/${feedFlight.id}`).expect(200)).body);
    expect(desk.totals).toMatchObject({ booked: expected, checkedIn: expected });
    // Versions only go up on the console: no notice from either process brought an older state after a newer one.
    const versions = notices.map((n) => n.version).filter((v): v is number => v !== undefined);
    expect(versions).toEqual([...versions].sort((x, y) => x - y));

    // ── Each volunteer accepted once, with one compensation and one confirmation each, mailed.
    const volunteers = await ds.getRepository(VolunteerEntity).findBy({ roundId });
    const accepted = volunteers.filter((v) => v.status === 'accepted');
    expect(accepted).toHaveLength(NEEDED);
    const roundComps = await ds.getRepository(CompensationEntity).findBy({ flightId: roundFlight.id, sourceKind: 'volunteer' });
    expect(roundComps.map((c) => c.sourceId).sort()).toEqual(accepted.map((v) => v.id).sort());
    const confirmations = await ds.getRepository(OutboxMessageEntity).findBy({ flightId: roundFlight.id, kind: 'volunteer-confirmation' });
    expect(confirmations).toHaveLength(NEEDED);
    await expect.poll(async () => (await ds.getRepository(OutboxMessageEntity).findBy({ id: In(confirmations.map((n) => n.id)) })).every((n) => n.status === 'sent'), { timeout: 60_000 }).toBe(true);
    const inbox = (await (await fetch(`${catcherUrl}/api/messages`)).json()) as { messages: { headers: Record<string, string> }[] };
    for (const sent of await ds.getRepository(OutboxMessageEntity).findBy({ id: In(confirmations.map((n) => n.id)) })) {
      const deliveries = inbox.messages.filter((m) => m.headers['X-Bumpboard-Message-Id'] === sent.id).length;
      // Once; a second time only if the killed process had handed it over and died before recording it: then the
      // row shows the second claim, and the repeat keeps its Message-ID for the receiving side to drop.
      expect(deliveries, `message ${sent.id}`).toBeGreaterThanOrEqual(1);
      expect(deliveries, `message ${sent.id}`).toBeLessThanOrEqual(sent.attempts);
      if (sent.attempts === 1) expect(deliveries).toBe(1);
    }

    // ── Every compensation paid by exactly one card of its amount, and no claim left behind.
    const ids = comps.map((c) => c.id);
    await expect.poll(async () => (await ds.getRepository(CompensationEntity).findBy({ id: In(ids), state: 'issued' })).length, { timeout: 90_000 }).toBe(ids.length);
    const ours = new Set(ids.map(String));
    const cards = [...provider!.fake.store.state.cards.values()].filter((card) => ours.has(card.metadata.compensationId));
    expect(cards.map((card) => card.metadata.compensationId).sort()).toEqual([...ours].sort());
    const holders = [...provider!.fake.store.state.cardholders.values()].filter((h) => ours.has(h.metadata.compensationId));
    expect(holders).toHaveLength(ids.length);
    for (const row of await ds.getRepository(CompensationEntity).findBy({ id: In(ids) })) {
      expect(cards.find((c) => c.metadata.compensationId === String(row.id))!.spending_limits[0].amount).toBe(row.amountMinor);
      expect(row.claimedBy).toBeNull();
    }
    console.log(`[cluster] balancer sent ${balancer!.sent.join(' / ')} requests to the two processes; answered by process: feed ${feed.answeredBy.join('')}, issue ${issuedBy.join('')}, accept ${acceptedBy.join('')}`);
  }, 300_000);
});
