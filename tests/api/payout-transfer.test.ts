// A compensation paid by bank transfer: the passenger gets a single-use payout link by mail, enters their own
// account on their own phone, and the transfer goes out as one Treasury OutboundPayment through the real SDK, under
// the stand-in's fault switches (lost answer, 5xx, webhook failure and return), never twice.
// Outside sources: Stripe docs "Idempotent requests" (same key, same result), Treasury "OutboundPayments" (statuses
// processing → posted, failed, returned; test helpers post / fail / return) and its events
// treasury.outbound_payment.*; the ABA routing number check digit (weights 3-7-1), and Stripe's test routing number
// 110000000 — all from memory. The 72-hour link is our own choice, not from a source.
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { AlertEntity, AuditLogEntity, CompensationEntity, PayoutEntity } from '../../server/src/db/entities';
import { startPaymentsApp, until } from './payments-harness';
import { dueAt, linkToken, publicPost, startLinkWorld, type LinkWorld } from './payout-fixtures';

const ROUTING = '110000000';
let w: LinkWorld;
let stripe: Stripe;
let n = 0;

beforeAll(async () => {
  w = await startLinkWorld({ webhooks: true });
  stripe = new Stripe('sk_test_payout_tests', { host: '127.0.0.1', port: w.fake.port, protocol: 'http', telemetry: false, maxNetworkRetries: 0 });
});
afterAll(async () => {
  await w.close();
});

const comp = (id: number) => w.app.db.getRepository(CompensationEntity).findOneByOrFail({ id });
const payoutOf = (id: number) => w.app.db.getRepository(PayoutEntity).findOneByOrFail({ compensationId: id });
const paymentsFor = (id: number) => [...w.fake.fake.store.state.outboundPayments.values()].filter((p) => p.metadata.compensationId === String(id));

/** A bank-transfer compensation, issued by the agent: its payout link is mailed. */
async function transferDue(over: Partial<CompensationEntity> = {}) {
  const { rows: [row], proofOf } = await dueAt(w, 1, () => ({ medium: 'bank-transfer', ...over }));
  const issued = await w.agent.post(`/api/compensations/${row.id}/issue`).expect(200);
  n += 1;
  const account = `0001234${String(5000 + n).padStart(5, '0')}`;
  return { row, proof: proofOf(0), issued, account };
}

async function giveAccount(row: CompensationEntity, proof: { pnr: string; lastName: string }, account: string) {
  const token = await linkToken(w, row.id, 'payout');
  const res = await publicPost(w, '/payout/account', { token, ...proof, holderName: 'Ana Tester', routingNumber: ROUTING, accountNumber: account, accountNumberAgain: account, accountType: 'checking' });
  return { token, res };
}

