// Approval limits on every path that fixes a volunteer's amount: a posted round's opening offer, a raise and a
// sealed-bid accept. Above the user's own limit the amount waits for a supervisor of the station (never the one who
// asked, never an admin, never another station's), is shown to the agent, and the decision is audited.
// Outside sources: none prescribe limits. Limits per role and four eyes on money are common practice (no source);
// 14 CFR 250.2b (carriers set what they offer volunteers) and Reg. (EC) 261/2004 Art. 4(1) ("benefits under
// conditions to be agreed"), both from memory, say only that the carrier decides its own offers.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity, CompensationEntity, OfferApprovalEntity, StationEntity, VolunteerEntity, type FlightEntity } from '../../server/src/db/entities';
import { defaultPolicy } from '../../server/src/modules/volunteers/policy.service';
import { Client, startTestApp, type TestApp } from './harness';
import { TEST_PASSWORD, foreignStation, insertUser } from './helpers';
import { addBooking, makeFlight, tokenOf, closeAfterFlights } from './volunteers-fixtures';

// The station's own limits, set by this test (figures of our own): agents $600, supervisors $1,000.
const AGENT_LIMIT = 60_000;
const SUPERVISOR_LIMIT = 100_000;

let t: TestApp;
let station: StationEntity;
let other: StationEntity;
const flightIds: number[] = [];
const users: Record<'agent' | 'sup1' | 'sup2' | 'admin' | 'otherSup', { client: Client; id: number; email: string }> = {} as never;

async function person(label: string, role: 'agent' | 'supervisor' | 'admin', stationId: number) {
  const user = await insertUser(t.db, { label: `approvals-${label}`, role, stationIds: [stationId] });
  const client = new Client(t.app);
  if ((await client.signIn(user.email, TEST_PASSWORD)).status !== 200) throw new Error(`sign-in of ${label} failed`);
  return { client, id: user.id, email: user.email };
}

/** Burlington, Vermont: a real US airport (14 CFR 250 applies), used only by this file so its policy is its own. */
async function approvalsStation(): Promise<StationEntity> {
  const repo = t.db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'BTV' })) ?? repo.save(repo.create({ iata: 'BTV', name: 'Burlington (approvals API test station)', timeZone: 'America/New_York', regime: 'us-dot', currency: 'USD' }));
}

beforeAll(async () => {
  t = await startTestApp();
  station = await approvalsStation();
  other = await foreignStation(t.db);
  // Five password hashes and sign-ins, side by side: slow on a busy machine, so the set-up has three minutes.
  [users.agent, users.sup1, users.sup2, users.admin, users.otherSup] = await Promise.all([
    person('agent', 'agent', station.id), person('sup1', 'supervisor', station.id), person('sup2', 'supervisor', station.id),
    person('admin', 'admin', station.id), person('other-sup', 'supervisor', other.id),
  ]);
  await users.admin.client.put(`/api/stations/${station.id}/volunteer-policy`, { ...defaultPolicy('USD'), agentLimitMinor: AGENT_LIMIT, supervisorLimitMinor: SUPERVISOR_LIMIT, sealedBidPricing: 'own-ask' }).expect(200);
}, 180_000);

afterAll(() => closeAfterFlights(t, flightIds));

async function flightWith(parties: number): Promise<{ flight: FlightEntity; passengerIds: number[]; pnrs: string[] }> {
  const flight = await makeFlight(t.db, { stationId: station.id, origin: 'BTV', destination: 'EWR' });
  flightIds.push(flight.id);
  const passengerIds: number[] = [];
  const pnrs: string[] = [];
  for (let i = 0; i < parties; i++) {
    const b = await addBooking(t.db, flight, [[`Pax${i}`, 'Limit']]);
    passengerIds.push(b.passengers[0].id);
    pnrs.push(b.booking.pnr);
  }
  return { flight, passengerIds, pnrs };
}

const roundsOf = async (flightId: number) => (await users.agent.client.get(`/api/flights/${flightId}/rounds`).expect(200)).body;
const queue = async (c: Client = users.sup1.client) => (await c.get(`/api/approvals?stationId=${station.id}`).expect(200)).body.approvals as { id: number; kind: string; offerMinor: number; subject: string | null; limitMinor: number | null; requestedBy: string }[];
const auditOf = (approvalId: number) => t.db.getRepository(AuditLogEntity).find({ where: { entityType: 'offer_approval', entityId: String(approvalId) }, order: { id: 'ASC' } });

