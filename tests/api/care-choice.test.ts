// The passenger's choice and the care given, recorded at the desk per denied passenger (propose -> authorize -> rebook
// first, as the desk does). Check values: Rome Fiumicino-Hamburg 1,326 km (CJEU C-559/16 Bossen) is Art. 7(1)(a)
// EUR 250, halvable to EUR 125 under Art. 7(2)(a) when re-routed within 2 h; Art. 8(1)(a)(b)(c) the choices;
// Art. 9 the care.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FlightEntity } from '../../server/src/db/entities';
import { choiceAndCareForStatement } from '../../server/src/modules/care/for-statement';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, foreignStation, insertUser, removeRunUsers, TEST_PASSWORD } from './helpers';
import { addBooking, addSingles, createFlight, removeDenialFixtures } from './denials-fixtures';

let t: TestApp;
let agent: Client;
let supervisor: Client;
let outsider: Client;
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor] = await Promise.all([signedIn(t, DEMO.agent), signedIn(t, DEMO.supervisor)]);
  const other = await insertUser(t.db, { label: 'care-outsider', role: 'agent', stationIds: [(await foreignStation(t.db)).id] });
  outsider = new Client(t.app);
  await outsider.signIn(other.email, TEST_PASSWORD);
});
afterAll(async () => {
  if (flightIds.length) for (const table of ['care_given', 'passenger_choices', 'ticket_refunds']) await t.db.query(`DELETE FROM ${table} WHERE flight_id IN (?)`, [flightIds]);
  await removeDenialFixtures(t.db);
  await removeRunUsers(t.db);
  await t.close();
});

interface Case { flight: FlightEntity; compensationId: number; passengerId: number }

/** One passenger denied on a full FCO-HAM flight and rebooked on a flight `laterBy` minutes later. */
async function rebookedFcoHam(laterBy: number, applyReroutingReduction: boolean): Promise<Case> {
  const flight = await createFlight(t.db, { station: 'FCO', destination: 'HAM', seats: 2 });
  await addSingles(t.db, flight, 2, { fareMinor: 15_000, fareCurrency: 'EUR' });
  await addBooking(t.db, flight, [{ first: 'Bruno', last: 'Choice', checkedInBefore: 30, fareMinor: 9_900, fareCurrency: 'EUR' }]);
  const alternate = await createFlight(t.db, { station: 'FCO', destination: 'HAM', seats: 150, after: flight, laterBy });
  flightIds.push(flight.id);
  const proposal = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'oversold at the gate' }).expect(201)).body;
  await supervisor.post(`/api/denial-proposals/${proposal.id}/authorize`).expect(200);
  await agent.post(`/api/denials/${proposal.denials[0].id}/rebook`, { alternateFlightId: alternate.id, applyReroutingReduction }).expect(200);
  const [row] = await t.db.query(`SELECT id, passenger_id FROM compensations WHERE source_kind = 'denial' AND source_id = ?`, [proposal.denials[0].id]);
  return { flight, compensationId: row.id, passengerId: row.passenger_id };
}

const compensation = async (id: number) => (await t.db.query('SELECT amount_minor, rule_ref, state FROM compensations WHERE id = ?', [id]))[0];
const auditActions = async (entityType: string, entityId: number) =>
  (await t.db.query('SELECT action FROM audit_log WHERE entity_type = ? AND entity_id = ? ORDER BY id', [entityType, String(entityId)])).map((r: { action: string }) => r.action);

