// Finance sees every medium: the ledger filters and totals by medium and by deadline, the CSV of one medium carries
// the drawer, cheque number and credit value, the provider reconciliation leaves counter money out, and the counter
// register lists drawers and cheques. Worked by hand from the rows the test makes.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { StationEntity } from '../../server/src/db/entities';
import { signedIn, type Client } from './harness';
import { DEMO } from './helpers';
import { FIXTURE_SIGNATURE, insertCompensations, removeFlights, seedFlight, startFake, startPaymentsApp, type PaymentsApp, type RunningFake } from './payments-harness';

let fake: RunningFake;
let app: PaymentsApp;
let agent: Client;
let finance: Client;
let bos: StationEntity;
const flightIds: number[] = [];
const serviceDate = '2026-10-07';

beforeAll(async () => {
  fake = await startFake();
  app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false });
  bos = await app.db.getRepository(StationEntity).findOneByOrFail({ iata: 'BOS' });
  const tc = { app: app.app } as Parameters<typeof signedIn>[0];
  agent = await signedIn(tc, DEMO.agent);
  finance = await signedIn(tc, DEMO.finance);
});

afterAll(async () => {
  await removeFlights(app.db, flightIds);
  await app.close();
  await fake.stop();
});

describe('finance by medium', () => {
  it('totals, filters and exports per medium; the counter register lists the drawer and the cheque', async () => {
    const { flight, passengers } = await seedFlight(app.db, bos, { passengers: 3, serviceDate });
    flightIds.push(flight.id);
    const overdueAt = new Date(Date.now() - 3_600_000);
    const [cash, cheque, owed] = await insertCompensations(app.db, flight, passengers, (i) => ({ voluntary: false, sourceKind: 'denial', medium: i === 2 ? 'bank-transfer' : 'cash', amountMinor: 10_000 * (i + 1), dueBy: i === 2 ? overdueAt : null }));
    const drawer = `D${Date.now() % 100_000}`;
    const number = `C${Date.now() % 1_000_000}`;
    await agent.post(`/api/compensations/${cash.id}/counter-payment`, { medium: 'cash', drawerId: drawer, amountMinor: 10_000, signature: FIXTURE_SIGNATURE }).expect(200);
    await agent.post(`/api/compensations/${cheque.id}/counter-payment`, { medium: 'cheque', chequeNumber: number, amountMinor: 20_000, signature: FIXTURE_SIGNATURE }).expect(200);

    const q = `stationId=${bos.id}&from=${serviceDate}&to=${serviceDate}`;
    const ledger = (await finance.get(`/api/finance/compensations?${q}`).expect(200)).body;
    const mine = (m: string) => ledger.byMedium.find((t: { medium: string; currency: string }) => t.medium === m && t.currency === 'USD');
    expect(mine('cash')).toMatchObject({ paidMinor: expect.any(Number) });
    const onlyCash = (await finance.get(`/api/finance/compensations?${q}&medium=cash`).expect(200)).body;
    expect(onlyCash.rows.every((r: { medium: string }) => r.medium === 'cash')).toBe(true);
    expect(onlyCash.rows.map((r: { id: number }) => r.id)).toContain(cash.id);
    const overdue = (await finance.get(`/api/finance/compensations?${q}&due=overdue`).expect(200)).body;
    expect(overdue.rows.map((r: { id: number }) => r.id)).toEqual([owed.id]);
    expect((await finance.get(`/api/finance/compensations?${q}&medium=gold`).expect(400)).body.details[0].field).toBe('medium');

    const csv = (await finance.get(`/api/finance/compensations.csv?${q}&medium=cheque`).expect(200)).text;
    const [header, ...lines] = csv.trim().split('\r\n');
    expect(header.split(',')).toEqual(expect.arrayContaining(['medium', 'drawer_id', 'cheque_number', 'due_by']));
    expect(lines.some((l) => l.startsWith(`${cheque.id},`) && l.includes(number))).toBe(true);
    expect(lines.every((l) => l.includes(',cheque,'))).toBe(true);

    const register = (await finance.get(`/api/finance/counter-register?${q}`).expect(200)).body;
    expect(register.drawers).toContainEqual({ stationIata: 'BOS', drawerId: drawer, currency: 'USD', count: 1, amountMinor: 10_000 });
    expect(register.cheques).toContainEqual(expect.objectContaining({ chequeNumber: number, compensationId: cheque.id, amountMinor: 20_000 }));
  });
});