describe('a posted round opened above the agent’s limit', () => {
  it('opens without a standing offer, waits for a supervisor, and takes no accept until approved', async () => {
    const { flight, passengerIds } = await flightWith(1);
    const opened = await users.agent.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 90_000, volunteersNeeded: 1 }).expect(201);
    expect(opened.body.approvalRequested).toBe(true);
    const { rounds: [round], bidLink } = await roundsOf(flight.id);
    expect(round).toMatchObject({ offerMinor: null, pendingApproval: { kind: 'opening-offer', offerMinor: 90_000, requestedBy: users.agent.email } });
    // The passenger's page shows no amount that nobody approved.
    expect((await users.agent.client.agent.get(`/api/public/offers/${tokenOf(bidLink)}`).expect(200)).body.round.offerMinor).toBeNull();
    const v = await users.agent.client.post(`/api/rounds/${round.id}/volunteers`, { passengerIds }).expect(201);
    const early = await users.agent.client.post(`/api/rounds/${round.id}/volunteers/${v.body.id}/accept`);
    expect([early.status, early.body.error]).toEqual([409, 'awaiting_approval']);

    const [listed] = (await queue()).filter((a) => a.id === round.pendingApproval.id);
    expect(listed).toMatchObject({ kind: 'opening-offer', offerMinor: 90_000, limitMinor: AGENT_LIMIT, requestedBy: users.agent.email });
    expect((await users.agent.client.post(`/api/approvals/${listed.id}`, { approve: true })).status).toBe(403);
    await users.sup1.client.post(`/api/approvals/${listed.id}`, { approve: true, reason: 'next flight is tomorrow' }).expect(200);
    expect((await roundsOf(flight.id)).rounds[0]).toMatchObject({ offerMinor: 90_000, pendingApproval: null });
    await users.agent.client.post(`/api/rounds/${round.id}/volunteers/${v.body.id}/accept`).expect(200);
    expect((await auditOf(listed.id)).map((r) => [r.action, r.actorLabel])).toEqual([['approval.requested', users.agent.email], ['approval.approved', users.sup1.email]]);
  });
});

describe('a raise above the user’s limit', () => {
  it('needs another supervisor when a supervisor goes above the supervisor limit; whoever asked cannot decide', async () => {
    const { flight } = await flightWith(0);
    const { body: { id: roundId } } = await users.sup1.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 80_000, volunteersNeeded: 1 }).expect(201);
    const raised = await users.sup1.client.post(`/api/rounds/${roundId}/raise`, { offerMinor: 150_000 }).expect(200);
    expect(raised.body.approvalRequested).toBe(true);
    const { id } = (await roundsOf(flight.id)).rounds[0].pendingApproval;
    expect((await users.sup1.client.post(`/api/approvals/${id}`, { approve: true })).status).toBe(403);
    // An admin may look at the queue but does not decide money.
    expect((await queue(users.admin.client)).map((a) => a.id)).toContain(id);
    expect((await users.admin.client.post(`/api/approvals/${id}`, { approve: true })).status).toBe(403);
    // Another supervisor within their own limit may not approve more than that limit either.
    const tooHigh = await users.sup2.client.post(`/api/approvals/${id}`, { approve: true });
    expect(tooHigh.status).toBe(403);
    expect((await roundsOf(flight.id)).rounds[0].offerMinor).toBe(80_000);
    // A refusal says why (400 naming the field), and is audited with the reason.
    const bare = await users.sup2.client.post(`/api/approvals/${id}`, { approve: false });
    expect([bare.status, bare.body.details?.[0]?.field]).toEqual([400, 'reason']);
    await users.sup2.client.post(`/api/approvals/${id}`, { approve: false, reason: 'above what the station pays' }).expect(200);
    expect((await roundsOf(flight.id)).rounds[0]).toMatchObject({ offerMinor: 80_000, pendingApproval: null });
    const rows = await auditOf(id);
    expect(rows.map((r) => [r.action, r.actorLabel])).toEqual([['approval.requested', users.sup1.email], ['approval.rejected', users.sup2.email]]);
    expect(rows[1].after).toMatchObject({ kind: 'raise', amountMinor: 150_000, reason: 'above what the station pays' });
  });
});

