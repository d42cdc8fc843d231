// Compensation per regime through the API (propose -> authorize -> rebook), the records it leaves, and the written
// statement. Check values and their sources are beside each case.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FlightEntity } from '../../server/src/db/entities';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO } from './helpers';
import { addBooking, addSingles, createFlight, removeDenialFixtures, type PassengerSpec } from './denials-fixtures';

let t: TestApp;
let agent: Client;
let supervisor: Client;

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor] = await Promise.all([signedIn(t, DEMO.agent), signedIn(t, DEMO.supervisor)]);
});
afterAll(async () => {
  await removeDenialFixtures(t.db);
  await t.close();
});

interface Case {
  flight: FlightEntity;
  alternate: FlightEntity | null;
  denialId: number;
  passengerIds: number[];
}

/**
 * A full flight (every seat taken by a traveller alone) where one more booking (`denied`) checked in last, at the
 * deadline: a real shortfall of its size, and the default rules select it first.
 */
async function authorizedCase(station: string, destination: string, denied: PassengerSpec[], opts: { seats?: number; alternateLaterBy?: number; currency: string; email?: string | null }): Promise<Case> {
  // 30 seats: the smallest aircraft 14 CFR 250.2 covers.
  const seats = opts.seats ?? 30;
  const flight = await createFlight(t.db, { station, destination, seats });
  await addSingles(t.db, flight, seats, { fareMinor: 20_000, fareCurrency: opts.currency });
  await addBooking(t.db, flight, denied.map((p) => ({ checkedInBefore: 30, fareCurrency: opts.currency, ...p })), { email: opts.email });
  const alternate = opts.alternateLaterBy === undefined ? null : await createFlight(t.db, { station, destination, seats: 150, after: flight, laterBy: opts.alternateLaterBy });
  const proposal = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: denied.length, reason: 'oversold at the gate' }).expect(201)).body;
  expect(proposal.denials).toHaveLength(1);
  await supervisor.post(`/api/denial-proposals/${proposal.id}/authorize`).expect(200);
  return { flight, alternate, denialId: proposal.denials[0].id, passengerIds: proposal.denials[0].passengerIds };
}

const compensationRows = (denialId: number) =>
  t.db.query(`SELECT passenger_id, amount_minor, currency, band, rule_ref, voluntary, state, source_kind FROM compensations WHERE source_kind = 'denial' AND source_id = ? ORDER BY passenger_id`, [denialId]);
const statementMessages = (flightId: number) =>
  t.db.query(`SELECT kind, to_address, subject, text, html, passenger_ids, dedupe_key FROM outbox_messages WHERE flight_id = ? AND kind = 'written-statement' ORDER BY created_at, id`, [flightId]);

