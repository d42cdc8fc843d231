// Finance's ledger and period report over rows made straight in the database at two test stations (one US, one
// EU): filters, totals per currency over exactly the filtered rows, the CSV export of exactly what is filtered,
// Form 251 lines for the US station read from the denial records, the equivalent counts for the EU station, and
// finance-only access.
// Outside sources: BTS Form 251 "Report of Passengers Denied Confirmed Space" and 14 CFR 250.10 (quarterly, line 7
// total boardings); RFC 4180 (CSV with a header line); OWASP "CSV Injection" (cells starting with = + - @ are
// neutralised) — from memory.
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CompensationEntity, FlightEntity, StationEntity, UserEntity } from '../../server/src/db/entities';
import { Client, signedIn } from './harness';
import { DEMO, insertUser, removeRunUsers, TEST_PASSWORD } from './helpers';
import { insertCompensations, paymentsTestStation, removeFlights, seedFlight, startPaymentsApp, type PaymentsApp } from './payments-harness';

let app: PaymentsApp;
let us: StationEntity;
let eu: StationEntity;
let finance: Client;
let user: UserEntity;
const flightIds: number[] = [];
const rows: CompensationEntity[] = [];
let octFlight: FlightEntity;
let euFlight: FlightEntity;

async function flightWith(station: StationEntity, serviceDate: string, over: ((i: number) => Partial<CompensationEntity>)[]) {
  const { flight, passengers } = await seedFlight(app.db, station, { passengers: over.length, serviceDate });
  flightIds.push(flight.id);
  const made = await insertCompensations(app.db, flight, passengers, (i) => over[i](i));
  rows.push(...made);
  return { flight, made, passengers };
}

/** A denial record as the denials module leaves it once the compensation is fixed: authorized, with its category. */
async function denial(flight: FlightEntity, passengerIds: number[], bookingId: number, category: string) {
  const proposal = await app.db.query(
    `INSERT INTO denial_proposals (flight_id, station_id, status, seats_needed, proposed_by_user_id, proposed_by_label, reason)
     VALUES (?, ?, 'authorized', 1, ?, 'finance test', 'finance test')`,
    [flight.id, flight.stationId, user.id],
  );
  const result = await app.db.query(
    `INSERT INTO denials (proposal_id, flight_id, station_id, booking_id, passenger_ids, position, reasons, status, selected_by_user_id, category)
     VALUES (?, ?, ?, ?, ?, 1, '[]', 'authorized', ?, ?)`,
    [proposal.insertId, flight.id, flight.stationId, bookingId, JSON.stringify(passengerIds), user.id, category],
  );
  return result.insertId as number;
}

beforeAll(async () => {
  app = await startPaymentsApp({ stripeApiUrl: 'http://127.0.0.1:9', startWorker: false });
  us = await paymentsTestStation(app.db, 'BTV');
  // Bologna: an Italian airport, where Regulation (EC) 261/2004 applies.
  eu = await paymentsTestStation(app.db, 'BLQ', { regime: 'eu-261', currency: 'EUR', timeZone: 'Europe/Rome' });
  const stale: { id: number }[] = await app.db.query('SELECT id FROM flights WHERE station_id IN (?)', [[us.id, eu.id]]);
  await app.db.query('DELETE FROM denials WHERE station_id IN (?)', [[us.id, eu.id]]);
  await app.db.query('DELETE FROM denial_proposals WHERE station_id IN (?)', [[us.id, eu.id]]);
  await removeFlights(app.db, stale.map((f) => f.id));
  user = await insertUser(app.db, { label: 'finance-ledger', role: 'finance', stationIds: [us.id, eu.id] });
  finance = new Client(app.app);
  await finance.signIn(user.email, TEST_PASSWORD);

  // October: two volunteers paid, one involuntary denial 1a paid, one 2a owed nothing; November: a voided one,
  // one 1b issued, one failed. Amounts in USD minor units.
  const oct = await flightWith(us, '2026-10-05', [
    () => ({ state: 'issued', amountMinor: 40_000 }),
    () => ({ state: 'settled', amountMinor: 60_000, form: 'voucher' }),
    () => ({ state: 'issued', amountMinor: 50_000, voluntary: false, sourceKind: 'denial', band: 'us-200pct' }),
    () => ({ state: 'due', amountMinor: 0, voluntary: false, sourceKind: 'denial', band: 'us-none-within-1h' }),
  ]);
  octFlight = oct.flight;
  const nov = await flightWith(us, '2026-11-12', [
    () => ({ state: 'voided', amountMinor: 80_000, voidReason: 'test' }),
    () => ({ state: 'issued', amountMinor: 107_500, voluntary: false, sourceKind: 'denial', band: 'us-400pct' }),
    () => ({ state: 'failed', amountMinor: 30_000, lastError: 'test refusal' }),
  ]);
  // The denial records the report reads for lines 1 and 2; their compensations point back at them.
  for (const [flightRows, index, category] of [[oct, 2, '1a'], [oct, 3, '2a'], [nov, 1, '1b']] as const) {
    const comp = flightRows.made[index];
    const id = await denial(flightRows.flight, [comp.passengerId], comp.bookingId, category);
    await app.db.query('UPDATE compensations SET source_id = ? WHERE id = ?', [id, comp.id]);
  }
  // A party of two refused on line 2c with no compensation rows at all: still two denied passengers.
  await denial(octFlight, [999_999_998, 999_999_999], oct.passengers[0].bookingId, '2c');
  const euRows = await flightWith(eu, '2026-12-01', [
    (i) => ({ state: 'issued', amountMinor: 40_000 + i, currency: 'EUR', regime: 'eu-261', voluntary: false, sourceKind: 'denial', band: 'eu-medium' }),
    () => ({ state: 'due', amountMinor: 60_000, currency: 'EUR', regime: 'eu-261', voluntary: false, sourceKind: 'denial', band: 'eu-long' }),
    () => ({ state: 'settled', amountMinor: 25_000, currency: 'EUR', regime: 'eu-261', band: 'volunteer' }),
  ]);
  euFlight = euRows.flight;
  for (const comp of euRows.made.slice(0, 2)) {
    const id = await denial(euFlight, [comp.passengerId], comp.bookingId, '1a');
    await app.db.query('UPDATE compensations SET source_id = ? WHERE id = ?', [id, comp.id]);
  }
  // One passenger with a name a spreadsheet would run as a formula.
  await app.db.query(`UPDATE passengers SET first_name = '=HYPERLINK("x")' WHERE id = ?`, [nov.passengers[2].id]);
});

