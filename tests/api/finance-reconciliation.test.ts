// Reconciliation runs against the payments stand-in: more than a page of cards (so the run pages with limit,
// starting_after and has_more), then mismatches seeded on both sides — the ledger edited, the stand-in's records
// edited — each of which the run must find, with the right kind and compensation. Differences are resolved with a
// note, once.
// Outside sources: Stripe API reference "Pagination" (limit 1-100, starting_after, has_more) and "Issuing cards"
// (status canceled is final; spending_controls.spending_limits); the two-way matching of a sub-ledger with the
// provider's statement is common practice.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { CompensationEntity, PayoutEntity, type FlightEntity, type StationEntity, type UserEntity } from '../../server/src/db/entities';
import { issueCompensation } from '../../server/src/modules/payments/compensation-actions';
import { Client, signedIn } from './harness';
import { DEMO, insertUser, removeRunUsers, TEST_PASSWORD } from './helpers';
import { FIXTURE_SIGNATURE, insertCompensations, paymentsTestStation, removeFlights, seedFlight, startFake, startPaymentsApp, until, type PaymentsApp, type RunningFake } from './payments-harness';

const COUNT = 112;
let fake: RunningFake;
let app: PaymentsApp;
let station: StationEntity;
let agentUser: UserEntity;
let financeUser: UserEntity;
let finance: Client;
let flight: FlightEntity;
let comps: CompensationEntity[];
let stripe: Stripe;
const extraFlights: number[] = [];

beforeAll(async () => {
  fake = await startFake();
  app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false });
  stripe = new Stripe('sk_test_seeding', { host: '127.0.0.1', port: fake.port, protocol: 'http', telemetry: false });
  // Bangor, Maine: a US airport, used by no demo user.
  station = await paymentsTestStation(app.db, 'BGR');
  const stale: { id: number }[] = await app.db.query('SELECT id FROM flights WHERE station_id = ?', [station.id]);
  await removeFlights(app.db, stale.map((f) => f.id));
  agentUser = await insertUser(app.db, { label: 'recon-agent', role: 'agent', stationIds: [station.id] });
  financeUser = await insertUser(app.db, { label: 'recon-finance', role: 'finance', stationIds: [station.id] });
  finance = new Client(app.app);
  await finance.signIn(financeUser.email, TEST_PASSWORD);
  const seeded = await seedFlight(app.db, station, { passengers: COUNT });
  flight = seeded.flight;
  comps = await insertCompensations(app.db, flight, seeded.passengers);
  const agent = { id: agentUser.id, email: agentUser.email, displayName: agentUser.displayName, role: 'agent' as const, stations: [{ id: station.id, iata: station.iata, name: station.name, timeZone: station.timeZone }] };
  for (let i = 0; i < comps.length; i += 16) {
    await Promise.all(comps.slice(i, i + 16).map((c) => issueCompensation(app.runtime.ctx, app.runtime.issuer, agent, c.id)));
  }
  comps = await app.db.getRepository(CompensationEntity).find({ where: { flightId: flight.id }, order: { id: 'ASC' } });
});

afterAll(async () => {
  await removeFlights(app.db, [flight.id, ...extraFlights]);
  await app.db.query('DELETE FROM reconciliation_runs WHERE JSON_CONTAINS(station_ids, ?)', [String(station.id)]);
  await removeRunUsers(app.db);
  await app.close();
  await fake.stop();
});

async function runToEnd(client: Client) {
  const started = await client.post('/api/finance/reconciliations', { stationId: station.id }).expect(202);
  expect(started.body.run).toMatchObject({ status: 'running', stations: ['BGR'] });
  let body: { run: { status: string; pagesRead: number; cardsSeen: number; differences: number; unresolved: number; id: number }; differences: { id: number; kind: string; compensationId: number | null; cardId: string | null; ledgerValue: string | null; providerValue: string | null }[] } | undefined;
  await until('the run to finish', async () => {
    body = (await client.get(`/api/finance/reconciliations/${started.body.run.id}`).expect(200)).body;
    return body!.run.status !== 'running';
  }, 30_000, 100);
  return body!;
}

