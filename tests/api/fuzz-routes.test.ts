// Property-based fuzzing of every route the app registers (taken from its router, so a new route is fuzzed without
// anyone listing it): hostile and near-valid bodies, query strings and path parameters, sent by a caller the route
// admits. Properties: never a 5xx; every refusal is our own JSON with a code; a 400 names the field and the rule;
// a refused request writes nothing (every table's row count unchanged).
// Outside sources: OWASP ASVS 5.0 V1 (encoding and sanitization) and V2 (validation and business logic), level 2,
// input validation "against an allow-list of expected structure" (requirement wording from memory); fast-check's
// documentation on `fc.asyncProperty` and `numRuns`.
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/common';
import { createIntegrationKey } from '../../server/src/modules/integrations/integration-keys.service';
import { Client, startTestApp, type TestApp } from './harness';
import { registeredRoutes } from './route-walk';
import { ROUTES, routeKey } from './route-table';
import {
  bodyArbitrary, expectStructuredRefusal, paramArbitrary, queryArbitrary, rowCounter, schemaFieldNames, signedInAs, startFuzzApp, type FuzzApp,
} from './fuzz-helpers';

/** Cases per route; with every route of the app this is well over 10,000 requests in all. */
const CASES_PER_ROUTE = Number(process.env.FUZZ_CASES_PER_ROUTE ?? 150);
const SEED = Number(process.env.FUZZ_SEED ?? 20261203);

let shared: TestApp;
let f: FuzzApp;
let fields: string[];
let realIds: number[];
let feedKey: string;
let counts: () => Promise<Record<string, number>>;
const callers = new Map<Role | 'public', Client>();
const tally = { cases: 0, byStatus: {} as Record<number, number>, accepted: 0, msByRoute: {} as Record<string, number> };

/** The demo users as loaded, put back whenever a fuzzed request to the users routes happens to be valid. */
let demoUsers: { id: number; role: string; active: number; password_hash: string }[];
let demoStations: { user_id: number; station_id: number }[];

async function signInAll() {
  for (const role of ['agent', 'supervisor', 'finance', 'admin'] as const) callers.set(role, await signedInAs(f, role));
  const anonymous = new Client(f.app);
  await anonymous.refreshCsrf();
  callers.set('public', anonymous);
}

const demoUserState = async () => JSON.stringify([
  await f.db.query('SELECT id, role, active, password_hash FROM users WHERE id IN (?) ORDER BY id', [demoUsers.map((u) => u.id)]),
  await f.db.query('SELECT user_id, station_id FROM user_stations WHERE user_id IN (?) ORDER BY user_id, station_id', [demoUsers.map((u) => u.id)]),
]);
let demoUsersAsLoaded: string;

async function restoreDemoUsers() {
  if ((await demoUserState()) === demoUsersAsLoaded) return;
  for (const u of demoUsers) await f.db.query('UPDATE users SET role = ?, active = ?, password_hash = ? WHERE id = ?', [u.role, u.active, u.password_hash, u.id]);
  await f.db.query('DELETE FROM user_stations WHERE user_id IN (?)', [demoUsers.map((u) => u.id)]);
  for (const s of demoStations) await f.db.query('INSERT INTO user_stations (user_id, station_id) VALUES (?, ?)', [s.user_id, s.station_id]);
  await signInAll();
}

