// Alerts that reach a busy station: a passenger volunteered from their phone, an amount waits for a supervisor or
// was decided, a denial proposal waits for a supervisor. Each is listed for the station's people only (finance sees
// payments, another station sees nothing), closes by itself once its subject is decided, can be dismissed, and
// reaches open consoles through the station's live notice.
// Outside sources: none prescribe alerts. Four eyes on money above a limit is common practice (no source); a
// supervisor deciding involuntary denials is the carrier's own procedure under 14 CFR 250.2b (from memory).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import type { AlertView } from '@shared/schemas/alerts';
import type { ChangedPayload, ClientToServerEvents, ServerToClientEvents } from '@shared/events';
import { AuditLogEntity, StationEntity, type FlightEntity } from '../../server/src/db/entities';
import { defaultPolicy } from '../../server/src/modules/volunteers/policy.service';
import { Client, startTestApp, type TestApp } from './harness';
import { TEST_PASSWORD, foreignStation, insertUser, removeRunUsers, sessionCookie } from './helpers';
import { addBooking, createFlight } from './denials-fixtures';
import { removeFlights, settle, tokenOf } from './volunteers-fixtures';

// The station's own limit, set by this test (a figure of our own): agents $300.
const AGENT_LIMIT = 30_000;

let t: TestApp;
let station: StationEntity;
const flightIds: number[] = [];
type Person = { client: Client; id: number; cookie: string };
const people = {} as Record<'agent' | 'supervisor' | 'finance' | 'admin' | 'elsewhere', Person>;
let socket: Socket<ServerToClientEvents, ClientToServerEvents>;
const notices: ChangedPayload[] = [];

async function person(label: string, role: 'agent' | 'supervisor' | 'finance' | 'admin', stationId: number): Promise<Person> {
  const user = await insertUser(t.db, { label: `alerts-${label}`, role, stationIds: [stationId] });
  const client = new Client(t.app);
  const res = await client.signIn(user.email, TEST_PASSWORD);
  if (res.status !== 200) throw new Error(`sign-in of ${label} failed`);
  return { client, id: user.id, cookie: (sessionCookie(res) ?? '').split(';')[0] };
}

/** Syracuse, New York: a US airport used only by this file, so its alerts and policy are its own. */
async function alertsStation(): Promise<StationEntity> {
  const repo = t.db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'SYR' })) ?? repo.save(repo.create({ iata: 'SYR', name: 'Syracuse (alerts API test station)', timeZone: 'America/New_York', regime: 'us-dot', currency: 'USD' }));
}

beforeAll(async () => {
  t = await startTestApp({ sockets: true, live: true });
  station = await alertsStation();
  await t.db.query('DELETE FROM alerts WHERE station_id = ?', [station.id]);
  const other = await foreignStation(t.db);
  [people.agent, people.supervisor, people.finance, people.admin, people.elsewhere] = await Promise.all([
    person('agent', 'agent', station.id), person('supervisor', 'supervisor', station.id), person('finance', 'finance', station.id),
    person('admin', 'admin', station.id), person('elsewhere', 'supervisor', other.id),
  ]);
  await people.admin.client.put(`/api/stations/${station.id}/volunteer-policy`, { ...defaultPolicy('USD'), agentLimitMinor: AGENT_LIMIT }).expect(200);
  // The supervisor's console, watching the station as Station day does.
  socket = connect(t.baseUrl, { transports: ['websocket'], extraHeaders: { cookie: people.supervisor.cookie }, reconnection: false });
  await new Promise<void>((resolve, reject) => {
    socket.on('connect', () => resolve());
    socket.on('connect_error', reject);
  });
  socket.on('station:changed', (p) => notices.push(p));
  expect(await new Promise<boolean>((r) => socket.emit('station:watch', station.id, (a) => r(a.ok)))).toBe(true);
}, 180_000);

