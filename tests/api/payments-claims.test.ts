// Two server processes paying from one database: each compensation left 'issuing' is worked on by one process at a
// time, whichever way it is reached (the worker's pass, or the issue route's own attempt), so the provider sees one
// call per step for each; and a process that died holding rows leaves them to the other once their lease ends.
// Two payments runtimes on two connection pools stand for the two processes.
// Outside source: Stripe docs, "Idempotent requests" (the keys make a second call return the first result; the
// claims make the second call not happen at all), from memory.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { In } from 'typeorm';
import { CompensationEntity, type StationEntity } from '../../server/src/db/entities';
import { RUN_ID } from './helpers';
import { insertCompensations, paymentsTestStation, removeFlights, seedFlight, startFake, startPaymentsApp, until, type PaymentsApp, type RunningFake } from './payments-harness';

let fake: RunningFake;
let one: PaymentsApp;
let two: PaymentsApp;
let station: StationEntity;
const flightIds: number[] = [];

beforeAll(async () => {
  fake = await startFake();
  // An account of this run: the workers' passes see only this file's rows, not what other suites left 'issuing'.
  const account = { stripeApiUrl: fake.url, startWorker: false, secretKey: `sk_test_bumpboard_claims_${RUN_ID}` };
  [one, two] = await Promise.all([startPaymentsApp(account), startPaymentsApp(account)]);
  station = await paymentsTestStation(one.db, 'PWM');
});
afterAll(async () => {
  await removeFlights(one.db, flightIds);
  await Promise.all([one?.close(), two?.close()]);
  await fake?.stop();
});

/** `count` card compensations left 'issuing' under this provider account, as a server that stopped mid-run leaves them. */
async function leftIssuing(count: number): Promise<number[]> {
  const { flight, passengers } = await seedFlight(one.db, station, { passengers: count, destination: 'BOS' });
  flightIds.push(flight.id);
  const rows = await insertCompensations(one.db, flight, passengers, (i) => ({ state: 'issuing', idempotencyKey: `claims-${RUN_ID}-${flight.id}-${i}` }));
  await one.db.query('INSERT INTO payment_issuances (compensation_id, provider_account, requested_at) VALUES ?', [rows.map((r) => [r.id, one.runtime.ctx.providerAccount, new Date()])]);
  return rows.map((r) => r.id);
}

const issuedCount = async (ids: number[]) => (await one.db.getRepository(CompensationEntity).findBy({ id: In(ids), state: 'issued' })).length;
const cardsFor = (ids: number[]) => [...fake.fake.store.state.cards.values()].filter((c) => ids.includes(Number(c.metadata.compensationId)));

describe('two processes paying from one database', () => {
  it('both workers and both processes’ issue attempts at once: one cardholder call and one card per compensation', async () => {
    const ids = await leftIssuing(24);
    const holders = [vi.spyOn(one.runtime.provider, 'createCardholder'), vi.spyOn(two.runtime.provider, 'createCardholder')];
    const cards = [vi.spyOn(one.runtime.provider, 'createCard'), vi.spyOn(two.runtime.provider, 'createCard')];
    // Slow provider answers keep the claims held while the other process looks at the same rows.
    fake.fake.faults.api.add({ kind: 'timeout', phase: 'before', holdMs: 150, count: 12, method: 'POST', pathPrefix: '/v1/issuing/cardholders' });
    await Promise.all([
      one.runtime.worker.runOnce({ all: true }),
      two.runtime.worker.runOnce({ all: true }),
      ...ids.map((id) => two.runtime.issuer.attempt(id)),
      ...ids.map((id) => one.runtime.issuer.attempt(id)),
    ]);
    // Whatever a pass found held by the other is issued by that other; a last pass of each finds nothing left.
    await until('all issued', async () => (await issuedCount(ids)) === ids.length);
    expect(holders[0].mock.calls.length + holders[1].mock.calls.length).toBe(ids.length);
    expect(cards[0].mock.calls.length + cards[1].mock.calls.length).toBe(ids.length);
    expect(cardsFor(ids).map((c) => Number(c.metadata.compensationId)).sort()).toEqual([...ids].sort());
    const left: { n: number }[] = await one.db.query('SELECT COUNT(*) AS n FROM compensations WHERE id IN (?) AND claimed_by IS NOT NULL', [ids]);
    expect(Number(left[0].n)).toBe(0);
    for (const spy of [...holders, ...cards]) spy.mockRestore();
  });

  it('a process that died holding rows: the other leaves them alone until the lease ends, then issues each once', async () => {
    const ids = await leftIssuing(5);
    // The first process claims the rows and dies before it calls the provider.
    const held = await one.runtime.ctx.claims.compensations.claim({ limit: 10, leaseMs: 60_000, due: `state = 'issuing'`, keys: ids });
    expect(held.rows).toHaveLength(5);
    expect(await two.runtime.worker.runOnce({ all: true })).toBe(0);
    for (const id of ids) await two.runtime.issuer.attempt(id);
    expect(cardsFor(ids)).toEqual([]);
    // Its lease ends (time passing, set by hand).
    await one.db.query('UPDATE compensations SET lease_until = UTC_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE id IN (?)', [ids]);
    expect(await two.runtime.worker.runOnce({ all: true })).toBe(5);
    await until('all issued', async () => (await issuedCount(ids)) === ids.length);
    expect(cardsFor(ids)).toHaveLength(5);
    // The dead process's claim no longer holds: its late end of it writes nothing.
    expect(await one.runtime.ctx.claims.compensations.finish(held.token, ids[0])).toBe(false);
  });
});
