// A station's meal allowances and partner hotels (admins, station-scoped, audited), and care costs in finance's ledger,
// apart from compensation. Amounts are our own test values in minor units (EUR 15.00 = 1500, ISO 4217 exponent 2).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, foreignStation, insertUser, removeRunUsers, stationIdByIata, TEST_PASSWORD } from './helpers';
import { addBooking, addSingles, createFlight, removeDenialFixtures } from './denials-fixtures';

let t: TestApp;
let admin: Client;
let agent: Client;
let supervisor: Client;
let finance: Client;
let otherAdmin: Client;
let fco: number;
let tos: number;
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp();
  [admin, agent, supervisor, finance] = await Promise.all([signedIn(t, DEMO.admin), signedIn(t, DEMO.agent), signedIn(t, DEMO.supervisor), signedIn(t, DEMO.finance)]);
  fco = await stationIdByIata(t.db, 'FCO');
  tos = (await foreignStation(t.db)).id;
  const other = await insertUser(t.db, { label: 'care-admin-elsewhere', role: 'admin', stationIds: [tos] });
  otherAdmin = new Client(t.app);
  await otherAdmin.signIn(other.email, TEST_PASSWORD);
});
afterAll(async () => {
  if (flightIds.length) for (const table of ['care_given', 'passenger_choices', 'ticket_refunds']) await t.db.query(`DELETE FROM ${table} WHERE flight_id IN (?)`, [flightIds]);
  await removeDenialFixtures(t.db);
  await removeRunUsers(t.db);
  await t.close();
});

const hotel = { name: 'Hotel Larkfield Fiumicino', address: 'Via dell’Aeroporto 1, Fiumicino', phone: '+39 06 0000 0000', nightlyRateMinor: 11_000 };

describe('station care setup', () => {
  it('an admin sets allowances and hotels in the station’s currency; a hotel keeps its id when saved again; audited', async () => {
    const saved = (await admin.put(`/api/stations/${fco}/care-setup`, { refreshmentMinor: 500, mealMinor: 1_500, hotels: [hotel] }).expect(200)).body.setup;
    expect(saved).toMatchObject({ stationId: fco, currency: 'EUR', refreshmentMinor: 500, mealMinor: 1_500, configured: true, hotels: [{ ...hotel, id: expect.stringMatching(/^h-/) }] });
    const id = saved.hotels[0].id;
    const again = (await admin.put(`/api/stations/${fco}/care-setup`, { refreshmentMinor: 600, mealMinor: 1_500, hotels: [{ ...hotel, id, nightlyRateMinor: 12_000 }] }).expect(200)).body.setup;
    expect(again.hotels).toEqual([{ ...hotel, id, nightlyRateMinor: 12_000 }]);
    expect((await admin.get(`/api/stations/${fco}/care-setup`).expect(200)).body.setup.refreshmentMinor).toBe(600);
    const [last] = await t.db.query(`SELECT action, actor_label, JSON_EXTRACT(after, '$.refreshmentMinor') AS r FROM audit_log WHERE action = 'care_setup.saved' AND entity_id = ? ORDER BY id DESC LIMIT 1`, [String(fco)]);
    expect(last).toMatchObject({ action: 'care_setup.saved', actor_label: DEMO.admin, r: 600 });
  });

  it('bad input names the field and the rule; nothing changes', async () => {
    const before = (await admin.get(`/api/stations/${fco}/care-setup`).expect(200)).body.setup;
    const cases: [unknown, string][] = [
      [{ refreshmentMinor: -1, mealMinor: 1_500, hotels: [] }, 'refreshmentMinor'],
      [{ refreshmentMinor: 500, mealMinor: 15.5, hotels: [] }, 'mealMinor'],
      [{ refreshmentMinor: 500, mealMinor: 1_500 }, 'hotels'],
      [{ refreshmentMinor: 500, mealMinor: 1_500, hotels: [{ ...hotel, name: '' }] }, 'hotels.0.name'],
      [{ refreshmentMinor: 500, mealMinor: 1_500, hotels: [{ ...hotel, id: 'h-unknown' }] }, 'hotels.0.id'],
      [{ refreshmentMinor: 500, mealMinor: 1_500, hotels: [hotel, hotel] }, 'hotels.1.name'],
    ];
    for (const [body, field] of cases) {
      const res = await admin.put(`/api/stations/${fco}/care-setup`, body).expect(400);
      expect(res.body.details[0].field, JSON.stringify(res.body)).toBe(field);
    }
    expect((await admin.get(`/api/stations/${fco}/care-setup`).expect(200)).body.setup).toEqual(before);
  });

  it('another station’s admin gets "not found"; other roles are refused', async () => {
    await otherAdmin.get(`/api/stations/${fco}/care-setup`).expect(404);
    await otherAdmin.put(`/api/stations/${fco}/care-setup`, { refreshmentMinor: 1, mealMinor: 1, hotels: [] }).expect(404);
    await agent.get(`/api/stations/${fco}/care-setup`).expect(403);
  });
});

