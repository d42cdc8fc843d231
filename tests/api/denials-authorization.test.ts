// Proposals and the supervisor's authorization. Outside sources: separation of duties, "no one approves their own
// request" (NIST SP 800-53 AC-5, from memory); OWASP Authorization Cheat Sheet (deny by default, check every request,
// from memory); RFC 9110 §15.5.4 (403 when the credentials are not enough).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FlightEntity } from '../../server/src/db/entities';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, TEST_PASSWORD, insertUser, removeRunUsers } from './helpers';
import { addBooking, addSingles, createFlight, removeDenialFixtures } from './denials-fixtures';

let t: TestApp;
let agent: Client;
let supervisor: Client;
let finance: Client;
let admin: Client;
/** A second supervisor of the station: nobody authorizes their own proposal, so two are needed. */
let second: Client;

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor, finance, admin] = await Promise.all([DEMO.agent, DEMO.supervisor, DEMO.finance, DEMO.admin].map((e) => signedIn(t, e)));
  const [bos] = await t.db.query(`SELECT id FROM stations WHERE iata = 'BOS'`);
  const user = await insertUser(t.db, { label: 'second-supervisor', role: 'supervisor', stationIds: [bos.id] });
  second = new Client(t.app);
  expect((await second.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
});
afterAll(async () => {
  await removeDenialFixtures(t.db);
  await removeRunUsers(t.db);
  await t.close();
});

async function flightWithSingles(n: number, seats = 2): Promise<FlightEntity> {
  const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats });
  await addSingles(t.db, flight, n);
  return flight;
}

const auditRows = (action: string, entityId: number) =>
  t.db.query('SELECT action, actor_label, `before`, `after` FROM audit_log WHERE action = ? AND entity_id = ? ORDER BY id', [action, String(entityId)]);

describe('proposing denials', () => {
  it('picks candidates in rank order until the seats are covered, prefilled from the live shortfall, and audits it', async () => {
    const flight = await flightWithSingles(5);
    const candidates = (await agent.get(`/api/flights/${flight.id}/denial-candidates`).expect(200)).body;
    expect(candidates.counts.seatsShortAfterProposals).toBe(3); // derived: 5 checked in on 2 seats
    const res = await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 2, reason: 'two short after the volunteer round' }).expect(201);
    expect(res.body.status).toBe('proposed');
    expect(res.body.denials.map((d: { passengerIds: number[] }) => d.passengerIds)).toEqual(candidates.candidates.slice(0, 2).map((c: { passengerIds: number[] }) => c.passengerIds));
    expect(res.body.denials[0].reasons.length).toBeGreaterThan(1);
    const after = (await agent.get(`/api/flights/${flight.id}/denial-candidates`).expect(200)).body;
    expect(after.counts).toMatchObject({ waitingProposalSeats: 2, seatsShortAfterProposals: 1 });
    expect(after.candidates[0].selection).toMatchObject({ status: 'proposed', proposalId: res.body.id });
    const [row] = await auditRows('denial_proposal.created', res.body.id);
    expect(row.actor_label).toBe(DEMO.agent);
  });

  it('a second proposal while one waits is a conflict; a missing reason is a 400 naming reason', async () => {
    const flight = await flightWithSingles(3);
    const missing = await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1 }).expect(400);
    expect(missing.body.details[0].field).toBe('reason');
    await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201);
    const again = await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(409);
    expect(again.body.error).toBe('proposal_waiting');
  });

  it('admin and finance may not propose (403)', async () => {
    const flight = await flightWithSingles(3);
    await admin.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(403);
    await finance.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(403);
  });
});

describe('authorizing', () => {
  it('only a supervisor authorizes: the agent, finance and an admin without the supervisor role get 403', async () => {
    const flight = await flightWithSingles(3);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    expect((await agent.post(`/api/denial-proposals/${p.id}/authorize`).expect(403)).body.error).toBe('forbidden');
    expect((await finance.post(`/api/denial-proposals/${p.id}/authorize`).expect(403)).body.error).toBe('forbidden');
    expect((await admin.post(`/api/denial-proposals/${p.id}/authorize`).expect(403)).body.error).toBe('forbidden');
    expect((await admin.post(`/api/denial-proposals/${p.id}/authorize`, { denialIds: [p.denials[0].id] }).expect(403)).body.error).toBe('forbidden');
    expect((await t.db.query('SELECT status FROM denials WHERE id = ?', [p.denials[0].id]))[0].status).toBe('proposed');
    const ok = await supervisor.post(`/api/denial-proposals/${p.id}/authorize`).expect(200);
    expect(ok.body.status).toBe('authorized');
    expect(ok.body.denials[0]).toMatchObject({ status: 'authorized', authorizedBy: 'Sam Okafor (demo supervisor)' });
    // The authorized passenger leaves the flight, and the shortfall falls with them.
    const [{ status }] = await t.db.query('SELECT status FROM passengers WHERE id = ?', [p.denials[0].passengerIds[0]]);
    expect(status).toBe('offloaded');
    const counts = (await agent.get(`/api/flights/${flight.id}/denial-candidates`).expect(200)).body.counts;
    expect(counts.seatsShort).toBe(0); // derived: 3 checked in, 1 offloaded, 2 seats
    const [row] = await auditRows('denial.authorized', p.denials[0].id);
    expect(row.actor_label).toBe(DEMO.supervisor);
    expect((await auditRows('denial_proposal.authorized', p.id)).length).toBe(1);
  });

  it('never the proposing user: a supervisor who proposed gets 403 with a clear message; another supervisor may', async () => {
    const flight = await flightWithSingles(3);
    const p = (await supervisor.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    const own = await supervisor.post(`/api/denial-proposals/${p.id}/authorize`).expect(403);
    expect(own.body.message).toMatch(/You proposed these denials\. Another supervisor must authorize them/);
    await second.post(`/api/denial-proposals/${p.id}/authorize`).expect(200);
  });

  it('authorizes one denial at a time when named, leaving the rest waiting', async () => {
    const flight = await flightWithSingles(4);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 2, reason: 'two short' }).expect(201)).body;
    const first = await supervisor.post(`/api/denial-proposals/${p.id}/authorize`, { denialIds: [p.denials[0].id] }).expect(200);
    expect(first.body.status).toBe('proposed');
    expect(first.body.denials.map((d: { status: string }) => d.status)).toEqual(['authorized', 'proposed']);
    const bad = await supervisor.post(`/api/denial-proposals/${p.id}/authorize`, { denialIds: [999999999] }).expect(400);
    expect(bad.body.details[0].field).toBe('denialIds');
    const all = await supervisor.post(`/api/denial-proposals/${p.id}/authorize`).expect(200);
    expect(all.body.status).toBe('authorized');
  });
});

