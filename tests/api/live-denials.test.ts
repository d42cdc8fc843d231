// The denial ranking on a live flight: built once per state of the flight and served to every console from memory,
// with its tag as the ETag (a 304 for the one held) and, to a console naming the tag it holds, only what changed. A
// check-in from the feed and a proposal through the API both reach a console as a patch that leaves it holding
// exactly the ranking a fresh read returns.
import 'reflect-metadata';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  applyCandidatesAnswer, applyCandidatesPatch, candidatesAnswerSchema, taggedCandidatesSchema, type TaggedCandidates,
} from '@shared/schemas/denial-candidates-patch';
import type { ChangedPayload } from '@shared/events';
import { createApp } from '../../server/src/app';
import { loadEnv } from '../../server/src/config/env';
import { createDataSource } from '../../server/src/db/data-source';
import type { FlightEntity } from '../../server/src/db/entities';
import { createSessionSetup } from '../../server/src/http/session';
import { createSignInThrottle } from '../../server/src/modules/auth/throttle';
import { heldRankingsOf } from '../../server/src/modules/denials/candidates-held';
import { forecastAnnouncer } from '../../server/src/modules/denials/ranking-notices';
import { createForecastScheduler, type ForecastScheduler } from '../../server/src/modules/forecast/forecast-scheduler';
import { liveStoreOf } from '../../server/src/modules/forecast/live-store';
import { createIntegrationKey } from '../../server/src/modules/integrations/integration-keys.service';
import type { Publisher } from '../../server/src/realtime/publisher';
import { addBooking, createFlight, removeDenialFixtures } from './denials-fixtures';
import { Client } from './harness';
import { DEMO, RUN_ID } from './helpers';

let db: DataSource;
let app: ReturnType<typeof createApp>;
let closeSession: () => Promise<void>;
let scheduler: ForecastScheduler;
let agent: Client;
let other: Client;
let key: string;
let serial = 0;
const notices: ChangedPayload[] = [];

beforeAll(async () => {
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', SESSION_SECRET: process.env.SESSION_SECRET ?? 'test-secret-test-secret-test-secret-42', STATIC_DIR: 'no-static-in-api-tests' });
  db = createDataSource(env.DATABASE_URL);
  await db.initialize();
  const session = createSessionSetup(env);
  closeSession = () => session.close();
  const publisher: Publisher = { flightChanged: (id, _station, topics, data, desk) => notices.push({ id, topics, ...data, ...desk }) };
  scheduler = createForecastScheduler(db, forecastAnnouncer(db));
  app = createApp({ env, db, session, throttle: createSignInThrottle({ perAccount: 1000, perAddress: 10_000 }), demo: true, publisher, forecast: scheduler });
  agent = new Client(app);
  other = new Client(app);
  expect((await agent.signIn(DEMO.agent)).status).toBe(200);
  expect((await other.signIn(DEMO.supervisor)).status).toBe(200);
  const probe = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1 });
  key = (await createIntegrationKey(db, probe.stationId, `live denials ${RUN_ID}`, { label: 'live denials test' })).key;
}, 60_000);
afterAll(async () => {
  await scheduler.flush();
  await removeDenialFixtures(db);
  await closeSession();
  await db.destroy();
});

const checkIn = (flight: FlightEntity, pnr: string) => ({
  id: `live-denials-${RUN_ID}-${++serial}`, type: 'passenger.checked-in', occurredAt: new Date().toISOString(), pnr, sequence: 1,
  flight: { carrier: flight.carrierCode, number: flight.flightNumber, date: flight.serviceDate },
});
const feed = (events: unknown[]) => request(app).post('/api/integrations/events').set('Authorization', `Bearer ${key}`).send({ events });
const path = (flight: FlightEntity) => `/api/flights/${flight.id}/denial-candidates`;
const full = async (c: Client, flight: FlightEntity) => taggedCandidatesSchema.parse((await c.get(path(flight)).expect(200)).body);
const since = async (c: Client, flight: FlightEntity, tag: string) => candidatesAnswerSchema.parse((await c.get(`${path(flight)}?since=${tag}`).expect(200)).body);
/** The expected shows drift with every recompute and are patched from the notices: left out of the comparison. */
const comparable = (r: TaggedCandidates) => ({ ...r, counts: { ...r.counts, expectedShows: null } });

async function flightOfTwo() {
  const flight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1 });
  const a = await addBooking(db, flight, [{ first: 'Ada', last: 'Alder', status: 'checked-in' }]);
  const b = await addBooking(db, flight, [{ first: 'Bo', last: 'Birch', status: 'booked' }]);
  return { flight, pnrs: [a.booking.pnr, b.booking.pnr] };
}