describe('the passenger’s choice sets what follows', () => {
  it('refund: the ticket refund is owed and the Art. 7(2) halving is withdrawn (EUR 125 -> EUR 250), audited', async () => {
    const c = await rebookedFcoHam(60, true);
    expect(await compensation(c.compensationId)).toMatchObject({ amount_minor: 12_500, rule_ref: expect.stringContaining('Art. 7(2)') });
    const before = (await agent.get(`/api/flights/${c.flight.id}/care`).expect(200)).body.passengers[0];
    expect(before.offers.map((o: { kind: string }) => o.kind)).toEqual(['refund', 'refund-and-return', 'reroute-earliest', 'reroute-later']);
    await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'refund', note: 'Will travel by train' }).expect(201);
    expect(await compensation(c.compensationId)).toMatchObject({ amount_minor: 25_000, rule_ref: 'Reg. (EC) 261/2004 Art. 7(1)(a)', state: 'due' });
    const [refund] = await t.db.query('SELECT amount_minor, currency, state, return_flight_owed FROM ticket_refunds WHERE compensation_id = ?', [c.compensationId]);
    expect(refund).toEqual({ amount_minor: 9_900, currency: 'EUR', state: 'owed', return_flight_owed: 0 });
    expect(await auditActions('compensation', c.compensationId)).toEqual(['passenger_choice.recorded', 'compensation.reduction_withdrawn']);
    const after = (await agent.get(`/api/flights/${c.flight.id}/care`).expect(200)).body.passengers[0];
    expect(after).toMatchObject({ choice: { kind: 'refund', note: 'Will travel by train' }, refundOwed: { amountMinor: 9_900, currency: 'EUR', state: 'owed' } });
    // The passenger is no longer waiting: no care is proposed (Commission guidelines 2016/C 214/04, from memory).
    expect(after.proposal.items).toEqual([]);
  });

  it('re-routing at the earliest opportunity keeps the halving and owes no refund', async () => {
    const c = await rebookedFcoHam(60, true);
    await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'reroute-earliest' }).expect(201);
    expect(await compensation(c.compensationId)).toMatchObject({ amount_minor: 12_500 });
    expect(await t.db.query('SELECT id FROM ticket_refunds WHERE compensation_id = ?', [c.compensationId])).toEqual([]);
  });

  it('a choice the rule does not offer, a bad body, a second choice, another station: refused and nothing written', async () => {
    const c = await rebookedFcoHam(60, false);
    const bad = await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'cash-instead' }).expect(400);
    expect(bad.body.details[0]).toMatchObject({ field: 'kind', rule: expect.stringContaining('refund') });
    const long = await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'refund', note: 'x'.repeat(301) }).expect(400);
    expect(long.body.details[0].field).toBe('note');
    await outsider.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'refund' }).expect(404);
    await outsider.get(`/api/flights/${c.flight.id}/care`).expect(404);
    expect(await auditActions('compensation', c.compensationId)).toEqual([]);
    await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'reroute-later' }).expect(201);
    // The same choice again (a double submit) changes nothing.
    await supervisor.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'reroute-later' }).expect(201);
    expect(await auditActions('compensation', c.compensationId)).toEqual(['passenger_choice.recorded']);
    await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'refund' }).expect(409);
    expect(await t.db.query('SELECT id FROM ticket_refunds WHERE compensation_id = ?', [c.compensationId])).toEqual([]);
  });

  it('a reduced amount already being paid is not silently raised: the refund choice is refused', async () => {
    const c = await rebookedFcoHam(60, true);
    await t.db.query(`UPDATE compensations SET state = 'issued' WHERE id = ?`, [c.compensationId]);
    const res = await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'refund' }).expect(409);
    expect(res.body.error).toBe('compensation_in_payment');
    expect(await t.db.query('SELECT id FROM passenger_choices WHERE compensation_id = ?', [c.compensationId])).toEqual([]);
  });
});

describe('care proposed from the alternate’s departure, and care given', () => {
  it('a 1 h wait on a band-a flight: refreshments and two calls, no meal; 2 h 30: a meal (Art. 9; Art. 6(1)(a) hours, common practice)', async () => {
    const short = await rebookedFcoHam(60, false);
    const kinds = async (c: Case) => (await agent.get(`/api/flights/${c.flight.id}/care`).expect(200)).body.passengers[0].proposal.items.map((i: { kind: string }) => i.kind);
    expect(await kinds(short)).toEqual(['refreshment', 'communication']);
    const long = await rebookedFcoHam(150, false);
    expect(await kinds(long)).toEqual(['refreshment', 'meal', 'communication']);
  });

  it('records a meal voucher and the calls with who provided them, audited, and lists them for the statement', async () => {
    const c = await rebookedFcoHam(150, false);
    const meal = await agent.post(`/api/compensations/${c.compensationId}/care`, { kind: 'meal', description: 'Meal voucher', amountMinor: 1_500, providedBy: 'Gate agent' }).expect(201);
    expect(meal.body.given).toMatchObject({ kind: 'meal', amountMinor: 1_500, currency: 'EUR', providedBy: 'Gate agent', recordedBy: DEMO.agent });
    await agent.post(`/api/compensations/${c.compensationId}/care`, { kind: 'communication', description: 'Two calls from the desk phone', providedBy: 'Gate agent' }).expect(201);
    expect(await auditActions('care_given', meal.body.given.id)).toEqual(['care.given']);
    const listed = (await agent.get(`/api/flights/${c.flight.id}/care`).expect(200)).body.passengers[0];
    expect(listed.given.map((g: { kind: string }) => g.kind)).toEqual(['meal', 'communication']);
    expect(await choiceAndCareForStatement(t.db, { compensationId: c.compensationId })).toEqual({
      choice: null,
      care: [{ kind: 'meal', description: 'Meal voucher', amountMinor: 1_500, currency: 'EUR' }, { kind: 'communication', description: 'Two calls from the desk phone' }],
    });
  });

  it('bad care input names the field; a hotel must be one of the station’s partners; another station sees nothing', async () => {
    const c = await rebookedFcoHam(60, false);
    const cases: [unknown, string][] = [
      [{ kind: 'spa', description: 'Massage', providedBy: 'Gate agent' }, 'kind'],
      [{ kind: 'meal', description: 'Meal voucher', amountMinor: -5, providedBy: 'Gate agent' }, 'amountMinor'],
      [{ kind: 'meal', description: 'Meal voucher', amountMinor: 12.5, providedBy: 'Gate agent' }, 'amountMinor'],
      [{ kind: 'meal', description: 'Meal voucher' }, 'providedBy'],
      [{ kind: 'hotel', description: 'One night', hotelId: 'h-nothere', providedBy: 'Hotel desk' }, 'hotelId'],
      [{ kind: 'meal', description: 'Meal', hotelId: 'h-nothere', providedBy: 'Hotel desk' }, 'hotelId'],
    ];
    for (const [body, field] of cases) {
      const res = await agent.post(`/api/compensations/${c.compensationId}/care`, body).expect(400);
      expect(res.body.details[0].field).toBe(field);
    }
    await outsider.post(`/api/compensations/${c.compensationId}/care`, { kind: 'meal', description: 'Meal voucher', providedBy: 'x y' }).expect(404);
    expect(await t.db.query('SELECT id FROM care_given WHERE compensation_id = ?', [c.compensationId])).toEqual([]);
  });
});

