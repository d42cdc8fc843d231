// Integration keys: the full key is shown once at creation and never again, the feed accepts it until it is revoked,
// and only the station's admins manage keys. Runs on a station of its own.
// Outside sources, from memory: OWASP Secrets Management Cheat Sheet (show a generated secret once, store only a
// hash, allow revocation); RFC 6750 §3.1 (a bearer token that is revoked is "invalid_token", answered with 401).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createdIntegrationKeySchema, integrationKeyListSchema } from '@shared/schemas/integration-events';
import { AuditLogEntity, IntegrationKeyEntity, StationEntity } from '../../server/src/db/entities';
import { Client, startTestApp, type TestApp } from './harness';
import { RUN_ID, TEST_PASSWORD, insertUser, removeRunUsers, stationIdByIata } from './helpers';
import request from 'supertest';

let t: TestApp;
let station: StationEntity;
let bos: number;
const as = {} as Record<'admin' | 'supervisor' | 'agent', Client>;
const url = (stationId: number) => `/api/stations/${stationId}/integration-keys`;

/** Bergen, a real airport in Norway: a station of these tests alone, created once and reused. */
async function testStation(): Promise<StationEntity> {
  const repo = t.db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'BGO' })) ?? repo.save(repo.create({ iata: 'BGO', name: 'Bergen (API test station)', timeZone: 'Europe/Oslo', regime: 'eu-261', currency: 'NOK' }));
}

async function signInAs(role: 'admin' | 'supervisor' | 'agent'): Promise<Client> {
  const user = await insertUser(t.db, { label: `keys-${role}`, role, stationIds: [station.id] });
  const c = new Client(t.app);
  expect((await c.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  return c;
}

/** One event for a flight that does not exist: an accepted key gets 200 with the event rejected, a bad key 401. */
function sendFeed(key: string) {
  const event = { id: `keys-${RUN_ID}`, type: 'booking.cancelled', occurredAt: new Date().toISOString(), flight: { carrier: 'ZZ', number: '1', date: '2031-01-01' }, pnr: 'NOSUCH' };
  return request(t.app).post('/api/integrations/events').set('Authorization', `Bearer ${key}`).send({ events: [event] });
}

beforeAll(async () => {
  t = await startTestApp();
  station = await testStation();
  bos = await stationIdByIata(t.db, 'BOS');
  for (const role of ['admin', 'supervisor', 'agent'] as const) as[role] = await signInAs(role);
});
afterAll(async () => {
  await removeRunUsers(t.db);
  await t.close();
});

describe('a key’s life', () => {
  it('shows the key once, never lists it, works on the feed, and after revocation is refused with 401', async () => {
    const name = `Departure control ${RUN_ID}`;
    const created = createdIntegrationKeySchema.parse((await as.admin.post(url(station.id), { name }).expect(201)).body);
    expect(created.key).toMatch(/^bbk_[A-Za-z0-9_-]{32}$/);
    expect(created.prefix).toBe(created.key.slice(0, 10));
    expect(created).toMatchObject({ name, stationId: station.id, revokedAt: null, lastUsedAt: null });

    const listed = await as.admin.get(url(station.id)).expect(200);
    const list = integrationKeyListSchema.parse(listed.body);
    expect(list.keys.find((k) => k.id === created.id)).toMatchObject({ name, prefix: created.prefix, revokedAt: null });
    expect(listed.text).not.toContain(created.key);
    expect(listed.text).not.toContain('keyHash');
    // Only a hash is stored.
    const stored = await t.db.getRepository(IntegrationKeyEntity).findOneByOrFail({ id: created.id });
    expect(stored.keyHash).not.toContain(created.key);
    expect(stored.keyHash).toMatch(/^[0-9a-f]{64}$/);

    const accepted = await sendFeed(created.key).expect(200);
    expect(accepted.body.results[0].status).toBe('rejected');
    const used = integrationKeyListSchema.parse((await as.admin.get(url(station.id)).expect(200)).body).keys.find((k) => k.id === created.id);
    expect(used?.lastUsedAt).not.toBeNull();

    const revoked = await as.admin.delete(`${url(station.id)}/${created.id}`).expect(200);
    expect(revoked.body.revokedAt).not.toBeNull();
    const refused = await sendFeed(created.key).expect(401);
    expect(refused.body.error).toBe('invalid_api_key');
    await sendFeed('bbk_not-a-key').expect(401);

    const actions = (await t.db.getRepository(AuditLogEntity).findBy({ entityType: 'integration_key', entityId: String(created.id) })).map((a) => a.action).sort();
    expect(actions).toEqual(['integration_key.created', 'integration_key.revoked']);
  });

  it('wants a name', async () => {
    const res = await as.admin.post(url(station.id), { name: '  ' }).expect(400);
    expect(res.body.details).toEqual([{ field: 'name', rule: 'name is required' }]);
  });
});

describe('who may', () => {
  it('lets only the station’s admins manage keys and hides other stations', async () => {
    for (const role of ['agent', 'supervisor'] as const) {
      await as[role].get(url(station.id)).expect(403);
      await as[role].post(url(station.id), { name: 'nope' }).expect(403);
    }
    await as.admin.get(url(bos)).expect(404);
    await as.admin.post(url(bos), { name: 'nope' }).expect(404);
  });
});