afterAll(async () => {
  await app.db.query('DELETE FROM denials WHERE station_id IN (?)', [[us.id, eu.id]]);
  await app.db.query('DELETE FROM denial_proposals WHERE station_id IN (?)', [[us.id, eu.id]]);
  await removeFlights(app.db, flightIds);
  await removeRunUsers(app.db);
  await app.close();
});

describe('the ledger', () => {
  it('filters by station and dates, and totals per currency over exactly the filtered rows', async () => {
    const res = await finance.get(`/api/finance/compensations?stationId=${us.id}&from=2026-10-01&to=2026-10-31`).expect(200);
    expect(res.body.total).toBe(4);
    expect(res.body.rows.every((r: { flight: string }) => r.flight === `ZP ${octFlight.flightNumber}`)).toBe(true);
    // derived: 400.00 + 600.00 + 500.00 + 0; paid are the issued and spent ones (1,500.00); nothing owed or lost.
    expect(res.body.totals).toEqual([{ currency: 'USD', count: 4, amountMinor: 150_000, paidMinor: 150_000, owedMinor: 0, lostMinor: 0 }]);
  });

  it('filters by state and regime, and pages', async () => {
    const voided = await finance.get(`/api/finance/compensations?stationId=${us.id}&state=voided`).expect(200);
    expect(voided.body.rows.map((r: { id: number }) => r.id)).toEqual([rows[4].id]);
    // A voided payment leaves the passenger owed: it is counted, and owed, never subtracted.
    expect(voided.body.totals).toEqual([{ currency: 'USD', count: 1, amountMinor: 80_000, paidMinor: 0, owedMinor: 80_000, lostMinor: 80_000 }]);
    const eur = await finance.get('/api/finance/compensations?regime=eu-261').expect(200);
    expect(eur.body.totals.map((t: { currency: string }) => t.currency)).toEqual(['EUR']);
    const page2 = await finance.get(`/api/finance/compensations?stationId=${us.id}&pageSize=3&page=2`).expect(200);
    expect(page2.body).toMatchObject({ total: 7, page: 2, pageSize: 3 });
    expect(page2.body.rows).toHaveLength(3);
  });

  it('names the field and the rule for a bad filter', async () => {
    const res = await finance.get('/api/finance/compensations?from=2026-11-01&to=2026-10-01&state=lost').expect(400);
    expect(res.body.details.map((d: { field: string }) => d.field)).toEqual(expect.arrayContaining(['state']));
    const dates = await finance.get('/api/finance/compensations?from=2026-11-01&to=2026-10-01').expect(400);
    expect(dates.body.details).toEqual([{ field: 'to', rule: 'to must not be before from' }]);
  });

  it('answers 404 for a station the user does not belong to', async () => {
    const demo = await signedIn({ app: app.app } as Parameters<typeof signedIn>[0], DEMO.finance);
    await demo.get(`/api/finance/compensations?stationId=${us.id}`).expect(404);
  });

  it('exports exactly the filtered rows as CSV, every page of them, formulas neutralised', async () => {
    const res = await finance.get(`/api/finance/compensations.csv?stationId=${us.id}&pageSize=1`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="compensations-\d{4}-\d{2}-\d{2}\.csv"$/);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    const expected = rows.filter((r) => r.stationId === us.id).map((r) => String(r.id)).sort();
    expect(parsed.data.map((r) => r.compensation_id).sort()).toEqual(expected);
    const row = parsed.data.find((r) => r.compensation_id === String(rows[5].id))!;
    expect(row).toMatchObject({ amount: '1075.00', amount_minor: '107500', currency: 'USD', ledger_state: 'issued', kind: 'involuntary' });
    const formula = parsed.data.find((r) => r.compensation_id === String(rows[6].id))!;
    expect(formula.passenger.startsWith("'=")).toBe(true);
  });
});