describe('us-dot (14 CFR 250.5)', () => {
  it('alternate planned 90 min later on a domestic flight: 200% of the one-way fare (250.5(a)(2)), recorded per passenger', async () => {
    const c = await authorizedCase('BOS', 'ORD', [{ first: 'Ursula', last: 'Usfare', fareMinor: 25_000 }], { currency: 'USD', alternateLaterBy: 90 });
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate!.id }).expect(200);
    const [owed] = res.body.denial.compensation.passengers;
    // 14 CFR 250.5(a)(2): more than 1 h and less than 2 h late -> 200% of USD 250.00 = USD 500.00 (cap USD 1,075, 89 FR 84815).
    expect(owed).toMatchObject({ amountMinor: 50_000, currency: 'USD', band: 'us-200pct', ruleRef: '14 CFR 250.5(a)(2)', problem: null });
    expect(res.body.denial).toMatchObject({ category: '1a', rebooking: { plannedArrivalDelayMinutes: 90 } });
    expect(res.body.denial.compensation.settled).toBe(true);
    const rows = await compensationRows(c.denialId);
    expect(rows).toEqual([{ passenger_id: c.passengerIds[0], amount_minor: 50_000, currency: 'USD', band: 'us-200pct', rule_ref: '14 CFR 250.5(a)(2)', voluntary: 0, state: 'due', source_kind: 'denial' }]);
  });

  it('no alternate offered: 400%, capped at USD 2,150 (250.5(a)(3); 89 FR 84815); report line 1b', async () => {
    const c = await authorizedCase('BOS', 'ORD', [{ first: 'Carl', last: 'Capped', fareMinor: 70_000 }], { currency: 'USD' });
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { noAlternate: true }).expect(200);
    expect(res.body.denial.compensation.passengers[0]).toMatchObject({ amountMinor: 215_000, band: 'us-400pct' });
    expect(res.body.denial.category).toBe('1b');
    expect(res.body.denial.rebooking).toBeNull();
  });

  it('an aircraft under 30 seats is outside Part 250 (250.2): nothing due, left for a person to classify', async () => {
    const c = await authorizedCase('BOS', 'ORD', [{ first: 'Tina', last: 'Turboprop', fareMinor: 30_000 }], { currency: 'USD', seats: 20 });
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { noAlternate: true }).expect(200);
    expect(res.body.denial.compensation.passengers[0]).toMatchObject({ amountMinor: 0, band: 'out-of-scope', ruleRef: '14 CFR 250.2' });
    expect(res.body.denial.category).toBeNull();
  });

  it('a fare not in USD cannot be computed: the rebooking is refused with a 400 naming oneWayFare.currency, nothing recorded', async () => {
    const c = await authorizedCase('BOS', 'ORD', [{ first: 'Erik', last: 'Eurofare', fareMinor: 30_000, fareCurrency: 'EUR' }], { currency: 'USD', alternateLaterBy: 180 });
    const preview = (await agent.get(`/api/flights/${c.flight.id}/denial-proposals`).expect(200)).body.proposals[0].denials[0].compensation;
    expect(preview.settled).toBe(false);
    expect(preview.passengers[0].problem).toMatch(/^oneWayFare\.currency: /);
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate!.id }).expect(400);
    expect(res.body.details[0].field).toBe('oneWayFare.currency');
    expect(await compensationRows(c.denialId)).toEqual([]);
    expect(Number((await t.db.query('SELECT COUNT(*) AS n FROM rebookings WHERE denial_id = ?', [c.denialId]))[0].n)).toBe(0);
  });

  it('the statement carries every section 14 CFR 250.9 asks for, and the GET page prints it', async () => {
    const c = await authorizedCase('BOS', 'ORD', [{ first: 'Stella', last: 'Statement', fareMinor: 30_000 }], { currency: 'USD', alternateLaterBy: 180 });
    await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate!.id }).expect(200);
    const [mail] = await statementMessages(c.flight.id);
    // 14 CFR 250.9(b): the prescribed text's sections, then the passenger's own case and the caution.
    for (const heading of ['Compensation for Denied Boarding', 'Volunteers and Boarding Priorities', 'Compensation for Involuntary Denied Boarding', 'Amount of Denied Boarding Compensation', 'Method of Payment', "Passenger's Options", 'Your case', 'Caution']) {
      expect(mail.text).toContain(`\n${heading}\n`);
    }
    // 400% of USD 300.00 = USD 1,200.00 (250.5(a)(3), 3 h late, under the USD 2,150 cap).
    expect(mail.text).toContain('Your compensation: USD\u00a01,200.00.');
    expect(mail.text).toContain('Larkfield Air (demo carrier)');
    expect(mail.subject).toMatch(/^Denied boarding on Larkfield Air \(demo carrier\) flight ZZ 8\d{3} of /);
    expect(mail.dedupe_key).toBe(`denial-statement:${c.denialId}:${c.passengerIds[0]}`);
    const page = await agent.get(`/api/denials/${c.denialId}/statement`).expect(200).expect('Content-Type', /text\/html/);
    expect(page.text).toContain('@media print');
    expect(page.text).toContain('<h2>Compensation for Involuntary Denied Boarding</h2>');
    const audit = await t.db.query(`SELECT action FROM audit_log WHERE entity_type = 'denial' AND entity_id = ? ORDER BY id`, [String(c.denialId)]);
    expect(audit.map((r: { action: string }) => r.action)).toEqual(['denial.authorized', 'denial.rebooked', 'denial.compensation_fixed', 'denial.statements_queued']);
  });
});

describe('eu-261 (Reg. (EC) 261/2004 Art. 7)', () => {
  it('FCO-HAM is 1,326 km great-circle (CJEU C-559/16 Bossen): EUR 250 for a flight of 1,500 km or less, not halved at +2 h 30', async () => {
    const c = await authorizedCase('FCO', 'HAM', [{ first: 'Bruno', last: 'Bossen', fareMinor: 9_900 }], { currency: 'EUR', alternateLaterBy: 150 });
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate!.id }).expect(200);
    const [owed] = res.body.denial.compensation.passengers;
    // Art. 7(1)(a): EUR 250 up to 1,500 km; Art. 7(2)(a) halving only within 2 h of the scheduled arrival.
    expect(owed).toMatchObject({ amountMinor: 25_000, currency: 'EUR', band: 'eu-a', ruleRef: 'Reg. (EC) 261/2004 Art. 7(1)(a)' });
    expect(owed.explanation).toMatch(/^1,326 km \(intra-Community\)/);
    expect((await compensationRows(c.denialId))[0]).toMatchObject({ amount_minor: 25_000, currency: 'EUR', voluntary: 0 });
    const [mail] = await statementMessages(c.flight.id);
    // Art. 14(2): written notice of the rules on compensation and assistance (Art. 7, 8, 9) and the enforcement body.
    for (const heading of ['Compensation (Article 7)', 'Reimbursement or re-routing (Article 8)', 'Care while you wait (Article 9)', 'Enforcement body', 'Caution']) {
      expect(mail.text).toContain(`\n${heading}\n`);
    }
    // Art. 16(1): the body of the Member State of departure, Italy for FCO (ENAC, from memory).
    expect(mail.text).toContain('ENAC');
    const flags = res.body.denial.compensation.reviewFlags.join(' ');
    expect(flags).toContain('confirm its contact details with the regulator');
    expect(`${flags} ${mail.text}`).not.toMatch(/from memory/i);
  });
});