describe('the denial ranking served from memory', () => {
  it('is built once for every console, with its tag as the ETag: a console holding it gets a 304', async () => {
    const { flight } = await flightOfTwo();
    const rankings = heldRankingsOf(db);
    const builds = rankings.builds;
    const first = await agent.get(path(flight)).expect(200);
    const tag = taggedCandidatesSchema.parse(first.body).tag;
    expect(first.headers.etag).toBe(`"${tag}"`);
    await other.get(path(flight)).set('If-None-Match', `"${tag}"`).expect(304);
    for (let i = 0; i < 5; i++) expect((await full(i % 2 ? agent : other, flight)).tag).toBe(tag);
    expect(await since(agent, flight, tag)).toEqual({ kind: 'same', tag });
    expect(rankings.builds - builds).toBe(1);
  });

  it('a check-in from the feed reaches a console holding the ranking as a patch that gives the fresh ranking', async () => {
    const { flight, pnrs } = await flightOfTwo();
    const held = await full(agent, flight);
    expect(held.counts.checkedIn).toBe(1);
    expect((await feed([checkIn(flight, pnrs[1])]).expect(200)).body.results[0].status).toBe('applied');
    await scheduler.flush();
    const answer = await since(agent, flight, held.tag);
    if (answer.kind !== 'patch') throw new Error(`expected a patch, got ${answer.kind}`);
    expect(answer.base).toBe(held.tag);
    expect(answer.counts.checkedIn).toBe(2);
    const patched = applyCandidatesPatch(held, answer)!;
    expect(comparable(patched)).toEqual(comparable(await full(other, flight)));
    // The patch is a fraction of the whole ranking.
    expect(JSON.stringify(answer).length).toBeLessThan(JSON.stringify(patched).length);
  });

  it('rides on the forecast notices: a console holding the ranking the last notice brought gets a patch giving the fresh one', async () => {
    const flight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1 });
    const pnrs: string[] = [];
    for (const first of ['Ada', 'Bo', 'Cy']) pnrs.push((await addBooking(db, flight, [{ first, last: 'Notice', status: 'booked' }])).booking.pnr);
    const noticeOf = (version: number) => notices.find((n) => n.id === flight.id && n.version === version);
    await feed([checkIn(flight, pnrs[0])]).expect(200);
    await expect.poll(() => noticeOf(1), { timeout: 10_000 }).toBeTruthy();
    // The first notice of the flight brings the whole ranking: nothing was sent before it.
    const first = noticeOf(1)!.ranking!;
    expect(first.kind).toBe('full');
    let held = applyCandidatesAnswer(undefined, first)!;
    for (const [i, pnr] of pnrs.slice(1).entries()) {
      await feed([checkIn(flight, pnr)]).expect(200);
      await expect.poll(() => noticeOf(i + 2), { timeout: 10_000 }).toBeTruthy();
      const ranking = noticeOf(i + 2)!.ranking!;
      expect(ranking.kind).toBe('patch');
      held = applyCandidatesAnswer(held, ranking)!;
      expect(held).not.toBeNull();
      expect(comparable(held)).toEqual(comparable(await full(agent, flight)));
    }
    expect(held.counts.checkedIn).toBe(3);
  });

  it('a proposal through the API reaches the ranking at once: its units show their selection', async () => {
    const { flight, pnrs } = await flightOfTwo();
    await feed([checkIn(flight, pnrs[1])]).expect(200);
    await scheduler.flush();
    const held = await full(agent, flight);
    expect(held.counts.seatsShort).toBe(1);
    expect(held.candidates.every((c) => c.selection === null)).toBe(true);
    await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short after check-in' }).expect(201);
    const answer = await since(agent, flight, held.tag);
    if (answer.kind !== 'patch') throw new Error(`expected a patch, got ${answer.kind}`);
    const patched = applyCandidatesPatch(held, answer)!;
    expect(patched.candidates.filter((c) => c.selection?.status === 'proposed')).toHaveLength(1);
    expect(comparable(patched)).toEqual(comparable(await full(other, flight)));
  });

  it('a tag it no longer holds gets the whole ranking; a malformed one is a 400 naming since', async () => {
    const { flight } = await flightOfTwo();
    const answer = await since(agent, flight, 'gone.1');
    expect(answer.kind).toBe('full');
    const bad = await agent.get(`${path(flight)}?since=${encodeURIComponent('<x>')}`).expect(400);
    expect(JSON.stringify(bad.body)).toContain('since');
  });

  it('answers "not found" for a flight of another station, as for one that does not exist', async () => {
    const flight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1 });
    await agent.get(`/api/flights/${flight.id + 1_000_000}/denial-candidates`).expect(404);
  });

  it('a departed flight leaves memory at the clock tick, and is read again if someone still asks', async () => {
    const flight = await createFlight(db, { station: 'BOS', destination: 'ORD', seats: 1, departure: new Date(Date.now() - 3 * 3_600_000) });
    const before = await full(agent, flight);
    expect(liveStoreOf(db).get(flight.id)).toBeDefined();
    await scheduler.tick();
    expect(liveStoreOf(db).get(flight.id)).toBeUndefined();
    const after = await full(agent, flight);
    expect(after.flight).toEqual(before.flight);
    expect(after.tag).not.toBe(before.tag);
  });
});
