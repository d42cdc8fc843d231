// Stations from the screens: only a carrier-wide admin opens one, its zone read from the reference airport data;
// a station admin edits only stations held; every change audited; bad input names the field and the rule.
// Check values: the OpenFlights airports.dat row for Bodø (BOO, ENBO) gives the zone Europe/Oslo.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { stationSettingsSchema } from '@shared/schemas/admin-stations';
import { AuditLogEntity, StationEntity } from '../../server/src/db/entities';
import { Client, startTestApp, type TestApp } from './harness';
import { TEST_PASSWORD, foreignStation, insertUser, removeRunUsers, stationIdByIata } from './helpers';

let t: TestApp;
let carrierWide: Client;
let stationAdmin: Client;
let yul: number;
let foreign: number;
let originalGrace: number;

async function signIn(email: string) {
  const c = new Client(t.app);
  expect((await c.signIn(email, TEST_PASSWORD)).status).toBe(200);
  return c;
}

async function dropBodo() {
  const boo = await t.db.getRepository(StationEntity).findOneBy({ iata: 'BOO' });
  if (boo) await t.db.query('DELETE FROM stations WHERE id = ?', [boo.id]);
}

beforeAll(async () => {
  t = await startTestApp();
  await dropBodo();
  yul = await stationIdByIata(t.db, 'YUL');
  foreign = (await foreignStation(t.db)).id;
  originalGrace = (await t.db.getRepository(StationEntity).findOneByOrFail({ id: yul })).departureGraceMinutes;
  const wide = await insertUser(t.db, { label: 'carrier-wide', role: 'admin', stationIds: [yul] });
  await t.db.query('UPDATE users SET carrier_wide = 1 WHERE id = ?', [wide.id]);
  carrierWide = await signIn(wide.email);
  stationAdmin = await signIn((await insertUser(t.db, { label: 'station-admin', role: 'admin', stationIds: [yul] })).email);
});
afterAll(async () => {
  await t.db.query('UPDATE stations SET departure_grace_minutes = ? WHERE id = ?', [originalGrace, yul]);
  await removeRunUsers(t.db);
  await dropBodo();
  await t.close();
});

describe('opening a station', () => {
  it('is refused to a station admin, who may reach only the stations granted', async () => {
    const res = await stationAdmin.post('/api/stations', { iata: 'BOO', regime: 'eu-261', currency: 'NOK' });
    expect(res.status).toBe(403);
    expect(await t.db.getRepository(StationEntity).findOneBy({ iata: 'BOO' })).toBeNull();
  });

  it('takes its zone and name from the airport data, gives the creator the station, and is audited', async () => {
    const look = await carrierWide.get('/api/stations/airports/boo');
    expect(look.body).toMatchObject({ iata: 'BOO', timeZone: 'Europe/Oslo', country: 'Norway' });
    const res = await carrierWide.post('/api/stations', { iata: 'boo', regime: 'eu-261', currency: 'nok', maxOverbookingPercent: 120 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const s = stationSettingsSchema.parse(res.body);
    expect(s).toMatchObject({ iata: 'BOO', timeZone: 'Europe/Oslo', currency: 'NOK', riskTolerancePercent: 5, departureGraceMinutes: 10, maxOverbookingPercent: 120 });
    expect(s.name).toMatch(/Bod/);
    const mine = await carrierWide.get('/api/stations/settings');
    expect(mine.body.stations.map((x: { iata: string }) => x.iata)).toContain('BOO');
    expect(await t.db.getRepository(AuditLogEntity).findBy({ action: 'station.created', entityId: String(s.id) })).toHaveLength(1);
    expect((await carrierWide.post('/api/stations', { iata: 'BOO', regime: 'eu-261', currency: 'NOK' })).status).toBe(409);
  });

  it('names the field and the rule for a code the airport data lacks, or a bad regime or limit', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ iata: 'XXQ', regime: 'eu-261', currency: 'EUR' }, 'iata'],
      [{ iata: 'KEF', regime: 'iceland', currency: 'ISK' }, 'regime'],
      [{ iata: 'KEF', regime: 'eu-261', currency: 'kr' }, 'currency'],
      [{ iata: 'KEF', regime: 'eu-261', currency: 'ISK', riskTolerancePercent: 80 }, 'riskTolerancePercent'],
    ];
    for (const [body, field] of cases) {
      const res = await carrierWide.post('/api/stations', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.details[0].field).toBe(field);
    }
  });
});

describe('editing a station', () => {
  it('changes the limits of a station held, audited before and after', async () => {
    const res = await stationAdmin.patch(`/api/stations/${yul}`, { departureGraceMinutes: 25 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.departureGraceMinutes).toBe(25);
    const rows = await t.db.getRepository(AuditLogEntity).find({ where: { action: 'station.updated', entityId: String(yul) }, order: { id: 'DESC' }, take: 1 });
    expect(rows[0].before).toMatchObject({ departureGraceMinutes: originalGrace });
    expect(rows[0].after).toMatchObject({ departureGraceMinutes: 25 });
  });

  it('answers "not found" for a station not held, and 400 naming the field for a bad value', async () => {
    expect((await stationAdmin.patch(`/api/stations/${foreign}`, { departureGraceMinutes: 5 })).status).toBe(404);
    const bad = await stationAdmin.patch(`/api/stations/${yul}`, { maxOverbookingPercent: 90 });
    expect(bad.status).toBe(400);
    expect(bad.body.details[0]).toEqual({ field: 'maxOverbookingPercent', rule: 'maxOverbookingPercent must be at least 100' });
  });
});