describe('a bank transfer from the passenger’s own account entry', () => {
  it('mails a payout link, takes the account on the phone, sends one transfer and settles on the posted webhook', async () => {
    const { row, proof, issued, account } = await transferDue();
    expect(issued.body.compensation.state).toBe('issuing');
    expect(await payoutOf(row.id)).toMatchObject({ state: 'awaiting-details', amountMinor: row.amountMinor, currency: 'USD' });
    // Waiting for the passenger is not provider work: the worker's sweep leaves it alone.
    await w.app.runtime.worker.runOnce({ all: true });
    expect(paymentsFor(row.id)).toHaveLength(0);

    const token = await linkToken(w, row.id, 'payout');
    expect((await publicPost(w, '/payout/status', { token })).body).toMatchObject({ state: 'ready', amountMinor: row.amountMinor, payout: { state: 'awaiting-details', accountEnding: null } });
    const { res } = await giveAccount(row, proof, account);
    expect(res).toMatchObject({ status: 200, body: { accountEnding: account.slice(-4) } });
    await until('the transfer is sent', async () => (await comp(row.id)).state === 'issued');
    const [payment] = paymentsFor(row.id);
    expect(paymentsFor(row.id)).toHaveLength(1);
    expect(payment).toMatchObject({ amount: row.amountMinor, currency: 'usd', status: 'processing', metadata: { attemptKey: `comp-${row.id}` } });
    expect(await payoutOf(row.id)).toMatchObject({ state: 'processing', providerPaymentId: payment.id, accountLast4: account.slice(-4) });

    await stripe.testHelpers.treasury.outboundPayments.post(payment.id);
    await until('the posted webhook settles it', async () => (await comp(row.id)).state === 'settled');
    const actions = (await w.app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(row.id) })).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(['compensation.issue_requested', 'compensation.payout_link_sent', 'compensation.payout_account_received', 'compensation.issued', 'compensation.settled']));

    // The account number is in no mail, log, audit row or table of ours; only its last four digits are.
    await w.deliverMail();
    const audit = JSON.stringify(await w.app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(row.id) }));
    const tables = JSON.stringify(await w.app.db.query('SELECT * FROM payouts WHERE compensation_id = ?', [row.id]));
    for (const [where, text] of [['mail', w.mailText()], ['log', w.logs.join('\n')], ['audit', audit], ['payouts', tables]] as const) expect(text, where).not.toContain(account);
    expect(w.mailText()).toContain(`/payout/${token}`);
  });

  it('writes the payout link and the transfer receipt in the booking\'s language', async () => {
    const { rows: [row], proofOf } = await dueAt(w, 1, () => ({ medium: 'bank-transfer' }));
    await w.app.db.query('UPDATE bookings b JOIN passengers p ON p.booking_id = b.id SET b.language = ? WHERE p.id = ?', ['fr', row.passengerId]);
    await w.agent.post(`/api/compensations/${row.id}/issue`).expect(200);
    const mailOf = async (dedupeKey: string) => {
      const [mail]: { subject: string; html: string }[] = await w.app.db.query('SELECT subject, html FROM outbox_messages WHERE dedupe_key LIKE ?', [dedupeKey]);
      return mail;
    };
    const link = await mailOf(`payout-link:${row.id}:%`);
    expect(link.subject).toMatch(/^Votre indemnisation du vol .+ : indiquez-nous où envoyer /);
    expect(link.html).toContain('<html lang="fr">');
    n += 1;
    const account = `0001234${String(5000 + n).padStart(5, '0')}`;
    expect((await giveAccount(row, proofOf(0), account)).res.status).toBe(200);
    await until('the transfer is sent', async () => (await comp(row.id)).state === 'issued');
    expect((await mailOf(`transfer-receipt:${row.id}:%`)).subject).toMatch(/ est en route$/);
  });

  it('takes the account once: a second entry on the same link is refused', async () => {
    const { row, proof, account } = await transferDue();
    const { token, res } = await giveAccount(row, proof, account);
    expect(res.status).toBe(200);
    const again = await publicPost(w, '/payout/account', { token, ...proof, holderName: 'Someone Else', routingNumber: ROUTING, accountNumber: '99998888', accountNumberAgain: '99998888', accountType: 'checking' });
    expect(again).toMatchObject({ status: 410, body: { error: 'link_used' } });
    await until('sent', async () => (await comp(row.id)).state === 'issued');
    expect(paymentsFor(row.id)).toHaveLength(1);
  });

  it('expires the payout link after 72 hours on the clock', async () => {
    const { row, proof, account } = await transferDue();
    const start = w.clock.ms;
    try {
      w.clock.ms = start + 72 * 3_600_000 + 1;
      const { res } = await giveAccount(row, proof, account);
      expect(res).toMatchObject({ status: 410, body: { error: 'link_expired' } });
    } finally {
      w.clock.ms = start;
    }
  });

  it('refuses a bad account with the field and the rule, without echoing the number', async () => {
    const { row, proof } = await transferDue();
    const token = await linkToken(w, row.id, 'payout');
    const bad = await publicPost(w, '/payout/account', { token, ...proof, holderName: 'Ana Tester', routingNumber: '110000001', accountNumber: '55554444333', accountNumberAgain: '55554444222', accountType: 'checking' });
    expect(bad.status).toBe(400);
    const fields = (bad.body.details as { field: string }[]).map((d) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['routingNumber', 'accountNumberAgain']));
    expect(JSON.stringify(bad.body)).not.toContain('55554444');
    expect((await publicPost(w, '/payout/status', { token })).body.state).toBe('ready');
  });

  it('refuses, before anything starts, a currency the provider cannot transfer, naming the field and the currency', async () => {
    const { rows: [row] } = await dueAt(w, 1, () => ({ medium: 'bank-transfer', currency: 'EUR' }));
    const refused = await w.agent.post(`/api/compensations/${row.id}/issue`).expect(400);
    expect(refused.body.details[0]).toMatchObject({ field: 'medium' });
    expect(refused.body.message).toContain('owed in EUR');
    // Nothing lost and nothing sent: still due, to be paid another way.
    expect((await comp(row.id)).state).toBe('due');
    expect(paymentsFor(row.id)).toHaveLength(0);
    // The desk is told beforehand: the lawful medium is listed as unavailable here, with the same reason.
    const desk = await w.agent.get(`/api/flights/${row.flightId}/compensations`).expect(200);
    const terms = desk.body.compensations.find((c: { id: number }) => c.id === row.id).payment.terms;
    expect(terms.unavailable).toEqual([{ medium: 'bank-transfer', reason: expect.stringContaining('owed in EUR') }]);
  });

  it('does not send cash to the provider: it is handed over at the counter', async () => {
    const { rows: [row] } = await dueAt(w, 1, () => ({ medium: 'cash' }));
    await w.agent.post(`/api/compensations/${row.id}/issue`);
    await w.app.runtime.worker.runOnce({ all: true });
    expect([...w.fake.fake.store.state.cardholders.values()].filter((h) => h.metadata.compensationId === String(row.id))).toHaveLength(0);
    expect(paymentsFor(row.id)).toHaveLength(0);
  });
});

