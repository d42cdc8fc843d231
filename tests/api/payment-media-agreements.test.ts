// How a compensation reaches the passenger: the media each rule allows, lawful default first; a prepaid card or a
// travel credit only with a complete agreement (exact text, signature, time, staff member, the rule's conditions);
// cash or cheque at the counter with a signed receipt, paid once.
// Sources: 14 CFR 250.8(a) (cash or an immediately negotiable check on the day and at the place of the denial) and
// 250.5(c) (transportation instead only if worth at least the cash amount, the passenger told and free to refuse);
// Reg. (EC) 261/2004 Art. 7(3) (vouchers only with the passenger's signed agreement); SOR/2019-150 (another form only
// of greater value, told in writing, no expiry; 48 h to pay: the regulator's guide) — the Canadian conditions from memory.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { agreementText } from '../../shared/compensation';
import { AuditLogEntity, CompensationEntity, CounterPaymentEntity, PaymentAgreementEntity, StationEntity } from '../../server/src/db/entities';
import { signedIn, type Client } from './harness';
import { DEMO } from './helpers';
import { FIXTURE_SIGNATURE, insertCompensations, removeFlights, seedFlight, startFake, startPaymentsApp, type PaymentsApp, type RunningFake } from './payments-harness';

let fake: RunningFake;
let app: PaymentsApp;
let agent: Client;
let bos: StationEntity;
let yul: StationEntity;
const flightIds: number[] = [];

beforeAll(async () => {
  fake = await startFake();
  app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false });
  bos = await app.db.getRepository(StationEntity).findOneByOrFail({ iata: 'BOS' });
  yul = await app.db.getRepository(StationEntity).findOneByOrFail({ iata: 'YUL' });
  agent = await signedIn({ app: app.app } as Parameters<typeof signedIn>[0], DEMO.agent);
});

afterAll(async () => {
  await removeFlights(app.db, flightIds);
  await app.close();
  await fake.stop();
});

type Over = Parameters<typeof insertCompensations>[3];
const usDenial: Over = () => ({ voluntary: false, sourceKind: 'denial', band: 'us-200pct', ruleRef: '14 CFR 250.5(a)(2)', medium: 'cash', amountMinor: 60_000 });
const caDenial: Over = () => ({ regime: 'ca-appr', voluntary: false, sourceKind: 'denial', band: 'ca-under-6h', ruleRef: 'SOR/2019-150 s. 20(1)', currency: 'CAD', amountMinor: 90_000, medium: 'cash' });

async function one(over: Over, station = bos): Promise<CompensationEntity> {
  const { flight, passengers } = await seedFlight(app.db, station, { passengers: 1 });
  flightIds.push(flight.id);
  const [row] = await insertCompensations(app.db, flight, passengers, over);
  return row;
}

async function deskRow(comp: CompensationEntity) {
  const res = await agent.get(`/api/flights/${comp.flightId}/compensations`).expect(200);
  return res.body.compensations.find((c: { id: number }) => c.id === comp.id);
}

/** The words the desk shows for this card or credit, built from what the desk was given. */
async function shownText(comp: CompensationEntity, medium: 'prepaid-card' | 'travel-credit', valueMinor: number, expiresOn: string | null) {
  const c = await deskRow(comp);
  return agreementText({ passengerName: c.passengerName, flight: c.flight, serviceDate: c.serviceDate, medium, cashAmountMinor: c.amountMinor, valueMinor, currency: c.currency, expiresOn, restrictions: c.payment.terms.restrictions, ruleRef: c.payment.terms.ruleRef });
}

async function agree(comp: CompensationEntity, medium: 'prepaid-card' | 'travel-credit', valueMinor: number, expiresOn: string | null = null) {
  return agent.post(`/api/compensations/${comp.id}/agreement`, { medium, valueMinor, expiresOn, text: await shownText(comp, medium, valueMinor, expiresOn), signature: FIXTURE_SIGNATURE });
}