afterAll(async () => {
  socket?.disconnect();
  await settle(t);
  await t.db.query('DELETE FROM alerts WHERE station_id = ?', [station.id]);
  await removeFlights(t.db, flightIds);
  await removeRunUsers(t.db);
  await t.close();
});

async function alertsFor(p: Person, status: 'open' | 'all' = 'open'): Promise<AlertView[]> {
  return (await p.client.get(`/api/alerts?stationId=${station.id}&status=${status}`).expect(200)).body.alerts;
}
const ofFlight = (alerts: AlertView[], flight: FlightEntity) => alerts.filter((a) => a.flightId === flight.id);
const alertNoticesSince = (n: number) => notices.slice(n).filter((p) => p.id === station.id && p.topics?.includes('alerts')).length;

async function flightWithParty(seats = 150) {
  const flight = await createFlight(t.db, { station: 'SYR', destination: 'JFK', seats });
  flightIds.push(flight.id);
  return flight;
}

describe('an amount above the agent’s limit', () => {
  it('alerts the station while it waits, closes by itself once decided, and tells the agent the decision', async () => {
    const flight = await flightWithParty();
    const heard = notices.length;
    await people.agent.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 45_000, volunteersNeeded: 1 }).expect(201);
    const [waiting] = ofFlight(await alertsFor(people.supervisor), flight);
    expect(waiting).toMatchObject({ kind: 'approval-waiting', stationIata: 'SYR', flight: `ZZ ${flight.flightNumber}`, resolvedAt: null, acknowledgedAt: null });
    expect(waiting.message).toContain('USD 450.00');
    expect(waiting.message).toContain('USD 300.00');
    await expect.poll(() => alertNoticesSince(heard)).toBeGreaterThan(0);

    const [approval] = (await people.supervisor.client.get(`/api/approvals?stationId=${station.id}`).expect(200)).body.approvals;
    await people.supervisor.client.post(`/api/approvals/${approval.id}`, { approve: true, reason: 'a full flight tomorrow' }).expect(200);
    const open = ofFlight(await alertsFor(people.agent), flight);
    expect(open.map((a) => a.kind)).toEqual(['approval-decided']);
    expect(open[0].message).toContain('approved USD 450.00');
    expect(open[0].message).toContain('a full flight tomorrow');
    const closed = ofFlight(await alertsFor(people.agent, 'all'), flight).find((a) => a.kind === 'approval-waiting');
    expect(closed).toMatchObject({ resolution: 'the amount was approved' });
    expect(closed?.resolvedAt).not.toBeNull();
  });

  it('is dismissed by the agent who read the decision, audited, and colleagues hear of it', async () => {
    const [decided] = (await alertsFor(people.agent)).filter((a) => a.kind === 'approval-decided');
    const heard = notices.length;
    const res = await people.agent.client.post(`/api/alerts/${decided.id}/acknowledge`).expect(200);
    expect(res.body.alert.resolvedAt).not.toBeNull();
    expect((await alertsFor(people.supervisor)).some((a) => a.id === decided.id)).toBe(false);
    expect(await t.db.getRepository(AuditLogEntity).countBy({ action: 'alert.acknowledged', entityId: String(decided.id) })).toBe(1);
    await expect.poll(() => alertNoticesSince(heard)).toBeGreaterThan(0);
  });
});

