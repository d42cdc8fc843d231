// A posted-offer volunteer round end to end, on a flight of this test's own at BOS: open, raise within the agent's
// limit, raise above it (a supervisor must approve), approve, accept, close; every step audited.
// Outside sources: 14 CFR 250.2b(a) (a carrier must ask for volunteers before denying anyone boarding against their
// will) and Reg. (EC) 261/2004 Art. 4(1) (the operating carrier first calls for volunteers), both from memory.
// The agent limit and the supervisor's approval are the station's own policy (common practice, no outside source).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { In } from 'typeorm';
import { AuditLogEntity, CompensationEntity, OfferApprovalEntity, VolunteerEntity, type FlightEntity } from '../../server/src/db/entities';
import type { Client } from './harness';
import { signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { addBooking, makeFlight, removeFlights, settle, type Booked } from './volunteers-fixtures';

let t: TestApp;
let agent: Client;
let supervisor: Client;
let admin: Client;
let finance: Client;
let flight: FlightEntity;
let parties: Booked[];
let limit: number;
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor, admin, finance] = await Promise.all([DEMO.agent, DEMO.supervisor, DEMO.admin, DEMO.finance].map((e) => signedIn(t, e)));
  const bos = await stationIdByIata(t.db, 'BOS');
  flight = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'PWM' });
  flightIds.push(flight.id);
  parties = [
    await addBooking(t.db, flight, [['Ada', 'Posted']]),
    await addBooking(t.db, flight, [['Ben', 'Posted']]),
    await addBooking(t.db, flight, [['Cy', 'Posted']]),
  ];
  // BOS's policy as it stands (the default, or what an admin set): the test works from its limit, not a guess.
  limit = (await agent.get(`/api/stations/${bos}/volunteer-policy`).expect(200)).body.agentLimitMinor;
});

afterAll(async () => {
  await settle(t);
  await removeFlights(t.db, flightIds);
  await t.close();
});

const rounds = async () => (await agent.get(`/api/flights/${flight.id}/rounds`).expect(200)).body.rounds;