describe('the media each rule allows, lawful default first', () => {
  it('US denial: cash, cheque, then a card or credit needing agreement, due by the end of the day of the denial', async () => {
    const c = await deskRow(await one(usDenial));
    expect(c.payment.terms.media).toEqual(['cash', 'cheque', 'prepaid-card', 'travel-credit']);
    expect(c.payment.terms.needsAgreement).toEqual(['prepaid-card', 'travel-credit']);
    expect(c.payment.terms.ruleRef).toContain('250.8(a)');
    expect(Date.parse(c.payment.terms.dueBy)).toBeGreaterThan(Date.now());
  });

  it('Canada: due 48 h after the denial', async () => {
    const comp = await one(caDenial, yul);
    const c = await deskRow(comp);
    expect(Date.parse(c.payment.terms.dueBy) - comp.createdAt.getTime()).toBe(48 * 3_600_000);
  });

  it('refuses a bank transfer in a currency the provider does not transfer, naming the field and the currency', async () => {
    const comp = await one(caDenial, yul);
    const res = await agent.post(`/api/compensations/${comp.id}/medium`, { medium: 'bank-transfer' }).expect(400);
    expect(res.body.details[0]).toMatchObject({ field: 'medium' });
    expect(res.body.message).toContain('owed in CAD');
    // Nothing changed: the compensation stays as it was, to be paid another way.
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id })).medium).toBe('cash');
  });

  it('refuses a medium the rule does not allow, naming the field', async () => {
    const comp = await one(usDenial);
    const res = await agent.post(`/api/compensations/${comp.id}/medium`, { medium: 'bank-transfer' }).expect(400);
    expect(res.body.message).toMatch(/^medium: /);
    await agent.post(`/api/compensations/${comp.id}/medium`, { medium: 'gold' }).expect(400);
    const ok = await agent.post(`/api/compensations/${comp.id}/medium`, { medium: 'cheque' }).expect(200);
    expect(ok.body.compensation.medium).toBe('cheque');
  });
});

describe('a card or a credit only with a complete agreement', () => {
  it('refuses to issue a travel credit or a card without the passenger’s agreement', async () => {
    const credit = await one((i) => ({ ...usDenial(i), medium: 'travel-credit', form: 'voucher' }));
    expect((await agent.post(`/api/compensations/${credit.id}/issue`).expect(409)).body.error).toBe('agreement_missing');
    const card = await one(usDenial);
    await agent.post(`/api/compensations/${card.id}/medium`, { medium: 'prepaid-card' }).expect(200);
    expect((await agent.post(`/api/compensations/${card.id}/issue`).expect(409)).body.error).toBe('agreement_missing');
    expect([...fake.fake.store.state.cards.values()].filter((c) => [String(credit.id), String(card.id)].includes(c.metadata.compensationId))).toHaveLength(0);
  });

  it('refuses an agreement whose text is not the text for this compensation, or that is not signed', async () => {
    const comp = await one(usDenial);
    const text = await shownText(comp, 'travel-credit', 60_000, null);
    // The passenger read one value; the request claims another.
    const changed = await agent.post(`/api/compensations/${comp.id}/agreement`, { medium: 'travel-credit', valueMinor: 90_000, expiresOn: null, text, signature: FIXTURE_SIGNATURE }).expect(409);
    expect(changed.body.error).toBe('agreement_text_changed');
    const unsigned = await agent.post(`/api/compensations/${comp.id}/agreement`, { medium: 'travel-credit', valueMinor: 60_000, expiresOn: null, text, signature: 'data:image/png;base64,' }).expect(400);
    expect(unsigned.body.details.map((d: { field: string }) => d.field)).toContain('signature');
  });

  it('US: refuses a credit worth less than the cash amount (14 CFR 250.5(c))', async () => {
    const comp = await one(usDenial);
    const res = await agree(comp, 'travel-credit', 59_999);
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('agreement_conditions_unmet');
  });

  it('records the agreement (text, signature, time, staff, cash given up and value) and issues the credit, audited', async () => {
    const comp = await one(usDenial);
    const res = await agree(comp, 'travel-credit', 75_000);
    expect(res.status).toBe(200);
    expect(res.body.compensation).toMatchObject({ medium: 'travel-credit', form: 'voucher' });
    const record = await app.db.getRepository(PaymentAgreementEntity).findOneByOrFail({ compensationId: comp.id });
    expect(record).toMatchObject({ medium: 'travel-credit', cashAmountMinor: 60_000, valueMinor: 75_000, method: 'desk-signature', signature: FIXTURE_SIGNATURE, expiresOn: null });
    expect(record.text).toBe(await shownText(comp, 'travel-credit', 75_000, null));
    expect(record.staffUserId).toEqual(expect.any(Number));
    const row = await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: comp.id });
    expect(row.creditValueMinor).toBe(75_000);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    const actions = (await app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(comp.id) })).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(['compensation.agreement_recorded', 'compensation.issue_requested']));
    const receipt = await agent.get(`/api/compensations/${comp.id}/receipt`).expect(200);
    expect(receipt.body.receipt.agreementText).toBe(record.text);
  });

  it('Canada: a credit must be worth more than the money and never expire', async () => {
    const equal = await one(caDenial, yul);
    expect((await agree(equal, 'travel-credit', 90_000)).body.error).toBe('agreement_conditions_unmet');
    const expiring = await one(caDenial, yul);
    const res = await agree(expiring, 'travel-credit', 120_000, '2027-12-31');
    expect(res.body.message).toContain('must not expire');
    const lawful = await one(caDenial, yul);
    expect((await agree(lawful, 'travel-credit', 120_000)).status).toBe(200);
    // Issued, the credit's card holds the agreed value (CAD 1,200.00), not the money given up (CAD 900.00).
    await agent.post(`/api/compensations/${lawful.id}/issue`).expect(200);
    await app.runtime.issuer.attempt(lawful.id);
    const cards = [...fake.fake.store.state.cards.values()].filter((c) => c.metadata.compensationId === String(lawful.id));
    expect(cards.map((c) => ({ currency: c.currency, limit: c.spending_limits[0]?.amount }))).toEqual([{ currency: 'cad', limit: 120_000 }]);
  });

  it('Canada: the worker checks the agreement again before the card exists, and refuses a credit no longer worth more', async () => {
    const comp = await one(caDenial, yul);
    expect((await agree(comp, 'travel-credit', 120_000)).status).toBe(200);
    await agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
    // Whatever path leaves a row 'issuing' (a crash, a re-issue), the card is made only if the rule still holds.
    const repo = app.db.getRepository(CompensationEntity);
    const before = [...fake.fake.store.state.cards.values()].filter((c) => c.metadata.compensationId === String(comp.id));
    for (const card of before) fake.fake.store.state.cards.delete(card.id);
    await repo.update({ id: comp.id }, { state: 'issuing', providerCardId: null, providerCardholderId: null });
    await app.db.getRepository(PaymentAgreementEntity).update({ compensationId: comp.id }, { valueMinor: 90_000 });
    await app.runtime.issuer.attempt(comp.id);
    const row = await repo.findOneByOrFail({ id: comp.id });
    expect(row.state).toBe('failed');
    expect(row.lastError).toContain('greater than the cash amount');
    expect([...fake.fake.store.state.cards.values()].filter((c) => c.metadata.compensationId === String(comp.id))).toEqual([]);
  });
});