describe('a passenger who volunteers from their phone', () => {
  it('alerts the station, live, and the alert closes once the agent answers the offer', async () => {
    const flight = await flightWithParty();
    const { booking } = await addBooking(t.db, flight, [{ first: 'Mira', last: 'Phoneoffer' }]);
    await people.agent.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: 1 }).expect(201);
    const token = tokenOf((await people.agent.client.get(`/api/flights/${flight.id}/rounds`).expect(200)).body.bidLink);
    const who = await people.agent.client.agent.post(`/api/public/offers/${token}/identify`).set('X-Forwarded-For', '198.51.100.71').send({ pnr: booking.pnr, lastName: 'Phoneoffer' }).expect(200);
    const heard = notices.length;
    const bid = await people.agent.client.agent.post(`/api/public/offers/${token}/bids`).set('X-Forwarded-For', '198.51.100.71').send({ passengerToken: who.body.passengerToken, acceptPosted: true }).expect(201);
    expect(bid.body.status).toBe('offered');
    await expect.poll(() => alertNoticesSince(heard)).toBeGreaterThan(0);
    const [offered] = ofFlight(await alertsFor(people.agent), flight);
    expect(offered.kind).toBe('volunteer-offered');
    expect(offered.message).toContain('Mira Phoneoffer offered their seat from their phone');

    const { rounds: [round] } = (await people.agent.client.get(`/api/flights/${flight.id}/rounds`).expect(200)).body;
    await people.agent.client.post(`/api/rounds/${round.id}/volunteers/${round.volunteers[0].id}/accept`).expect(200);
    expect(ofFlight(await alertsFor(people.agent), flight)).toEqual([]);
    expect(ofFlight(await alertsFor(people.agent, 'all'), flight)[0]).toMatchObject({ kind: 'volunteer-offered', resolution: 'the offer was accepted' });
  });

  it('raises nothing when the agent enters the offer at the desk (it is already on their screen)', async () => {
    const flight = await flightWithParty();
    const { passengers } = await addBooking(t.db, flight, [{ first: 'Desk', last: 'Entered' }]);
    await people.agent.client.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: 1 }).expect(201);
    const { rounds: [round] } = (await people.agent.client.get(`/api/flights/${flight.id}/rounds`).expect(200)).body;
    await people.agent.client.post(`/api/rounds/${round.id}/volunteers`, { passengerIds: [passengers[0].id] }).expect(201);
    expect(ofFlight(await alertsFor(people.agent, 'all'), flight)).toEqual([]);
  });
});

describe('a denial proposal', () => {
  it('alerts the station until a supervisor decides it or it is withdrawn', async () => {
    const flight = await flightWithParty(2);
    for (const last of ['Ahn', 'Berg', 'Cole']) await addBooking(t.db, flight, [{ first: 'Pat', last }]);
    const proposal = (await people.agent.client.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'oversold at the gate' }).expect(201)).body;
    const [alert] = ofFlight(await alertsFor(people.supervisor), flight);
    expect(alert.kind).toBe('denial-proposed');
    expect(alert.message).toContain('proposes denying boarding for 1 seat');
    expect(alert.message).toContain('oversold at the gate');
    // Seen by the supervisor: out of the count, still listed while the proposal waits.
    await people.supervisor.client.post(`/api/alerts/${alert.id}/acknowledge`).expect(200);
    expect(ofFlight(await alertsFor(people.agent), flight)[0]).toMatchObject({ id: alert.id, resolvedAt: null });
    expect(ofFlight(await alertsFor(people.agent), flight)[0].acknowledgedAt).not.toBeNull();
    await people.agent.client.post(`/api/denial-proposals/${proposal.id}/withdraw`, { reason: 'a volunteer came forward' }).expect(200);
    expect(ofFlight(await alertsFor(people.agent), flight)).toEqual([]);
  });
});

describe('who sees which alerts', () => {
  it('finance sees payments only; another station’s supervisor sees nothing and cannot dismiss', async () => {
    const all = await alertsFor(people.supervisor, 'all');
    expect(all.length).toBeGreaterThan(0);
    expect(await alertsFor(people.finance, 'all')).toEqual([]);
    await people.finance.client.post(`/api/alerts/${all[0].id}/acknowledge`).expect(404);
    await people.elsewhere.client.get(`/api/alerts?stationId=${station.id}`).expect(404);
    await people.elsewhere.client.post(`/api/alerts/${all[0].id}/acknowledge`).expect(404);
    expect(((await people.elsewhere.client.get('/api/alerts').expect(200)).body.alerts as AlertView[]).some((a) => a.stationId === station.id)).toBe(false);
  });
});