describe('a posted-offer round', () => {
  let roundId: number;
  let approvalId: number;

  it('refuses an opening offer that is not a whole number of minor units, naming the field', async () => {
    const res = await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 100.5, volunteersNeeded: 2 });
    expect(res.status).toBe(400);
    expect(res.body.details[0].field).toBe('offerMinor');
  });

  it('refuses finance, whose role does not work the gate', async () => {
    const res = await finance.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 100, volunteersNeeded: 2 });
    expect(res.status).toBe(403);
  });

  it('opens at an amount within the limit; a second open round on the same flight is refused', async () => {
    const res = await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: Math.floor(limit / 2), extras: ['Meal voucher'], volunteersNeeded: 2 }).expect(201);
    roundId = res.body.id;
    const again = await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 100, volunteersNeeded: 1 });
    expect(again.status).toBe(409);
    expect(again.body.error).toBe('round_already_open');
    const [round] = await rounds();
    expect(round).toMatchObject({ id: roundId, kind: 'posted', status: 'open', offerMinor: Math.floor(limit / 2), extras: ['Meal voucher'], volunteersNeeded: 2, accepted: 0, pendingApproval: null });
  });

  it('applies a raise within the agent limit at once', async () => {
    const res = await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: limit }).expect(200);
    expect(res.body.approvalRequested).toBe(false);
    expect((await rounds())[0].offerMinor).toBe(limit);
  });

  it('refuses a "raise" that is not above the current offer', async () => {
    const res = await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: limit });
    expect(res.status).toBe(400);
    expect(res.body.details[0].field).toBe('offerMinor');
  });

  it('turns an agent’s raise above the limit into a pending approval, leaving the offer as it was', async () => {
    const res = await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: limit + 10_000 }).expect(200);
    expect(res.body.approvalRequested).toBe(true);
    const [round] = await rounds();
    expect(round.offerMinor).toBe(limit);
    expect(round.pendingApproval).toMatchObject({ offerMinor: limit + 10_000, requestedBy: DEMO.agent });
    approvalId = round.pendingApproval.id;
    const second = await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: limit + 20_000 });
    expect(second.status).toBe(409);
    expect(second.body.error).toBe('approval_pending');
  });

  it('lists the approval to supervisors and admins of the station, never to an agent', async () => {
    const listed = (await supervisor.get(`/api/approvals?stationId=${flight.stationId}`).expect(200)).body.approvals;
    expect(listed).toContainEqual(expect.objectContaining({ id: approvalId, kind: 'raise', roundId, flightId: flight.id, offerMinor: limit + 10_000, currency: 'USD', limitMinor: limit, requestedBy: DEMO.agent }));
    expect((await admin.get(`/api/approvals?stationId=${flight.stationId}`).expect(200)).body.approvals.map((a: { id: number }) => a.id)).toContain(approvalId);
    expect((await agent.get(`/api/approvals?stationId=${flight.stationId}`)).status).toBe(403);
  });

  it('does not let an agent approve (403), and the offer stays put', async () => {
    const res = await agent.post(`/api/approvals/${approvalId}`, { approve: true });
    expect(res.status).toBe(403);
    expect((await rounds())[0].offerMinor).toBe(limit);
  });

  it('applies the offer when a supervisor approves; a second decision is refused', async () => {
    const res = await supervisor.post(`/api/approvals/${approvalId}`, { approve: true, reason: 'long delay to the next flight' }).expect(200);
    expect(res.body.offerMinor).toBe(limit + 10_000);
    const [round] = await rounds();
    expect(round.offerMinor).toBe(limit + 10_000);
    expect(round.pendingApproval).toBeNull();
    const again = await supervisor.post(`/api/approvals/${approvalId}`, { approve: false, reason: 'changed my mind' });
    expect(again.status).toBe(409);
    expect(again.body.error).toBe('approval_decided');
  });

  it('does not let whoever asked for an offer approve it (four eyes, common practice)', async () => {
    const sup = (await supervisor.refreshCsrf()).user;
    // A supervisor's own raise applies at once, so a request in a supervisor's name is written directly: it stands
    // for one made while that person was still an agent.
    const own = await t.db.getRepository(OfferApprovalEntity).save({ roundId, stationId: flight.stationId, offerMinor: limit + 30_000, status: 'pending', requestedByUserId: sup.id, requestedByLabel: sup.email, decidedByUserId: null, reason: '' });
    const res = await supervisor.post(`/api/approvals/${own.id}`, { approve: true });
    expect(res.status).toBe(403);
    expect((await rounds())[0].offerMinor).toBe(limit + 10_000);
    // Deciding is a supervisor's act: an admin may look at the queue but not decide it.
    expect((await admin.post(`/api/approvals/${own.id}`, { approve: false, reason: 'too high' })).status).toBe(403);
    await t.db.getRepository(OfferApprovalEntity).update({ id: own.id }, { status: 'rejected', reason: 'test cleanup' });
  });

  it('applies a supervisor’s own raise above the agent limit without an approval', async () => {
    const res = await supervisor.post(`/api/rounds/${roundId}/raise`, { offerMinor: limit + 15_000 }).expect(200);
    expect(res.body.approvalRequested).toBe(false);
    expect((await rounds())[0].offerMinor).toBe(limit + 15_000);
  });

  it('accepts a volunteer at the offer standing at that moment, one compensation row for the passenger', async () => {
    const added = await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [parties[0].passengers[0].id] }).expect(201);
    await agent.post(`/api/rounds/${roundId}/volunteers/${added.body.id}/accept`).expect(200);
    const v = await t.db.getRepository(VolunteerEntity).findOneByOrFail({ id: added.body.id });
    expect(v).toMatchObject({ status: 'accepted', agreedMinor: limit + 15_000 });
    const comp = await t.db.getRepository(CompensationEntity).findBy({ sourceKind: 'volunteer', sourceId: v.id });
    expect(comp).toHaveLength(1);
    // Volunteers agree their own benefits; the cash-equivalent card is the default form (common practice).
    expect(comp[0]).toMatchObject({ passengerId: parties[0].passengers[0].id, amountMinor: limit + 15_000, currency: 'USD', voluntary: true, regime: 'us-dot', state: 'due', form: 'prepaid-card', voucherAgreedAt: null });
  });

  it('declines a volunteer; deciding them again is refused', async () => {
    const added = await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [parties[1].passengers[0].id] }).expect(201);
    await agent.post(`/api/rounds/${roundId}/volunteers/${added.body.id}/decline`).expect(200);
    const again = await agent.post(`/api/rounds/${roundId}/volunteers/${added.body.id}/accept`);
    expect(again.status).toBe(409);
    expect(again.body.error).toBe('already_decided');
  });

  it('closes the round, rejecting any approval still pending; nothing more can be accepted', async () => {
    await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: limit + 40_000 }).expect(200);
    const pending = await t.db.getRepository(OfferApprovalEntity).findOneByOrFail({ roundId, status: 'pending' });
    await agent.post(`/api/rounds/${roundId}/close`).expect(200);
    expect((await t.db.getRepository(OfferApprovalEntity).findOneByOrFail({ id: pending.id })).status).toBe('rejected');
    const added = await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [parties[2].passengers[0].id] });
    expect(added.status).toBe(409);
    expect(added.body.error).toBe('round_closed');
    expect((await agent.post(`/api/rounds/${roundId}/close`)).status).toBe(409);
  });

  it('left an audit row for every consequential step, with who did it', async () => {
    const rows = await t.db.getRepository(AuditLogEntity).find({ where: [{ entityType: 'volunteer_round', entityId: String(roundId) }, { entityType: 'offer_approval', entityId: String(approvalId) }], order: { id: 'ASC' } });
    const steps = rows.map((r) => [r.action, r.actorLabel]);
    expect(steps).toEqual(expect.arrayContaining([
      ['round.opened', DEMO.agent],
      ['round.offer_raised', DEMO.agent],
      ['round.offer_set', DEMO.agent],
      ['round.offer_raised', DEMO.agent],
      ['round.offer_raised', DEMO.supervisor],
      ['round.closed', DEMO.agent],
      ['approval.requested', DEMO.agent],
      ['approval.approved', DEMO.supervisor],
    ]));
    const requested = rows.find((r) => r.action === 'approval.requested')!;
    expect(requested.after).toMatchObject({ kind: 'raise', amountMinor: limit + 10_000, limitMinor: limit, roundId });
    const mine = (await t.db.getRepository(VolunteerEntity).findBy({ roundId })).map((v) => String(v.id));
    const volunteerRows = await t.db.getRepository(AuditLogEntity).findBy({ entityType: 'volunteer', entityId: In(mine) });
    expect(volunteerRows.map((r) => [r.action, r.actorLabel])).toEqual(expect.arrayContaining([['volunteer.offered', DEMO.agent], ['volunteer.accepted', DEMO.agent], ['volunteer.declined', DEMO.agent]]));
  });
});