describe('nothing paid twice under the stand-in’s faults', () => {
  it('a lost answer: the SDK retries under the same key and the provider answers with the one transfer it made', async () => {
    const { row, proof, account } = await transferDue();
    w.fake.fake.faults.api.add({ kind: 'drop', phase: 'after', count: 1, method: 'POST', pathPrefix: '/v1/treasury/outbound_payments' });
    await giveAccount(row, proof, account);
    await until('sent', async () => (await comp(row.id)).state === 'issued');
    expect(paymentsFor(row.id)).toHaveLength(1);
  });

  it('5xx beyond the SDK’s retries: the claim is released and the worker’s next pass sends it once', async () => {
    const { row, proof, account } = await transferDue();
    w.fake.fake.faults.api.add({ kind: 'error500', count: 3, method: 'POST', pathPrefix: '/v1/treasury/outbound_payments' });
    await giveAccount(row, proof, account);
    // The three failures are spent either by one attempt (its error recorded, the claim released) or across the
    // issue path's attempt and the account entry's; either way the next pass sends it, and only once.
    await until('the failures are spent', async () => w.fake.fake.faults.api.list().length === 0);
    await until('the claim released', async () => (await payoutOf(row.id)).claimedBy === null || (await comp(row.id)).state === 'issued');
    await w.app.runtime.worker.runOnce({ all: true });
    await until('sent', async () => (await comp(row.id)).state === 'issued');
    expect(paymentsFor(row.id)).toHaveLength(1);
  });

  it('two server processes on one ready transfer: one claims and calls, the other stays away', async () => {
    const { row, proof, account } = await transferDue();
    const second = await startPaymentsApp({ stripeApiUrl: w.fake.url, startWorker: false, log: (l) => w.logs.push(l) });
    try {
      // Hold the first call so both processes are at the row together.
      w.fake.fake.faults.api.add({ kind: 'timeout', phase: 'before', holdMs: 600, count: 1, method: 'POST', pathPrefix: '/v1/treasury/outbound_payments' });
      const calls = [vi.spyOn(w.app.runtime.ctx.passenger, 'createOutboundPayment'), vi.spyOn(second.runtime.ctx.passenger, 'createOutboundPayment')];
      await giveAccount(row, proof, account);
      await Promise.all([w.app.runtime.issuer.attempt(row.id), second.runtime.issuer.attempt(row.id), second.runtime.worker.runOnce({ all: true })]);
      await until('sent', async () => (await comp(row.id)).state === 'issued');
      expect(calls[0].mock.calls.length + calls[1].mock.calls.length).toBe(1);
      expect(paymentsFor(row.id)).toHaveLength(1);
    } finally {
      await second.close();
    }
  });

  it('a failed transfer and a returned one leave the passenger owed again, with an alert, and duplicate webhooks change nothing', async () => {
    const failed = await transferDue();
    const returned = await transferDue();
    await giveAccount(failed.row, failed.proof, failed.account);
    await giveAccount(returned.row, returned.proof, returned.account);
    await until('both sent', async () => (await comp(failed.row.id)).state === 'issued' && (await comp(returned.row.id)).state === 'issued');
    w.fake.fake.faults.webhooks.add({ kind: 'duplicate', count: 3 });
    await stripe.testHelpers.treasury.outboundPayments.fail(paymentsFor(failed.row.id)[0].id);
    const returnedId = paymentsFor(returned.row.id)[0].id;
    await stripe.testHelpers.treasury.outboundPayments.post(returnedId);
    await until('posted', async () => (await comp(returned.row.id)).state === 'settled');
    await stripe.testHelpers.treasury.outboundPayments.returnOutboundPayment(returnedId, { returned_details: { code: 'account_closed' } });
    await until('failed and returned recorded', async () => (await comp(failed.row.id)).state === 'failed' && (await comp(returned.row.id)).state === 'canceled');
    expect((await comp(returned.row.id)).lastError).toContain('account_closed');
    const alerts = await w.app.db.getRepository(AlertEntity).findBy([{ compensationId: failed.row.id }, { compensationId: returned.row.id }]);
    expect(alerts.map((a) => a.kind).sort()).toEqual(['payment-canceled', 'payment-failed']);
    const audits = await w.app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(returned.row.id), action: 'compensation.transfer_returned' });
    expect(audits).toHaveLength(1);
  });
});