describe('care costs in the ledger, apart from compensation', () => {
  it('a hotel night booked at a partner hotel and a meal voucher appear as care costs with their totals; free care does not', async () => {
    const flight = await createFlight(t.db, { station: 'FCO', destination: 'HAM', seats: 1 });
    flightIds.push(flight.id);
    await addSingles(t.db, flight, 1, { fareMinor: 15_000, fareCurrency: 'EUR' });
    await addBooking(t.db, flight, [{ first: 'Nora', last: 'Night', checkedInBefore: 30, fareMinor: 9_900, fareCurrency: 'EUR' }]);
    const alternate = await createFlight(t.db, { station: 'FCO', destination: 'HAM', seats: 150, after: flight, laterBy: 17 * 60 });
    const proposal = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'oversold at the gate' }).expect(201)).body;
    await supervisor.post(`/api/denial-proposals/${proposal.id}/authorize`).expect(200);
    await agent.post(`/api/denials/${proposal.denials[0].id}/rebook`, { alternateFlightId: alternate.id }).expect(200);
    const care = (await agent.get(`/api/flights/${flight.id}/care`).expect(200)).body;
    const [p] = care.passengers;
    const setup = (await admin.get(`/api/stations/${fco}/care-setup`).expect(200)).body.setup;
    // The hotel's nightly rate is suggested for the night when the wait covers one (Art. 9(1)(b)).
    const night = p.proposal.items.find((i: { kind: string }) => i.kind === 'hotel');
    // Departure 14:00 UTC, alternate 17 h later: about 08:00 the next morning in Rome, so the 01:00-05:00 night is covered.
    expect(p.proposal.nights).toBe(1);
    expect(night.suggestedMinor).toBe(setup.hotels[0].nightlyRateMinor);
    await agent.post(`/api/compensations/${p.compensationId}/care`, { kind: 'hotel', description: 'One night', amountMinor: 12_000, hotelId: setup.hotels[0].id, providedBy: 'Hotel desk' }).expect(201);
    await agent.post(`/api/compensations/${p.compensationId}/care`, { kind: 'meal', description: 'Meal voucher', amountMinor: 1_500, providedBy: 'Gate agent' }).expect(201);
    await agent.post(`/api/compensations/${p.compensationId}/care`, { kind: 'communication', description: 'Two calls', providedBy: 'Gate agent' }).expect(201);
    const ledger = (await finance.get(`/api/care/ledger?stationId=${fco}&from=${flight.serviceDate}&to=${flight.serviceDate}`).expect(200)).body;
    const mine = ledger.rows.filter((r: { flightId: number }) => r.flightId === flight.id);
    expect(mine.map((r: { kind: string; amountMinor: number }) => [r.kind, r.amountMinor]).sort()).toEqual([['hotel', 12_000], ['meal', 1_500]]);
    const sum = ledger.rows.filter((r: { currency: string }) => r.currency === 'EUR').reduce((s: number, r: { amountMinor: number }) => s + r.amountMinor, 0);
    expect(ledger.totals.find((x: { currency: string }) => x.currency === 'EUR').amountMinor).toBe(sum);
    // By kind, station and flight: each view sums to the same total, per currency.
    const eurTotal = ledger.totals.find((x: { currency: string }) => x.currency === 'EUR').amountMinor;
    for (const view of ['byKind', 'byStation', 'byFlight'] as const) {
      expect(ledger[view].filter((x: { currency: string }) => x.currency === 'EUR').reduce((s: number, x: { amountMinor: number }) => s + x.amountMinor, 0), view).toBe(eurTotal);
    }
    expect(ledger.byFlight.find((x: { flightId: number }) => x.flightId === flight.id)).toMatchObject({ station: 'FCO', currency: 'EUR', count: 2, amountMinor: 13_500 });
    expect(ledger.byKind.map((x: { kind: string }) => x.kind)).toEqual(expect.arrayContaining(['hotel', 'meal']));
    expect(ledger.byKind.map((x: { kind: string }) => x.kind)).not.toContain('communication');
    const csv = await finance.get(`/api/care/ledger.csv?stationId=${fco}&from=${flight.serviceDate}&to=${flight.serviceDate}`).expect(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    const lines = csv.text.trim().split('\r\n');
    expect(lines[0]).toBe('care_id,station,flight,service_date,passenger,kind,description,currency,amount,amount_minor,provided_by,recorded_at');
    expect(lines.filter((l) => l.includes('Nora Night')).map((l) => l.split(',').slice(5, 10))).toEqual(expect.arrayContaining([
      ['hotel', 'One night', 'EUR', '120.00', '12000'], ['meal', 'Meal voucher', 'EUR', '15.00', '1500'],
    ]));
    // Care is not compensation: the compensation row's amount is unchanged (EUR 250, Art. 7(1)(a)).
    expect((await t.db.query('SELECT amount_minor FROM compensations WHERE id = ?', [p.compensationId]))[0].amount_minor).toBe(25_000);
    const bad = await finance.get('/api/care/ledger?from=yesterday').expect(400);
    expect(bad.body.details[0].field).toBe('from');
  });
});
