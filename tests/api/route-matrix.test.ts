// Table-driven access control over every API route (rows in route-table.ts): nobody signed in -> 401, a role not
// on the row -> 403, another station's object -> the row's otherStation status, each allowed role -> success.
// Outside source, from memory: OWASP Authorization Cheat Sheet ("deny by default", check every request, scope data
// to the caller) and RFC 9110 §15.5.2/§15.5.4 (401 when no credentials were presented, 403 when they are not enough).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '@shared/schemas/common';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, foreignStation, insertUser, removeRunUsers, stationIdByIata, uniqueEmail } from './helpers';
import { ROUTES, routeKey, type RouteCall, type RouteContext, type RouteRow } from './route-table';
import { registeredRoutes } from './route-walk';
import { denialRouteContext, removeDenialFixtures } from './denials-fixtures';
import { removeVolunteerRouteFixtures, volunteerRouteContext } from './volunteers-route-context';
import { paymentsRouteContext, removePaymentsRouteFixtures, startMatrixPaymentsStandIn } from './payments-route-context';
import { learningRouteContext, removeLearningRouteFixtures } from './learning-route-context';
import { FlightEntity } from '../../server/src/db/entities';
import { createIntegrationKey } from '../../server/src/modules/integrations/integration-keys.service';
import { enqueueMessage } from '../../server/src/modules/outbox/outbox.service';
import { adminRouteContext, removeAdminRouteFixtures } from './admin-route-context';

/** A flight at the station no demo user belongs to, made once and reused by later runs. */
async function foreignFlight(db: TestApp['db'], stationId: number) {
  const repo = db.getRepository(FlightEntity);
  const existing = await repo.findOneBy({ stationId, flightNumber: '9001' });
  if (existing) return existing;
  const departure = new Date(Date.now() + 6 * 3_600_000);
  return repo.save(repo.create({ stationId, carrierCode: 'ZZ', flightNumber: '9001', serviceDate: departure.toISOString().slice(0, 10), origin: 'TOS', destination: 'OSL', scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + 6_000_000), aircraftType: '320', seatsByCabin: { Y: 150 }, gate: null, state: 'check-in-open', shock: null }));
}

let t: TestApp;
let ctx: RouteContext;
const failedNotices: Record<'own' | 'other', string[]> = { own: [], other: [] };
const asRole = {} as Record<Role, Client>;

beforeAll(async () => {
  // Before the app is built: the payments routes reach a stand-in on loopback, never the real provider.
  await startMatrixPaymentsStandIn();
  t = await startTestApp();
  const ownStationId = await stationIdByIata(t.db, 'BOS');
  const other = await foreignStation(t.db);
  const ownUser = await insertUser(t.db, { label: 'matrix-own', role: 'agent', stationIds: [ownStationId] });
  const otherUser = await insertUser(t.db, { label: 'matrix-other', role: 'agent', stationIds: [other.id] });
  const ownFlight = await t.db.getRepository(FlightEntity).findOneByOrFail({ stationId: ownStationId, flightNumber: '107' });
  const otherFlight = await foreignFlight(t.db, other.id);
  // Failed notices to re-queue: one per call the matrix makes (every call builds its URL, refused ones included).
  for (const [scope, flight] of [['own', ownFlight], ['other', otherFlight]] as const) {
    for (let i = 0; i < 8; i++) {
      const { id } = await t.db.transaction((em) => enqueueMessage(em, { stationId: flight.stationId, flightId: flight.id, passengerIds: [], kind: 'volunteer-confirmation', to: 'matrix@passengers.bumpboard.test', subject: 'Route matrix notice', text: 'Route matrix notice' }));
      await t.db.query("UPDATE outbox_messages SET status = 'failed', last_error = 'route matrix' WHERE id = ?", [id]);
      failedNotices[scope].push(id);
    }
  }
  const ownKey = await createIntegrationKey(t.db, ownStationId, 'route matrix (own)', { label: 'route matrix test' });
  const otherKey = await createIntegrationKey(t.db, other.id, 'route matrix (other)', { label: 'route matrix test' });
  ctx = {
    ownStationId, otherStationId: other.id, ownUserId: ownUser.id, otherUserId: otherUser.id, uniqueEmail,
    ownFlightId: ownFlight.id, otherFlightId: otherFlight.id, ownKeyId: ownKey.id, otherKeyId: otherKey.id, ownFeedKey: (await createIntegrationKey(t.db, ownStationId, 'route matrix feed', { label: 'route matrix test' })).key,
    ownFlightRef: { carrier: ownFlight.carrierCode, number: ownFlight.flightNumber, date: ownFlight.serviceDate },
    failedNoticeId: (scope) => {
      const pool = failedNotices[scope];
      const id = pool.shift();
      if (!id) throw new Error(`the matrix ran out of failed notices for scope ${scope}`);
      return id;
    },
    denials: await denialRouteContext(t.db, otherFlight),
    volunteers: await volunteerRouteContext(t, { ownStationId, otherFlight, requesterUserId: ownUser.id }),
    payments: await paymentsRouteContext(t.db, { ownStationId, otherFlight }),
    admin: await adminRouteContext(t.db, { own: { id: ownStationId, iata: 'BOS' }, other: { id: other.id, iata: other.iata } }),
    learning: await learningRouteContext(t.db, { ownStationId, otherStationId: other.id }),
  };
  for (const role of ROLES) asRole[role] = await signedIn(t, DEMO[role]);
});
afterAll(async () => {
  await removeDenialFixtures(t.db);
  await removeVolunteerRouteFixtures(t.db, () => t.forecast.flush());
  await removePaymentsRouteFixtures(t.db);
  await removeAdminRouteFixtures(t.db);
  await removeLearningRouteFixtures(t.db);
  await removeRunUsers(t.db);
  await t.close();
});

