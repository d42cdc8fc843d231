// Passengers accommodated in another cabin, recorded at the desk with the fare difference, fill the period report:
// BTS Form 251 line 6 (a) upgrades, (b) downgrades (OMB No. 2138-0018) for a US station, and for an EU station the
// Art. 10 lines of Reg. (EC) 261/2004: 30 % of the ticket price for flights of 1,500 km or less (Art. 10(2)(a)).
// Distance check value: Rome Fiumicino–Hamburg 1,326 km (CJEU C-559/16 Bossen).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FlightEntity, PassengerEntity, StationEntity } from '../../server/src/db/entities';
import { Client } from './harness';
import { insertUser, removeRunUsers, TEST_PASSWORD } from './helpers';
import { paymentsTestStation, removeFlights, seedFlight, startPaymentsApp, type PaymentsApp } from './payments-harness';

let app: PaymentsApp;
let us: StationEntity;
let eu: StationEntity;
let agent: Client;
let finance: Client;
let outsider: Client;
const flightIds: number[] = [];

async function signedInAs(role: 'agent' | 'finance', stationIds: number[]) {
  const user = await insertUser(app.db, { label: `cabin-${role}`, role, stationIds });
  const c = new Client(app.app);
  await c.signIn(user.email, TEST_PASSWORD);
  return c;
}

/** A two-cabin flight (J and Y) in the first quarter of 2027, its passengers booked in `cabin`. */
async function twoCabinFlight(station: StationEntity, destination: string, cabin: 'J' | 'Y', passengers = 2): Promise<{ flight: FlightEntity; passengers: PassengerEntity[] }> {
  const made = await seedFlight(app.db, station, { passengers, serviceDate: '2027-03-03', destination });
  flightIds.push(made.flight.id);
  await app.db.query(`UPDATE flights SET seats_by_cabin = '{"J": 16, "Y": 150}' WHERE id = ?`, [made.flight.id]);
  await app.db.query('UPDATE passengers SET cabin = ? WHERE flight_id = ?', [cabin, made.flight.id]);
  return made;
}

beforeAll(async () => {
  app = await startPaymentsApp({ stripeApiUrl: 'http://127.0.0.1:9', startWorker: false });
  // Manchester, New Hampshire (US) and Rome Fiumicino (EU): stations no demo user belongs to.
  us = await paymentsTestStation(app.db, 'MHT');
  eu = await paymentsTestStation(app.db, 'FCO', { regime: 'eu-261', currency: 'EUR', timeZone: 'Europe/Rome' });
  const stale: { id: number }[] = await app.db.query('SELECT id FROM flights WHERE station_id IN (?)', [[us.id, eu.id]]);
  await removeFlights(app.db, stale.map((f) => f.id));
  agent = await signedInAs('agent', [us.id, eu.id]);
  finance = await signedInAs('finance', [us.id, eu.id]);
  outsider = await signedInAs('agent', [(await paymentsTestStation(app.db, 'BGR')).id]);
});

afterAll(async () => {
  await removeFlights(app.db, flightIds);
  await removeRunUsers(app.db);
  await app.close();
});

const lines = async (stationId: number) => {
  const res = await finance.get(`/api/finance/report?quarter=2027-Q1&stationId=${stationId}`).expect(200);
  return Object.fromEntries(res.body.lines.map((l: { code: string }) => [l.code, l])) as Record<string, { count: number | null; amounts: unknown; source: string }>;
};

describe('the desk records a cabin change', () => {
  it('reimburses a downgrade on Rome–Hamburg at 30 % of the ticket (derived: 30 % of 250.00 = 75.00) and counts it', async () => {
    const { flight, passengers } = await twoCabinFlight(eu, 'HAM', 'J');
    const res = await agent.post(`/api/flights/${flight.id}/cabin-changes`, { passengerId: passengers[0].id, flownCabin: 'Y', fareDifferenceMinor: 30_000, reason: 'Business cabin oversold' }).expect(201);
    expect(res.body.cabinChange).toMatchObject({ direction: 'downgrade', bookedCabin: 'J', flownCabin: 'Y', owedMinor: 7_500, owedRule: expect.stringMatching(/Art\. 10\(2\): 30 %.*band a/) });
    const listed = await agent.get(`/api/flights/${flight.id}/cabin-changes`).expect(200);
    expect(listed.body.cabinChanges).toHaveLength(1);
    const line = await lines(eu.id);
    expect(line.C2).toMatchObject({ count: 1, amounts: [{ currency: 'USD', amountMinor: 7_500 }] });
    expect(line.C2.source).toMatch(/Art\. 10\(2\)/);
  });

  it('fills Form 251 lines 6(a) and 6(b) instead of leaving them untracked', async () => {
    const up = await twoCabinFlight(us, 'ORD', 'Y');
    const down = await twoCabinFlight(us, 'ORD', 'J');
    await agent.post(`/api/flights/${up.flight.id}/cabin-changes`, { passengerId: up.passengers[0].id, flownCabin: 'J', fareDifferenceMinor: 0, reason: 'Economy oversold' }).expect(201);
    await agent.post(`/api/flights/${down.flight.id}/cabin-changes`, { passengerId: down.passengers[0].id, flownCabin: 'Y', fareDifferenceMinor: 12_000, reason: 'Business oversold' }).expect(201);
    const line = await lines(us.id);
    expect(line['6a'].count).toBe(1);
    expect(line['6b']).toMatchObject({ count: 1, amounts: [{ currency: 'USD', amountMinor: 12_000 }] });
  });

  it('names the field and the rule for a bad change, records a passenger once, and hides other stations’ flights', async () => {
    const { flight, passengers } = await twoCabinFlight(us, 'ORD', 'J');
    const url = `/api/flights/${flight.id}/cabin-changes`;
    const bad = await agent.post(url, { passengerId: passengers[0].id, flownCabin: 'Q', fareDifferenceMinor: -5, reason: '' }).expect(400);
    expect(bad.body.details.map((d: { field: string }) => d.field).sort()).toEqual(['fareDifferenceMinor', 'flownCabin', 'reason']);
    expect((await agent.post(url, { passengerId: passengers[0].id, flownCabin: 'F', fareDifferenceMinor: 0, reason: 'none such' }).expect(400)).body.details[0].field).toBe('flownCabin');
    expect((await agent.post(url, { passengerId: passengers[0].id, flownCabin: 'J', fareDifferenceMinor: 0, reason: 'same cabin' }).expect(400)).body.details[0].field).toBe('flownCabin');
    await agent.post(url, { passengerId: passengers[0].id, flownCabin: 'Y', fareDifferenceMinor: 5_000, reason: 'first' }).expect(201);
    expect((await agent.post(url, { passengerId: passengers[0].id, flownCabin: 'Y', fareDifferenceMinor: 5_000, reason: 'again' }).expect(409)).body.error).toBe('already_recorded');
    await outsider.get(url).expect(404);
    const audit = await app.db.query("SELECT COUNT(*) AS n FROM audit_log WHERE action = 'cabin_change.recorded' AND station_id = ?", [us.id]);
    expect(Number(audit[0].n)).toBeGreaterThanOrEqual(1);
  });
});