beforeAll(async () => {
  shared = await startTestApp();
  f = await startFuzzApp(shared.db, 'fuzz');
  fields = await schemaFieldNames();
  demoUsers = await f.db.query('SELECT id, role, active, password_hash FROM users');
  demoStations = await f.db.query('SELECT user_id, station_id FROM user_stations');
  demoUsersAsLoaded = await demoUserState();
  await signInAll();
  // Objects for the id routes to find: a round and a denial proposal on demo flights, made the way a desk makes them.
  const [first, second] = (await f.db.query('SELECT id FROM flights ORDER BY id LIMIT 2')) as { id: number }[];
  const agent = callers.get('agent')!;
  await agent.post(`/api/flights/${first.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: 1 });
  await agent.post(`/api/flights/${second.id}/denial-proposals`, { seatsNeeded: 1, reason: 'fuzz fixture' });
  const ids = await f.db.query(`SELECT id FROM flights UNION SELECT id FROM stations UNION SELECT id FROM volunteer_rounds
    UNION SELECT id FROM denial_proposals UNION SELECT id FROM denials UNION SELECT id FROM integration_keys`);
  realIds = [...new Set((ids as { id: number }[]).map((r) => Number(r.id)))];
  feedKey = (await createIntegrationKey(f.db, 1, 'fuzz feed', { label: 'fuzz test' })).key;
  counts = await rowCounter(f.db);
}, 240_000);

afterAll(async () => {
  // Measured figures, for the reliability section of the README.
  console.log(`[fuzz] ${tally.cases} requests over ${registeredRoutes(f.app).length} routes, seed ${SEED}; statuses ${JSON.stringify(tally.byStatus)}; ${tally.accepted} happened to be valid`);
  const slowest = Object.entries(tally.msByRoute).sort((a, b) => b[1] - a[1]).slice(0, 8);
  console.log(`[fuzz] slowest routes (ms): ${slowest.map(([k, ms]) => `${k} ${ms}`).join('; ')}`);
  await f?.close();
  await shared?.close();
});

function send(c: Client, method: string, url: string, body: unknown, bearer?: string) {
  const agent = c.agent;
  const req = method === 'GET' ? agent.get(url) : method === 'POST' ? agent.post(url) : method === 'PUT' ? agent.put(url) : method === 'PATCH' ? agent.patch(url) : agent.delete(url);
  req.set('X-CSRF-Token', c.csrf);
  if (bearer) req.set('Authorization', `Bearer ${bearer}`);
  if (method === 'GET' || method === 'DELETE') return req;
  // Now and then a body that is not JSON at all, or JSON cut short, as a broken client sends it.
  if (typeof body === 'string' && body.startsWith('raw:')) return req.set('Content-Type', 'application/json').send(body.slice(4));
  // A bare number, string, boolean or null is valid JSON too; supertest sends only objects as JSON by itself.
  if (body === null || typeof body !== 'object') return req.set('Content-Type', 'application/json').send(JSON.stringify(body) ?? 'null');
  return req.send(body as object);
}

const routes = () => registeredRoutes(f.app);

describe('fuzzing every route', () => {
  it('covers every registered route with a row saying who may call it', () => {
    const tabled = new Set(ROUTES.map((r) => routeKey(r.method, r.pattern)));
    expect(routes().filter((k) => !k.startsWith('GET /bid') && !tabled.has(k))).toEqual([]);
  });

  it('never answers 5xx, refuses in our own words naming the field, and writes nothing when it refuses or reads', async () => {
    const fuzzed = routes().filter((k) => k.startsWith('GET /api') || !k.startsWith('GET '));
    for (const key of fuzzed) {
      const [method, pattern] = key.split(' ');
      const row = ROUTES.find((r) => routeKey(r.method, r.pattern) === key);
      if (!row) continue;
      const who: Role | 'public' = row.access === 'public' || row.access === 'api-key' ? 'public' : row.access[0];
      const params = (pattern.match(/:[A-Za-z]+/g) ?? []).map(() => paramArbitrary(realIds));
      const body = fc.oneof({ weight: 12, arbitrary: bodyArbitrary(fields) }, { weight: 1, arbitrary: fc.string({ maxLength: 30 }).map((s) => `raw:{${s}`) });
      const property = fc.asyncProperty(fc.tuple(...params), queryArbitrary(fields), body, async (values, query, payload) => {
        let i = 0;
        const url = pattern.replace(/:[A-Za-z]+/g, () => values[i++]) + (query ? `?${query}` : '');
        // A read writes nothing whatever it is asked, so reads are checked once per route (below), writes per request.
        const before = method === 'GET' ? null : await counts();
        const res = await send(callers.get(who)!, method, url, payload, row.access === 'api-key' ? feedKey : undefined);
        tally.cases += 1;
        tally.byStatus[res.status] = (tally.byStatus[res.status] ?? 0) + 1;
        const what = `${method} ${url} ${JSON.stringify(payload).slice(0, 300)}`;
        expectStructuredRefusal(res, what);
        if (res.status >= 400 && before) {
          expect(await counts(), `${what} was refused with ${res.status} but wrote rows`).toEqual(before);
        }
        if (res.status < 400) {
          tally.accepted += 1;
          await f.idle();
          if (method !== 'GET' && pattern.startsWith('/api/users')) await restoreDemoUsers();
        }
        if (res.status === 401 && who !== 'public') await signInAll();
      });
      const t0 = Date.now();
      const beforeRoute = await counts();
      await fc.assert(property, { numRuns: CASES_PER_ROUTE, seed: SEED, endOnFailure: true });
      if (method === 'GET') expect(await counts(), `${key} wrote rows while answering reads`).toEqual(beforeRoute);
      tally.msByRoute[key] = Date.now() - t0;
    }
    expect(tally.cases).toBeGreaterThanOrEqual(10_000);
  }, 1_800_000);
});