describe('the passenger is mailed their choice and the care given, in the booking’s language', () => {
  const outbox = async (compensationId: number) => (await t.db.query(
    `SELECT o.kind, o.subject, o.text, o.html FROM outbox_messages o JOIN compensations c ON c.flight_id = o.flight_id
     WHERE c.id = ? AND o.dedupe_key LIKE 'care-mail:%' ORDER BY o.created_at, o.id`, [compensationId])) as { kind: string; subject: string; text: string; html: string }[];

  it('a denied passenger gets the statement again with "Your choice" and "Care given", at the full amount once refunded (Art. 7(1)(a) EUR 250)', async () => {
    const c = await rebookedFcoHam(60, true);
    await agent.post(`/api/compensations/${c.compensationId}/care-mail`).expect(409);
    await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'refund', note: 'Will travel by train' }).expect(201);
    await agent.post(`/api/compensations/${c.compensationId}/care`, { kind: 'meal', description: 'Meal voucher', amountMinor: 1_500, providedBy: 'Gate agent' }).expect(201);
    const first = (await agent.post(`/api/compensations/${c.compensationId}/care-mail`).expect(200)).body;
    expect(first).toMatchObject({ created: true, kind: 'written-statement' });
    // A second click with nothing new queues nothing.
    expect((await supervisor.post(`/api/compensations/${c.compensationId}/care-mail`).expect(200)).body).toMatchObject({ created: false, messageId: first.messageId });
    const [mail] = await outbox(c.compensationId);
    expect(mail.kind).toBe('written-statement');
    expect(mail.text).toContain('Your choice');
    expect(mail.text).toContain('Refund of your ticket: The price of the unused part of your ticket is refunded within seven days. Your request: Will travel by train');
    expect(mail.text.replace(/\u00a0/g, ' ')).toContain('- Meal: Meal voucher (EUR 15.00)');
    // The refund lifted the Art. 7(2) halving (EUR 125): the statement states the full EUR 250.
    expect(mail.text.replace(/\u00a0/g, ' ')).toContain('Compensation calculated: EUR 250.00');
    expect(mail.html).toContain('>Your choice</h2>');
    expect(await auditActions('compensation', c.compensationId)).toContain('care.mail_queued');
  });

  it('in Italian for an Italian booking, the printable statement too', async () => {
    const c = await rebookedFcoHam(150, false);
    await t.db.query(`UPDATE bookings b JOIN passengers p ON p.booking_id = b.id SET b.language = 'it' WHERE p.id = ?`, [c.passengerId]);
    await agent.post(`/api/compensations/${c.compensationId}/choice`, { kind: 'reroute-earliest' }).expect(201);
    await agent.post(`/api/compensations/${c.compensationId}/care`, { kind: 'communication', description: 'Due telefonate dal banco', providedBy: 'Gate agent' }).expect(201);
    await agent.post(`/api/compensations/${c.compensationId}/care-mail`).expect(200);
    const [mail] = await outbox(c.compensationId);
    expect(mail.text).toContain('La sua scelta');
    expect(mail.text).toContain('Imbarco su un volo alternativo il prima possibile: Viene portato alla destinazione finale il prima possibile.');
    expect(mail.text).toContain('- Telefonate o messaggi: Due telefonate dal banco');
    const [{ source_id: denialId }] = await t.db.query('SELECT source_id FROM compensations WHERE id = ?', [c.compensationId]);
    const page = await agent.get(`/api/denials/${denialId}/statement`).expect(200);
    expect(page.text).toContain('Telefonate o messaggi: Due telefonate dal banco');
  });

  it('no address: refused naming the field, nothing queued; another station: not found', async () => {
    const c = await rebookedFcoHam(150, false);
    await agent.post(`/api/compensations/${c.compensationId}/care`, { kind: 'meal', description: 'Meal voucher', amountMinor: 1_500, providedBy: 'Gate agent' }).expect(201);
    await outsider.post(`/api/compensations/${c.compensationId}/care-mail`).expect(404);
    await t.db.query(`UPDATE bookings b JOIN passengers p ON p.booking_id = b.id SET b.contact_email = NULL WHERE p.id = ?`, [c.passengerId]);
    const res = await agent.post(`/api/compensations/${c.compensationId}/care-mail`).expect(400);
    expect(res.body.details[0].field).toBe('to');
    expect(await outbox(c.compensationId)).toEqual([]);
  });
});