describe('cash or cheque at the counter', () => {
  const pay = (id: number, body: Record<string, unknown>) => agent.post(`/api/compensations/${id}/counter-payment`, { signature: FIXTURE_SIGNATURE, ...body });

  it('a cash compensation never goes to the provider', async () => {
    const comp = await one(usDenial);
    expect((await agent.post(`/api/compensations/${comp.id}/issue`).expect(409)).body.error).toBe('pay_at_counter');
  });

  it('names the field: a drawer for cash, a cheque number for a cheque, exactly the amount owed', async () => {
    const comp = await one(usDenial);
    expect((await pay(comp.id, { medium: 'cash', amountMinor: 60_000 }).expect(400)).body.details[0].field).toBe('drawerId');
    expect((await pay(comp.id, { medium: 'cheque', amountMinor: 60_000 }).expect(400)).body.details[0].field).toBe('chequeNumber');
    expect((await pay(comp.id, { medium: 'cash', drawerId: 'D1', amountMinor: 50_000 }).expect(400)).body.message).toMatch(/^amountMinor: /);
  });

  it('pays once: settled at once with the signed receipt, a repeat changes nothing, a different second payment is refused', async () => {
    const comp = await one(usDenial);
    const first = await pay(comp.id, { medium: 'cash', drawerId: 'BOS-D2', amountMinor: 60_000 }).expect(200);
    expect(first.body.compensation).toMatchObject({ state: 'settled', medium: 'cash' });
    await pay(comp.id, { medium: 'cash', drawerId: 'BOS-D2', amountMinor: 60_000 }).expect(200);
    expect((await pay(comp.id, { medium: 'cheque', chequeNumber: '881', amountMinor: 60_000 }).expect(409)).body.error).toBe('already_paid');
    expect(await app.db.getRepository(CounterPaymentEntity).countBy({ compensationId: comp.id })).toBe(1);
    const receipt = (await agent.get(`/api/compensations/${comp.id}/receipt`).expect(200)).body.receipt;
    expect(receipt.lines.join('\n')).toContain('in cash from drawer BOS-D2');
    expect(receipt.signature).toBe(FIXTURE_SIGNATURE);
    const audits = await app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(comp.id), action: 'compensation.paid_at_counter' });
    expect(audits).toHaveLength(1);
  });

  it('a cheque number is used once per station', async () => {
    const a = await one(usDenial);
    const b = await one(usDenial);
    const number = `Q${Date.now() % 1_000_000}`;
    await pay(a.id, { medium: 'cheque', chequeNumber: number, amountMinor: 60_000 }).expect(200);
    const res = await pay(b.id, { medium: 'cheque', chequeNumber: number, amountMinor: 60_000 }).expect(400);
    expect(res.body.message).toMatch(/^chequeNumber: /);
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: b.id })).state).toBe('due');
  });
});