describe('the period report', () => {
  it('gives the Form 251 lines for a US station, from the denial records', async () => {
    const res = await finance.get(`/api/finance/report?quarter=2026-Q4&stationId=${us.id}`).expect(200);
    expect(res.body).toMatchObject({ quarter: '2026-Q4', from: '2026-10-01', to: '2026-12-31', form: 'us-form-251', source: 'denials' });
    const line = Object.fromEntries(res.body.lines.map((l: { code: string }) => [l.code, l]));
    expect([line['1a'].count, line['1b'].count, line['2a'].count, line['2b'].count, line['2c'].count]).toEqual([1, 1, 1, 0, 2]);
    expect(line['3'].count).toBe(5);
    // Line 4: involuntary passengers actually paid (the 1a and the 1b one).
    expect(line['4'].count).toBe(2);
    // Line 5: every volunteer, the voided and the refused payments included (the volunteering happened).
    expect(line['5'].count).toBe(4);
    // Line 7: passengers boarded on the station's flights of the quarter (derived: 4 + 3).
    expect(line['7'].count).toBe(7);
    expect(line['8a'].amounts).toEqual([{ currency: 'USD', amountMinor: 50_000 }]);
    expect(line['8b'].amounts).toEqual([{ currency: 'USD', amountMinor: 107_500 }]);
    // Line 8(c): money only; the 600.00 voucher is left out (BTS Form 251 instructions, para. F).
    expect(line['8c'].amounts).toEqual([{ currency: 'USD', amountMinor: 40_000 }]);
    expect(line['x-vouchers'].amounts).toEqual([{ currency: 'USD', amountMinor: 60_000 }]);
    // derived: 800.00 voided + 300.00 refused, both still owed.
    expect(line['x-owed'].amounts).toEqual([{ currency: 'USD', amountMinor: 110_000 }]);
    expect(res.body.perDay).toEqual([
      { date: '2026-10-05', currency: 'USD', voluntaryPaidMinor: 40_000, involuntaryPaidMinor: 50_000, owedMinor: 0 },
      { date: '2026-11-12', currency: 'USD', voluntaryPaidMinor: 0, involuntaryPaidMinor: 107_500, owedMinor: 110_000 },
    ]);
  });

  it('gives the equivalent counts and sums for an EU 261 station', async () => {
    const res = await finance.get(`/api/finance/report?quarter=2026-Q4&stationId=${eu.id}`).expect(200);
    expect(res.body.form).toBe('eu-261');
    const line = Object.fromEntries(res.body.lines.map((l: { code: string }) => [l.code, l]));
    expect(line.V1.count).toBe(1);
    expect(line.D1.count).toBe(2);
    expect(line.D5.amounts).toEqual([{ currency: 'EUR', amountMinor: 40_000 }]);
    expect(line.O.amounts).toEqual([{ currency: 'EUR', amountMinor: 60_000 }]);
  });

  it('exports the report as CSV and refuses a malformed quarter', async () => {
    const res = await finance.get(`/api/finance/report.csv?quarter=2026-Q4&stationId=${us.id}`).expect(200);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    expect(parsed.data.find((r) => r.code === '3')).toMatchObject({ section: 'line', count: '5' });
    expect(parsed.data.filter((r) => r.section === 'day')).toHaveLength(6);
    expect(parsed.data.find((r) => r.code === '8c')!.source).toMatch(/vouchers/);
    const bad = await finance.get(`/api/finance/report?quarter=2026-4&stationId=${us.id}`).expect(400);
    expect(bad.body.details[0]).toEqual({ field: 'quarter', rule: 'quarter must look like 2026-Q4' });
  });
});

describe('only finance reaches finance routes', () => {
  it('refuses agents, supervisors and admins', async () => {
    for (const email of [DEMO.agent, DEMO.supervisor, DEMO.admin]) {
      const c = await signedIn({ app: app.app } as Parameters<typeof signedIn>[0], email);
      for (const path of ['/api/finance/compensations', '/api/finance/compensations.csv', '/api/finance/reconciliations', `/api/finance/report?quarter=2026-Q4&stationId=${us.id}`]) {
        const res = await c.get(path);
        expect(res.status, `${email} ${path}`).toBe(403);
      }
      expect((await c.post('/api/finance/reconciliations', {})).status).toBe(403);
    }
  });
});