describe('reconciliation', () => {
  it('pages through more than one page of cards and finds nothing while both sides agree', async () => {
    expect(comps.every((c) => c.state === 'issued')).toBe(true);
    const { run, differences } = await runToEnd(finance);
    expect(run).toMatchObject({ status: 'completed', cardsSeen: COUNT, differences: 0 });
    // Two pages of cards (100 + 12), one of transactions and one of bank transfers.
    expect(run.pagesRead).toBe(4);
    expect(differences).toEqual([]);
  });

  it('finds every mismatch seeded in the ledger or at the provider', async () => {
    const repo = app.db.getRepository(CompensationEntity);
    const cards = fake.fake.store.state.cards;
    const [amountInLedger, currencyInLedger, canceledAtProvider, limitAtProvider, deletedAtProvider, duplicated, otherCard, settledInLedger, spentAtProvider, currencyAtProvider] = comps;
    await repo.update({ id: amountInLedger.id }, { amountMinor: amountInLedger.amountMinor + 1 });
    await repo.update({ id: currencyInLedger.id }, { currency: 'CAD' });
    cards.get(canceledAtProvider.providerCardId!)!.status = 'canceled';
    cards.get(limitAtProvider.providerCardId!)!.spending_limits[0].amount = 1;
    cards.delete(deletedAtProvider.providerCardId!);
    await stripe.issuing.cards.create({ cardholder: duplicated.providerCardholderId!, currency: 'usd', type: 'virtual', metadata: { compensationId: String(duplicated.id), stationId: String(station.id) } });
    await repo.update({ id: otherCard.id }, { providerCardId: 'ic_not_this_one' });
    await repo.update({ id: settledInLedger.id }, { state: 'settled' });
    fake.fake.settle(spentAtProvider.providerCardId!, { amount: 500 });
    cards.get(currencyAtProvider.providerCardId!)!.currency = 'eur';
    const stray = await stripe.issuing.cards.create({ cardholder: duplicated.providerCardholderId!, currency: 'usd', type: 'virtual', metadata: { compensationId: '999999999', stationId: String(station.id) } });

    const { run, differences } = await runToEnd(finance);
    const found = differences.map((d) => `${d.kind} ${d.compensationId}`).sort();
    expect(found).toEqual([
      `amount-differs ${amountInLedger.id}`,
      `amount-differs ${limitAtProvider.id}`,
      `card-differs ${otherCard.id}`,
      `currency-differs ${currencyAtProvider.id}`,
      `currency-differs ${currencyInLedger.id}`,
      `duplicate-at-provider ${duplicated.id}`,
      `missing-at-provider ${deletedAtProvider.id}`,
      'missing-in-ledger 999999999',
      `state-differs ${canceledAtProvider.id}`,
      `state-differs ${settledInLedger.id}`,
      `state-differs ${spentAtProvider.id}`,
    ].sort());
    expect(run).toMatchObject({ status: 'completed', differences: 11, unresolved: 11 });
    expect(differences.find((d) => d.kind === 'missing-in-ledger')?.cardId).toBe(stray.id);
    expect(differences.find((d) => d.compensationId === spentAtProvider.id)).toMatchObject({ ledgerValue: 'issued', providerValue: 'settled' });
    expect(differences.find((d) => d.compensationId === amountInLedger.id)?.ledgerValue).toBe(`USD ${((amountInLedger.amountMinor + 1) / 100).toFixed(2)}`);
  });

  it('resolves a difference once, with a note, and keeps the runs', async () => {
    const runs = (await finance.get('/api/finance/reconciliations').expect(200)).body.runs;
    expect(runs.length).toBeGreaterThanOrEqual(2);
    const latest = runs[0];
    const detail = (await finance.get(`/api/finance/reconciliations/${latest.id}`).expect(200)).body;
    const diff = detail.differences[0];
    const short = await finance.post(`/api/finance/reconciliations/${latest.id}/differences/${diff.id}/resolve`, { note: '' }).expect(400);
    expect(short.body.details[0].field).toBe('note');
    const ok = await finance.post(`/api/finance/reconciliations/${latest.id}/differences/${diff.id}/resolve`, { note: 'Checked with the provider; ledger corrected.' }).expect(200);
    expect(ok.body.difference).toMatchObject({ id: diff.id, note: 'Checked with the provider; ledger corrected.', resolvedBy: financeUser.email });
    const again = await finance.post(`/api/finance/reconciliations/${latest.id}/differences/${diff.id}/resolve`, { note: 'twice' }).expect(409);
    expect(again.body.error).toBe('already_resolved');
    const after = (await finance.get('/api/finance/reconciliations').expect(200)).body.runs[0];
    expect(after.unresolved).toBe(latest.unresolved - 1);
  });

  it('shows a run only to finance users of its stations', async () => {
    const runs = (await finance.get('/api/finance/reconciliations').expect(200)).body.runs;
    const demo = await signedIn({ app: app.app } as Parameters<typeof signedIn>[0], DEMO.finance);
    await demo.get(`/api/finance/reconciliations/${runs[0].id}`).expect(404);
    const theirs = (await demo.get('/api/finance/reconciliations').expect(200)).body.runs;
    expect(theirs.map((r: { id: number }) => r.id)).not.toContain(runs[0].id);
    await demo.post('/api/finance/reconciliations', { stationId: station.id }).expect(404);
  });
});

