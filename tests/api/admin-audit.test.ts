// The audit viewer: a station's rows filtered by flight, person, action and time, paged, and as CSV whose cells a
// spreadsheet cannot run as formulas (OWASP "CSV Injection": cells starting with =, +, - or @ are escaped).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { auditPageSchema } from '@shared/schemas/audit-log';
import { Client, startTestApp, type TestApp } from './harness';
import { RUN_ID, TEST_PASSWORD, foreignStation, insertUser, removeRunUsers, stationIdByIata } from './helpers';

let t: TestApp;
let admin: Client;
let email: string;
let yul: number;
let foreign: number;
const NUMBER = `${1000 + Math.floor(Math.random() * 8999)}A`;
let flightId: number;

beforeAll(async () => {
  t = await startTestApp();
  yul = await stationIdByIata(t.db, 'YUL');
  foreign = (await foreignStation(t.db)).id;
  const user = await insertUser(t.db, { label: 'audit-admin', role: 'admin', stationIds: [yul] });
  email = user.email;
  admin = new Client(t.app);
  expect((await admin.signIn(email, TEST_PASSWORD)).status).toBe(200);
  const made = await admin.post(`/api/stations/${yul}/flights`, { carrierCode: 'ZZ', flightNumber: NUMBER, serviceDate: '2027-01-15', departureTime: '07:40', blockMinutes: 95, destination: 'YYZ', seatsByCabin: { Y: 120 }, gate: 'B3' });
  expect(made.status, JSON.stringify(made.body)).toBe(201);
  flightId = made.body.id;
  expect((await admin.patch(`/api/flights/${flightId}`, { gate: 'A7' })).status).toBe(200);
  expect((await admin.post(`/api/flights/${flightId}/cancel`, { reason: '@cmd weather' })).status).toBe(200);
});
afterAll(async () => {
  await t.db.query("DELETE FROM flights WHERE carrier_code = 'ZZ' AND flight_number = ?", [NUMBER]);
  await removeRunUsers(t.db);
  await t.close();
});

describe('the audit viewer', () => {
  it('finds a flight’s rows, newest first, by the flight', async () => {
    const page = auditPageSchema.parse((await admin.get(`/api/stations/${yul}/audit?flightId=${flightId}`)).body);
    expect(page.rows.map((r) => r.action)).toEqual(['flight.cancelled', 'flight.updated', 'flight.created']);
    expect(page.rows.every((r) => r.actor === email)).toBe(true);
    expect(page.actions).toEqual(expect.arrayContaining(['flight.created', 'flight.cancelled']));
  });

  it('filters by person, action prefix and time', async () => {
    const byActor = auditPageSchema.parse((await admin.get(`/api/stations/${yul}/audit?actor=${encodeURIComponent(`audit-admin-${RUN_ID}`)}&action=flight.up`)).body);
    expect(byActor.rows.map((r) => r.action)).toEqual(['flight.updated']);
    const future = auditPageSchema.parse((await admin.get(`/api/stations/${yul}/audit?flightId=${flightId}&from=2099-01-01T00:00:00Z`)).body);
    expect(future.rows).toEqual([]);
    const bad = await admin.get(`/api/stations/${yul}/audit?from=yesterday`);
    expect(bad.status).toBe(400);
    expect(bad.body.details[0].field).toBe('from');
    const reversed = await admin.get(`/api/stations/${yul}/audit?from=2026-12-02T00:00:00Z&to=2026-12-01T00:00:00Z`);
    expect(reversed.body.details[0].field).toBe('to');
  });

  it('pages with beforeId without repeating or skipping a row', async () => {
    const first = auditPageSchema.parse((await admin.get(`/api/stations/${yul}/audit?flightId=${flightId}&beforeId=${Number.MAX_SAFE_INTEGER}`)).body);
    const next = auditPageSchema.parse((await admin.get(`/api/stations/${yul}/audit?flightId=${flightId}&beforeId=${first.rows[0].id}`)).body);
    expect(next.rows.map((r) => r.id)).toEqual(first.rows.slice(1).map((r) => r.id));
  });

  it('exports the same filter as CSV with formula-looking cells escaped', async () => {
    // Who acted is free text from an integration's name: one that looks like a formula must not run as one.
    await t.db.query("INSERT INTO audit_log (actor_label, action, entity_type, entity_id, station_id) VALUES (?, 'demo.note', 'demo', ?, ?)", [`=HYPERLINK("http://x") ${RUN_ID}`, NUMBER, yul]);
    const evil = Papa.parse<string[]>((await admin.get(`/api/stations/${yul}/audit.csv?actor=${RUN_ID}&action=demo.note`)).text.trim());
    expect(evil.data[1][2]).toBe(`'=HYPERLINK("http://x") ${RUN_ID}`);
    const res = await admin.get(`/api/stations/${yul}/audit.csv?flightId=${flightId}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const parsed = Papa.parse<string[]>(res.text.trim());
    expect(parsed.data[0]).toEqual(['id', 'at_utc', 'actor', 'action', 'entity_type', 'entity_id', 'before', 'after']);
    expect(parsed.data.slice(1).map((r) => r[3])).toEqual(['flight.cancelled', 'flight.updated', 'flight.created']);
    // JSON cells start with "{", so they are safe as they are; a plain cell that starts with "=" or "@" gets a quote.
    expect(parsed.data.every((r) => r.every((c) => !/^[=+\-@]/.test(c)))).toBe(true);
  });

  it('answers "not found" for another station', async () => {
    expect((await admin.get(`/api/stations/${foreign}/audit`)).status).toBe(404);
    expect((await admin.get(`/api/stations/${foreign}/audit.csv`)).status).toBe(404);
  });
});