describe('changing the selection', () => {
  it('without a reason is a 400 that names reason', async () => {
    const flight = await flightWithSingles(3);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    const res = await supervisor.post(`/api/denial-proposals/${p.id}/change`, { remove: [p.denials[0].id], add: [] }).expect(400);
    expect(res.body.details.map((d: { field: string }) => d.field)).toContain('reason');
    expect(res.body.message).toMatch(/^reason: /);
    const blank = await supervisor.post(`/api/denial-proposals/${p.id}/change`, { remove: [p.denials[0].id], reason: '  ' }).expect(400);
    expect(blank.body.details[0].field).toBe('reason');
  });

  it('swaps a selected booking for another with a reason, audited; the agent may not change (403)', async () => {
    const flight = await flightWithSingles(3);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    const ranking = (await agent.get(`/api/flights/${flight.id}/denial-candidates`).expect(200)).body;
    const other = ranking.candidates.find((c: { selection: unknown }) => c.selection === null);
    await agent.post(`/api/denial-proposals/${p.id}/change`, { remove: [p.denials[0].id], add: [other.bookingId], reason: 'connecting to a funeral' }).expect(403);
    const res = await supervisor.post(`/api/denial-proposals/${p.id}/change`, { remove: [p.denials[0].id], add: [other.bookingId], reason: 'connecting to a funeral' }).expect(200);
    expect(res.body.status).toBe('changed');
    expect(res.body.denials.find((d: { id: number }) => d.id === p.denials[0].id)).toMatchObject({ status: 'removed', changeReason: 'connecting to a funeral' });
    const added = res.body.denials.find((d: { bookingId: number }) => d.bookingId === other.bookingId);
    expect(added).toMatchObject({ status: 'proposed', changeReason: 'connecting to a funeral' });
    const [row] = await auditRows('denial_proposal.changed', p.id);
    const after = typeof row.after === 'string' ? JSON.parse(row.after) : row.after;
    expect(after.reason).toBe('connecting to a funeral');
    // The supervisor who added a booking is its proposer and may not authorize it alone.
    const own = await supervisor.post(`/api/denial-proposals/${p.id}/authorize`).expect(403);
    expect(own.body.message).toMatch(/You added denial/);
    await second.post(`/api/denial-proposals/${p.id}/authorize`).expect(200);
  });

  it('refuses to add a protected booking, naming the protection', async () => {
    const flight = await flightWithSingles(3);
    const { booking } = await addBooking(t.db, flight, [{ first: 'Uma', last: 'Minor', ssr: ['UMNR'], isChild: true }]);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    const res = await supervisor.post(`/api/denial-proposals/${p.id}/change`, { add: [booking.id], reason: 'trying the minor' }).expect(400);
    expect(res.body.message).toContain('unaccompanied minor');
  });
});

describe('withdrawing', () => {
  it('removes the waiting selection with the reason and is a no-op the second time', async () => {
    const flight = await flightWithSingles(3);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    await agent.post(`/api/denial-proposals/${p.id}/withdraw`, {}).expect(400);
    const res = await agent.post(`/api/denial-proposals/${p.id}/withdraw`, { reason: 'a passenger misconnected; seats freed' }).expect(200);
    expect(res.body.status).toBe('withdrawn');
    expect(res.body.denials[0].status).toBe('removed');
    await agent.post(`/api/denial-proposals/${p.id}/withdraw`, { reason: 'again' }).expect(200);
    expect((await auditRows('denial_proposal.withdrawn', p.id)).length).toBe(1);
    const ended = await supervisor.post(`/api/denial-proposals/${p.id}/authorize`).expect(409);
    expect(ended.body.error).toBe('proposal_withdrawn');
  });
});

describe('the supervisor\'s waiting list', () => {
  it('lists waiting proposals of the station to supervisors, not to agents', async () => {
    const flight = await flightWithSingles(3);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    const res = await supervisor.get(`/api/stations/${flight.stationId}/denial-proposals`).expect(200);
    expect(res.body.proposals.find((x: { id: number }) => x.id === p.id)).toMatchObject({ flightId: flight.id, seatsSelected: 1, proposedBy: 'Alex Gatewood (demo agent)' });
    await agent.get(`/api/stations/${flight.stationId}/denial-proposals`).expect(403);
  });
});
