// The refunds a rule adds to a denied passenger's compensation: computed when the denial is rebooked (or when a
// downgrade is recorded later), stored apart with their rule, paid once through the compensation's media, and
// counted apart from compensation by finance. Check values are worked by hand from the rules' text, source beside each.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ruleRefundsResponseSchema } from '@shared/schemas/refunds';
import { ledgerResponseSchema, periodReportSchema } from '@shared/schemas/finance';
import { receiptResponseSchema } from '@shared/schemas/payment-media';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO } from './helpers';
import { addBooking, addSingles, createFlight, removeDenialFixtures, type PassengerSpec } from './denials-fixtures';
import { FIXTURE_SIGNATURE } from './payments-harness';

let t: TestApp;
let agent: Client;
let supervisor: Client;
let finance: Client;

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor, finance] = await Promise.all([signedIn(t, DEMO.agent), signedIn(t, DEMO.supervisor), signedIn(t, DEMO.finance)]);
});
afterAll(async () => {
  await removeDenialFixtures(t.db);
  await t.close();
});

/** A full flight where the booking `denied` checked in last: the default rules select it, a supervisor authorizes. */
async function authorizedCase(station: string, destination: string, denied: PassengerSpec, currency: string, cabins?: Record<string, number>) {
  const flight = await createFlight(t.db, { station, destination, seats: 30, cabins });
  await addSingles(t.db, flight, 30, { fareMinor: 20_000, fareCurrency: currency });
  // A business cabin of one seat taken by an earlier check-in: the denied business passenger is the one short.
  if (cabins?.J) await addBooking(t.db, flight, [{ first: 'Early', last: 'Business', cabin: 'J', checkedInBefore: 120, fareCurrency: currency, fareMinor: 40_000 }]);
  const { passengers } = await addBooking(t.db, flight, [{ checkedInBefore: 30, fareCurrency: currency, ...denied }]);
  const proposal = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'oversold at the gate' }).expect(201)).body;
  await supervisor.post(`/api/denial-proposals/${proposal.id}/authorize`).expect(200);
  return { flight, denialId: proposal.denials[0].id as number, passenger: passengers[0] };
}

const refundsOf = async (flightId: number) => ruleRefundsResponseSchema.parse((await agent.get(`/api/flights/${flightId}/refunds`).expect(200)).body).refunds;

