// The issue path is one of the paths that fix an amount: a compensation whose amount was never cleared against
// anyone's limit (recorded before the gate existed, or typed by hand) and is above the issuing agent's limit waits
// for a supervisor; exactly the approved amount then issues. Amounts cleared when they were fixed (a denial's, by
// the rule; a gated offer's) issue at once. The flights here have departed: paying what is owed stays possible.
// Limits per role and four eyes on money are common practice (no outside source); the $600 agent limit is the
// default policy's figure of our own.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity, CompensationEntity, OfferApprovalEntity, StationEntity } from '../../server/src/db/entities';
import { signedIn, type Client } from './harness';
import { DEMO } from './helpers';
import { insertCompensations, removeFlights, seedFlight, startFake, startPaymentsApp, type PaymentsApp, type RunningFake } from './payments-harness';

let fake: RunningFake;
let app: PaymentsApp;
let agent: Client;
let supervisor: Client;
let bos: StationEntity;
let limit: number;
const flightIds: number[] = [];

beforeAll(async () => {
  fake = await startFake();
  app = await startPaymentsApp({ stripeApiUrl: fake.url, startWorker: false });
  bos = await app.db.getRepository(StationEntity).findOneByOrFail({ iata: 'BOS' });
  const tc = { app: app.app } as Parameters<typeof signedIn>[0];
  agent = await signedIn(tc, DEMO.agent);
  supervisor = await signedIn(tc, DEMO.supervisor);
  limit = (await agent.get(`/api/stations/${bos.id}/volunteer-policy`).expect(200)).body.agentLimitMinor;
});

afterAll(async () => {
  await app.db.query('DELETE FROM offer_approvals WHERE flight_id IN (?)', [flightIds.length ? flightIds : [0]]);
  await removeFlights(app.db, flightIds);
  await app.close();
  await fake.stop();
});

async function due(over: Partial<CompensationEntity>) {
  const { flight, passengers } = await seedFlight(app.db, bos, { passengers: 1 });
  flightIds.push(flight.id);
  const [row] = await insertCompensations(app.db, flight, passengers, () => over);
  return row;
}

describe('issuing a compensation', () => {
  it('holds an uncleared amount above the agent’s limit for a supervisor, then issues exactly that amount', async () => {
    const row = await due({ amountMinor: limit + 30_000, amountClearedBy: null });
    const held = await agent.post(`/api/compensations/${row.id}/issue`);
    expect([held.status, held.body.error]).toEqual([409, 'awaiting_approval']);
    expect((await app.db.getRepository(CompensationEntity).findOneByOrFail({ id: row.id })).state).toBe('due');
    // Asking again while it waits makes no second request.
    expect((await agent.post(`/api/compensations/${row.id}/issue`)).body.error).toBe('approval_pending');

    const approvals = (await supervisor.get(`/api/approvals?stationId=${bos.id}`).expect(200)).body.approvals as { id: number; kind: string; offerMinor: number; subject: string | null }[];
    const mine = approvals.find((a) => a.kind === 'issue' && a.offerMinor === limit + 30_000 && a.subject?.includes('Tester0'))!;
    expect(mine).toBeDefined();
    await supervisor.post(`/api/approvals/${mine.id}`, { approve: true }).expect(200);
    const issued = await agent.post(`/api/compensations/${row.id}/issue`).expect(200);
    expect(issued.body.compensation).toMatchObject({ state: 'issued', amountMinor: limit + 30_000 });
    const trail = await app.db.getRepository(AuditLogEntity).find({ where: { entityType: 'offer_approval', entityId: String(mine.id) }, order: { id: 'ASC' } });
    expect(trail.map((r) => [r.action, r.actorLabel])).toEqual([['approval.requested', DEMO.agent], ['approval.approved', DEMO.supervisor]]);
  });

  it('does not let an approval of one amount cover another', async () => {
    const row = await due({ amountMinor: limit + 10_000, amountClearedBy: null });
    await agent.post(`/api/compensations/${row.id}/issue`).expect(409);
    const pending = await app.db.getRepository(OfferApprovalEntity).findOneByOrFail({ kind: 'issue', subjectId: row.id, status: 'pending' });
    await supervisor.post(`/api/approvals/${pending.id}`, { approve: true }).expect(200);
    // The amount changed after the approval (a correction): the approval was for the old amount only.
    await app.db.getRepository(CompensationEntity).update({ id: row.id }, { amountMinor: limit + 20_000 });
    const again = await agent.post(`/api/compensations/${row.id}/issue`);
    expect([again.status, again.body.error]).toEqual([409, 'awaiting_approval']);
  });

  it('issues at once an amount cleared when it was fixed, even above the agent’s limit', async () => {
    const row = await due({ amountMinor: limit + 40_000, sourceKind: 'denial', amountClearedBy: 'rule' });
    expect((await agent.post(`/api/compensations/${row.id}/issue`).expect(200)).body.compensation.state).toBe('issued');
  });

  it('issues at once an uncleared amount within the agent’s limit', async () => {
    const row = await due({ amountMinor: limit, amountClearedBy: null });
    expect((await agent.post(`/api/compensations/${row.id}/issue`).expect(200)).body.compensation.state).toBe('issued');
  });
});