describe('each medium against its own record', () => {
  it('compares a bank transfer with its outbound payment and cash with the drawer, never with cards', async () => {
    const seeded = await seedFlight(app.db, station, { passengers: 2 });
    extraFlights.push(seeded.flight.id);
    const [transfer, cash] = await insertCompensations(app.db, seeded.flight, seeded.passengers, (i) => ({ voluntary: false, sourceKind: 'denial', medium: i === 0 ? 'bank-transfer' : 'cash', amountMinor: 10_000 + i * 5_000 }));
    const repo = app.db.getRepository(CompensationEntity);
    // The transfer as the payout flow leaves it once sent: the payout names the outbound payment at the provider.
    const attemptKey = `comp-${transfer.id}`;
    const method = await stripe.paymentMethods.create({ type: 'us_bank_account', us_bank_account: { account_holder_type: 'individual', account_type: 'checking', routing_number: '110000000', account_number: '000123456789' } });
    const payment = await stripe.treasury.outboundPayments.create({
      financial_account: 'fa_bumpboard_compensations', amount: transfer.amountMinor, currency: 'usd', destination_payment_method: method.id,
      metadata: { compensationId: String(transfer.id), stationId: String(station.id), attemptKey },
    });
    await repo.update({ id: transfer.id }, { state: 'issued', idempotencyKey: attemptKey });
    await app.db.getRepository(PayoutEntity).insert({ compensationId: transfer.id, attemptKey, state: 'processing', amountMinor: transfer.amountMinor, currency: 'USD', providerPaymentId: payment.id, accountLast4: '6789' });
    const agent = new Client(app.app);
    await agent.signIn(agentUser.email, TEST_PASSWORD);
    const drawer = `R${Date.now() % 100_000}`;
    await agent.post(`/api/compensations/${cash.id}/counter-payment`, { medium: 'cash', drawerId: drawer, amountMinor: cash.amountMinor, signature: FIXTURE_SIGNATURE }).expect(200);

    const mine = new Set([transfer.id, cash.id]);
    const clean = await runToEnd(finance);
    expect(clean.differences.filter((d) => d.compensationId !== null && mine.has(d.compensationId))).toEqual([]);
    const lines = (clean.run as unknown as { byMedium: { medium: string; against: string; ledgerRows: number; otherSide: number; paid: { currency: string; amountMinor: number }[] }[] }).byMedium;
    expect(lines.map((l) => l.medium)).toEqual(['cash', 'cheque', 'bank-transfer', 'prepaid-card', 'travel-credit']);
    expect(lines.find((l) => l.medium === 'bank-transfer')).toMatchObject({ against: 'provider-transfers', ledgerRows: 1, otherSide: 1, paid: [{ currency: 'USD', amountMinor: transfer.amountMinor }] });
    expect(lines.find((l) => l.medium === 'cash')).toMatchObject({ against: 'counter-register', ledgerRows: 1, otherSide: 1, paid: [{ currency: 'USD', amountMinor: cash.amountMinor }] });
    // The earlier test's cards: one deleted at the provider, one duplicate and one stray added.
    expect(lines.find((l) => l.medium === 'prepaid-card')).toMatchObject({ against: 'provider-cards', otherSide: COUNT + 1 });

    // The ledger edited on both: each is found against its own record, named by medium and by its record.
    await repo.update({ id: transfer.id }, { amountMinor: transfer.amountMinor + 1 });
    await repo.update({ id: cash.id }, { amountMinor: cash.amountMinor + 1 });
    const found = (await runToEnd(finance)).differences.filter((d) => d.compensationId !== null && mine.has(d.compensationId));
    expect(found).toEqual([
      expect.objectContaining({ kind: 'amount-differs', medium: 'bank-transfer', compensationId: transfer.id, cardId: payment.id, providerValue: 'USD 100.00' }),
      expect.objectContaining({ kind: 'amount-differs', medium: 'cash', compensationId: cash.id, cardId: `drawer ${drawer}`, providerValue: 'USD 150.00' }),
    ]);
  });
});