describe('refunds the rules add to compensation', () => {
  it('US: a denied passenger gets the seat (USD 35) and bag (USD 40) fees back, USD 75, beside the compensation (14 CFR Part 260, 260.1(a))', async () => {
    const fees = [{ kind: 'seat' as const, amountMinor: 3_500, currency: 'USD' }, { kind: 'bag' as const, amountMinor: 4_000, currency: 'USD' }];
    const c = await authorizedCase('BOS', 'ORD', { first: 'Fiona', last: 'Feepaid', fareMinor: 25_000, optionalFees: fees }, 'USD');
    const ledgerQuery = { stationId: c.flight.stationId, from: c.flight.serviceDate, to: c.flight.serviceDate };
    const before = ledgerResponseSchema.parse((await finance.get('/api/finance/compensations').query(ledgerQuery).expect(200)).body);
    await agent.post(`/api/denials/${c.denialId}/rebook`, { noAlternate: true }).expect(200);

    const [refund, ...others] = await refundsOf(c.flight.id);
    expect(others).toEqual([]);
    expect(refund).toMatchObject({
      passengerId: c.passenger.id, kind: 'optional-fees', amountMinor: 7_500, currency: 'USD', paymentState: 'due', medium: 'cash',
      lines: [{ label: 'Seat selection', amountMinor: 3_500 }, { label: 'Checked bag', amountMinor: 4_000 }], ruleRef: expect.stringMatching(/14 CFR/),
    });
    const payments = (await agent.get(`/api/flights/${c.flight.id}/compensations`).expect(200)).body.compensations as { id: number; sourceKind: string; amountMinor: number }[];
    expect(payments.map((p) => [p.sourceKind, p.amountMinor]).sort()).toEqual([['denial', 100_000], ['fee-refund', 7_500]]);
    const audits = await t.db.query(`SELECT action FROM audit_log WHERE entity_type = 'rule_refund' AND entity_id = ?`, [String(refund.id)]);
    expect(audits).toEqual([{ action: 'refund.due' }]);

    // Paid at the counter through the compensation's own path; the same request sent three times at once pays once.
    const body = { medium: 'cash', drawerId: 'D-REFUND', amountMinor: 7_500, signature: FIXTURE_SIGNATURE };
    const answers = await Promise.all([1, 2, 3].map(() => agent.post(`/api/compensations/${refund.paymentCompensationId}/counter-payment`, body)));
    expect(answers.map((a) => a.status).filter((s) => s === 200).length).toBeGreaterThanOrEqual(1);
    expect(answers.every((a) => a.status === 200 || a.status === 409)).toBe(true);
    const count = async (sql: string, id: number) => Number((await t.db.query(sql, [id]))[0].n);
    expect(await count('SELECT COUNT(*) AS n FROM counter_payments WHERE compensation_id = ?', refund.paymentCompensationId)).toBe(1);
    expect((await refundsOf(c.flight.id))[0].paymentState).toBe('settled');
    const { receipt } = receiptResponseSchema.parse((await agent.get(`/api/compensations/${refund.paymentCompensationId}/receipt`).expect(200)).body);
    expect(receipt.lines[0]).toBe(`Receipt for refund no. ${refund.paymentCompensationId} (Refund: optional fees not received)`);
    expect(await count(`SELECT COUNT(*) AS n FROM audit_log WHERE action = 'compensation.paid_at_counter' AND entity_id = CAST(? AS CHAR)`, refund.paymentCompensationId)).toBe(1);

    // Finance: the compensation totals grow by the compensation only (USD 1,000: 400 % of USD 250 is 1,000, under the
    // USD 2,150 cap, 14 CFR 250.5(a)(3)); the refund totals by the refund only.
    const after = ledgerResponseSchema.parse((await finance.get('/api/finance/compensations').query(ledgerQuery).expect(200)).body);
    const usd = (list: { currency: string; amountMinor: number }[]) => list.find((x) => x.currency === 'USD')?.amountMinor ?? 0;
    expect(usd(after.totals) - usd(before.totals)).toBe(100_000);
    expect(usd(after.refundTotals) - usd(before.refundTotals)).toBe(7_500);
    const csv = (await finance.get('/api/finance/compensations.csv').query(ledgerQuery).expect(200)).text;
    expect(csv.split('\r\n').find((l) => l.startsWith(`${refund.paymentCompensationId},`))).toMatch(/,refund: optional-fees,/);
  });

  it('EU: a downgrade recorded after the denial adds its Art. 10(2) refund: FCO-HAM 1,326 km (CJEU C-559/16), EUR 400 ticket, 30 % = EUR 120', async () => {
    const c = await authorizedCase('FCO', 'HAM', { first: 'Dario', last: 'Downgrade', fareMinor: 40_000, cabin: 'J', optionalFees: [{ kind: 'seat', amountMinor: 2_000, currency: 'EUR' }] }, 'EUR', { J: 1, Y: 30 });
    await agent.post(`/api/denials/${c.denialId}/rebook`, { noAlternate: true }).expect(200);
    // Reg. 261/2004 has no separate refund of optional fees: nothing yet.
    expect(await refundsOf(c.flight.id)).toEqual([]);
    await agent.post(`/api/flights/${c.flight.id}/cabin-changes`, { passengerId: c.passenger.id, flownCabin: 'Y', fareDifferenceMinor: 15_000, reason: 'alternate in economy' }).expect(201);
    const refunds = await refundsOf(c.flight.id);
    expect(refunds).toHaveLength(1);
    expect(refunds[0]).toMatchObject({ kind: 'downgrade', amountMinor: 12_000, currency: 'EUR', ruleRef: expect.stringMatching(/Art\. 10\(2\): 30 %/) });

    const quarter = `${c.flight.serviceDate.slice(0, 4)}-Q${Math.floor((Number(c.flight.serviceDate.slice(5, 7)) - 1) / 3) + 1}`;
    const report = periodReportSchema.parse((await finance.get('/api/finance/report').query({ quarter, stationId: c.flight.stationId }).expect(200)).body);
    const line = report.lines.find((l) => l.code === 'refund-downgrade');
    expect(line?.amounts?.find((a) => a.currency === 'EUR')?.amountMinor).toBeGreaterThanOrEqual(12_000);
    expect(report.lines.find((l) => l.code === 'refund-optional-fees')).toBeDefined();
    const csv = (await finance.get('/api/finance/report.csv').query({ quarter, stationId: c.flight.stationId }).expect(200)).text;
    expect(csv).toMatch(/line,refund-downgrade,/);
  });
});