describe('ca-appr (SOR/2019-150 s. 20(1))', () => {
  it('alternate planned 7 h later: CAD 1,800 for 6 h or more but less than 9 h', async () => {
    // Two colleagues in one booking: relatives would be a priority group under SOR/2019-150 s.15 and selected last.
    const c = await authorizedCase('YUL', 'YVR', [{ first: 'Chloe', last: 'Canuck', fareMinor: 40_000 }, { first: 'Marc', last: 'Tremblay', fareMinor: 40_000 }], { currency: 'CAD', alternateLaterBy: 420, seats: 2 });
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate!.id }).expect(200);
    // SOR/2019-150 s. 20(1)(b) (from memory): CAD 1,800 per passenger for an arrival 6-9 h late; one row per passenger.
    expect(res.body.denial.compensation.passengers.map((p: { amountMinor: number; band: string }) => [p.amountMinor, p.band])).toEqual([[180_000, 'ca-6h-to-9h'], [180_000, 'ca-6h-to-9h']]);
    const rows = await compensationRows(c.denialId);
    expect(rows.map((r: { amount_minor: number; currency: string }) => [r.amount_minor, r.currency])).toEqual([[180_000, 'CAD'], [180_000, 'CAD']]);
    const mails = await statementMessages(c.flight.id);
    expect(mails).toHaveLength(2);
    for (const heading of ['Compensation amounts', 'Payment and top-up', 'Recourse', 'Caution']) expect(mails[0].text).toContain(`\n${heading}\n`);
    expect(mails[0].text).toContain('CAD\u00a01,800.00');
    const rebookingNotice = await t.db.query(`SELECT COUNT(*) AS n FROM outbox_messages WHERE flight_id = ? AND kind = 'rebooking-notice'`, [c.flight.id]);
    expect(Number(rebookingNotice[0].n)).toBe(1);
  });
});

describe('rebooking rules', () => {
  it('only authorized denials, only once; a booking without an address gets no mail and says so', async () => {
    const flight = await createFlight(t.db, { station: 'BOS', destination: 'ORD', seats: 1 });
    await addSingles(t.db, flight, 2);
    const p = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'one short' }).expect(201)).body;
    const early = await agent.post(`/api/denials/${p.denials[0].id}/rebook`, { noAlternate: true }).expect(409);
    expect(early.body.error).toBe('not_authorized');
    const both = await agent.post(`/api/denials/${p.denials[0].id}/rebook`, { noAlternate: true, manual: { carrier: 'XY', number: '204', departure: '2030-01-01T10:00:00Z', arrival: '2030-01-01T12:00:00Z' } }).expect(400);
    expect(both.body.details[0].field).toBe('alternateFlightId');

    const c = await authorizedCase('BOS', 'ORD', [{ first: 'Nora', last: 'Noaddress', fareMinor: 20_000 }], { currency: 'USD', email: null });
    const statementFirst = await agent.get(`/api/denials/${c.denialId}/statement`).expect(409);
    expect(statementFirst.body.error).toBe('not_rebooked');
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { manual: { carrier: 'XY', number: '204', departure: new Date(c.flight.scheduledDeparture.getTime() + 3_600_000).toISOString(), arrival: new Date(c.flight.scheduledArrival.getTime() + 5 * 3_600_000).toISOString() } }).expect(200);
    expect(res.body.denial.rebooking).toMatchObject({ flight: 'XY 204', plannedArrivalDelayMinutes: 300 });
    expect(res.body.denial.statements[0].status).toBe('no-address');
    expect(await statementMessages(c.flight.id)).toEqual([]);
    const again = await agent.post(`/api/denials/${c.denialId}/rebook`, { noAlternate: true }).expect(409);
    expect(again.body.error).toBe('already_rebooked');
  });

  it('an exemption must be one of the regime\'s (us-dot: 14 CFR 250.6); a smaller aircraft is report line 2b with nothing due', async () => {
    const c = await authorizedCase('BOS', 'ORD', [{ first: 'Sid', last: 'Swap', fareMinor: 20_000 }], { currency: 'USD', alternateLaterBy: 240 });
    const wrong = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate!.id, exemption: 'eu-no-checkin' }).expect(400);
    expect(wrong.body.details[0].field).toBe('exemption');
    const res = await agent.post(`/api/denials/${c.denialId}/rebook`, { alternateFlightId: c.alternate!.id, exemption: 'us-smaller-aircraft' }).expect(200);
    expect(res.body.denial.compensation.passengers[0]).toMatchObject({ amountMinor: 0, band: 'exempt', ruleRef: '14 CFR 250.6(b)' });
    expect(res.body.denial.category).toBe('2b');
  });
});