function send(c: Client, row: RouteRow, call: RouteCall) {
  switch (row.method) {
    case 'GET':
      return c.get(call.url);
    case 'POST':
      return c.post(call.url, call.body);
    case 'PATCH':
      return c.patch(call.url, call.body);
    case 'PUT':
      return c.put(call.url, call.body);
    case 'DELETE':
      return c.delete(call.url);
  }
}

/** Not signed in, but holding a CSRF token, so a refusal is about the missing sign-in and nothing else. */
async function anonymous(): Promise<Client> {
  const c = new Client(t.app);
  await c.refreshCsrf();
  return c;
}

describe('the route table', () => {
  it('has a row for every route registered in the app, and no row for a route that is not registered', () => {
    const registered = registeredRoutes(t.app);
    const tabled = ROUTES.map((r) => routeKey(r.method, r.pattern));
    expect(registered.filter((k) => !tabled.includes(k)), 'routes with no row in tests/api/route-table.ts').toEqual([]);
    expect(tabled.filter((k) => !registered.includes(k)), 'rows naming no registered route').toEqual([]);
  });

  it('has one row per route', () => {
    const keys = ROUTES.map((r) => routeKey(r.method, r.pattern));
    expect(keys.filter((k, i) => keys.indexOf(k) !== i)).toEqual([]);
  });
});

describe.each(ROUTES.map((row) => [routeKey(row.method, row.pattern), row] as const))('%s', (_key, row) => {
  if (row.access === 'public') {
    it(`answers a caller who is not signed in with ${row.success}`, async () => {
      const res = await send(await anonymous(), row, row.call(ctx, 'own'));
      expect(res.status, JSON.stringify(res.body)).toBe(row.success);
    });
    return;
  }
  if (row.access === 'api-key') {
    it('refuses every caller without a station key with 401, signed in or not', async () => {
      for (const c of [await anonymous(), ...ROLES.map((r) => asRole[r])]) {
        const res = await send(c, row, row.call(ctx, 'own'));
        expect(res.status).toBe(401);
        expect(res.body.error).toBe('invalid_api_key');
      }
    });
    it(`answers a caller with the station's key with ${row.success}`, async () => {
      const call = row.call(ctx, 'own');
      const res = await new Client(t.app).agent.post(call.url).set('Authorization', `Bearer ${ctx.ownFeedKey}`).send(call.body as object);
      expect(res.status, JSON.stringify(res.body)).toBe(row.success);
    });
    return;
  }
  const allowed = row.access;
  const refused = ROLES.filter((r) => !allowed.includes(r));

  it('refuses a caller who is not signed in with 401', async () => {
    const res = await send(await anonymous(), row, row.call(ctx, 'own'));
    expect(res.status).toBe(401);
    expect(res.body.error).toBe('not_signed_in');
  });

  if (refused.length) {
    it.each(refused)('refuses the %s role with 403', async (role) => {
      const res = await send(asRole[role], row, row.call(ctx, 'own'));
      expect(res.status).toBe(403);
      expect(res.body.error).toBe('forbidden');
    });
  }

  it.each(allowed)(`answers the %s role with ${row.success}`, async (role) => {
    const res = await send(asRole[role], row, row.call(ctx, 'own'));
    expect(res.status, JSON.stringify(res.body)).toBe(row.success);
  });

  const otherStation = row.otherStation;
  if (otherStation) {
    it.each(allowed)(`answers the %s role ${otherStation} for another station's object`, async (role) => {
      const res = await send(asRole[role], row, row.call(ctx, 'other'));
      expect(res.status).toBe(otherStation);
      expect(res.body.error).toBe(otherStation === 404 ? 'not_found' : 'forbidden');
    });
  }
});

describe('station-scoped lists', () => {
  it('lists only the caller’s own stations', async () => {
    for (const role of ROLES) {
      const res = await asRole[role].get('/api/stations').expect(200);
      const ids: number[] = res.body.stations.map((s: { id: number }) => s.id);
      expect(ids).toContain(ctx.ownStationId);
      expect(ids).not.toContain(ctx.otherStationId);
    }
  });

  it('lists to an admin only the users who share one of the admin’s stations', async () => {
    const res = await asRole.admin.get('/api/users').expect(200);
    const ids: number[] = res.body.users.map((u: { id: number }) => u.id);
    expect(ids).toContain(ctx.ownUserId);
    expect(ids).not.toContain(ctx.otherUserId);
  });
});

describe('the route walk', () => {
  it('finds routes in nested routers, with their parameters, and every method of a route', async () => {
    const { default: express, Router } = await import('express');
    const inner = Router();
    inner.get('/', () => undefined);
    inner.route('/:id').patch(() => undefined).delete(() => undefined);
    const api = Router();
    api.use('/things/:thingId/parts', inner);
    const app = express();
    app.use('/api', api);
    app.post('/top', () => undefined);
    expect(registeredRoutes(app)).toEqual([
      'DELETE /api/things/:thingId/parts/:id',
      'GET /api/things/:thingId/parts',
      'PATCH /api/things/:thingId/parts/:id',
      'POST /top',
    ]);
  });
});