describe('a sealed-bid accept above the agent’s limit', () => {
  it('waits for a supervisor instead of fixing $900 for an agent whose limit is $600, then accepts on approval', async () => {
    const { flight, passengerIds, pnrs } = await flightWith(1);
    const { body: { id: roundId } } = await users.agent.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'sealed', volunteersNeeded: 1 }).expect(201);
    const { body: { id: volunteerId } } = await users.agent.client.post(`/api/rounds/${roundId}/volunteers`, { passengerIds, askMinor: 90_000 }).expect(201);
    const asked = await users.agent.client.post(`/api/rounds/${roundId}/volunteers/${volunteerId}/accept`);
    expect([asked.status, asked.body.status]).toEqual([202, 'awaiting-approval']);
    expect(await t.db.getRepository(VolunteerEntity).findOneByOrFail({ id: volunteerId })).toMatchObject({ status: 'offered', agreedMinor: null });
    expect(await t.db.getRepository(CompensationEntity).countBy({ sourceKind: 'volunteer', sourceId: volunteerId })).toBe(0);
    // The desk shows it waiting; asking again does not make a second request.
    const shown = (await roundsOf(flight.id)).rounds[0].volunteers[0];
    expect(shown.pendingApproval).toMatchObject({ offerMinor: 90_000, requestedBy: users.agent.email });
    expect((await users.agent.client.post(`/api/rounds/${roundId}/volunteers/${volunteerId}/accept`)).body.error).toBe('approval_pending');

    const listed = (await queue()).find((a) => a.id === shown.pendingApproval.id)!;
    expect(listed).toMatchObject({ kind: 'sealed-accept', offerMinor: 90_000, limitMinor: AGENT_LIMIT });
    expect(listed.subject).toContain(pnrs[0]);
    await users.sup1.client.post(`/api/approvals/${listed.id}`, { approve: true }).expect(200);
    expect(await t.db.getRepository(VolunteerEntity).findOneByOrFail({ id: volunteerId })).toMatchObject({ status: 'accepted', agreedMinor: 90_000, acceptedByUserId: users.agent.id });
    const [comp] = await t.db.getRepository(CompensationEntity).findBy({ sourceKind: 'volunteer', sourceId: volunteerId });
    expect(comp).toMatchObject({ amountMinor: 90_000, state: 'due', amountClearedBy: `approval ${listed.id}` });
  });

  it('closes the waiting request when the agent declines the volunteer instead', async () => {
    const { flight, passengerIds } = await flightWith(1);
    const { body: { id: roundId } } = await users.agent.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'sealed', volunteersNeeded: 1 }).expect(201);
    const { body: { id: volunteerId } } = await users.agent.client.post(`/api/rounds/${roundId}/volunteers`, { passengerIds, askMinor: 80_000 }).expect(201);
    await users.agent.client.post(`/api/rounds/${roundId}/volunteers/${volunteerId}/accept`).expect(202);
    await users.agent.client.post(`/api/rounds/${roundId}/volunteers/${volunteerId}/decline`).expect(200);
    const request = await t.db.getRepository(OfferApprovalEntity).findOneByOrFail({ kind: 'sealed-accept', subjectId: volunteerId });
    expect(request).toMatchObject({ status: 'rejected', reason: 'the volunteer was declined' });
    expect((await queue()).map((a) => a.id)).not.toContain(request.id);
  });

  it('lets an ask within the limit through at once', async () => {
    const { flight, passengerIds } = await flightWith(1);
    const { body: { id: roundId } } = await users.agent.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'sealed', volunteersNeeded: 1 }).expect(201);
    const { body: { id: volunteerId } } = await users.agent.client.post(`/api/rounds/${roundId}/volunteers`, { passengerIds, askMinor: AGENT_LIMIT }).expect(201);
    expect((await users.agent.client.post(`/api/rounds/${roundId}/volunteers/${volunteerId}/accept`).expect(200)).body.status).toBe('accepted');
  });
});

describe('station scope of the approval queue', () => {
  it('answers "not found" to another station’s supervisor, for the list and for a decision', async () => {
    const { flight } = await flightWith(0);
    const { body: { id: roundId } } = await users.agent.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: 1 }).expect(201);
    await users.agent.client.post(`/api/rounds/${roundId}/raise`, { offerMinor: 70_000 }).expect(200);
    const pending = await t.db.getRepository(OfferApprovalEntity).findOneByOrFail({ roundId, status: 'pending' });
    expect((await users.otherSup.client.get(`/api/approvals?stationId=${station.id}`)).status).toBe(404);
    expect((await users.otherSup.client.get(`/api/approvals?stationId=${other.id}`).expect(200)).body.approvals.map((a: { id: number }) => a.id)).not.toContain(pending.id);
    expect((await users.otherSup.client.post(`/api/approvals/${pending.id}`, { approve: true })).status).toBe(404);
    expect((await t.db.getRepository(OfferApprovalEntity).findOneByOrFail({ id: pending.id })).status).toBe('pending');
    const missing = await users.sup1.client.get('/api/approvals');
    expect([missing.status, missing.body.details?.[0]?.field]).toEqual([400, 'stationId']);
  });
});
