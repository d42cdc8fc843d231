// A volunteer's e-mails go through the transactional outbox: queued in the same transaction as the accept or the
// rebooking, exactly once per fact, and not at all when that transaction rolls back.
// Outside sources: the transactional-outbox pattern (a message row committed with the business change, sent after
// commit; common practice), and for the content 14 CFR 250.2b(b) (from memory: the material restrictions of a travel
// credit offered to a volunteer are disclosed to them), 14 CFR 250.5(c) and Reg. (EC) 261/2004 Art. 7(3) (a voucher
// instead of money only with the passenger's agreement), from memory.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity, CompensationEntity, RebookingEntity, VolunteerEntity, VolunteerRoundEntity, VoucherOfferEntity, type FlightEntity } from '../../server/src/db/entities';
import type { SessionUser } from '@shared/schemas/auth';
import { enqueueMessage } from '../../server/src/modules/outbox/outbox.service';
import { acceptVolunteer } from '../../server/src/modules/volunteers/accept.service';
import { rebookVolunteer } from '../../server/src/modules/volunteers/rebooking.service';
import { enqueueConfirmation, type Enqueue } from '../../server/src/modules/volunteers/volunteer-notices';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { addBooking, makeFlight, outboxByKey, removeFlights, settle, type Booked } from './volunteers-fixtures';

const NBSP = '\u00a0';
let t: TestApp;
let agent: Client;
let agentUser: SessionUser;
let flight: FlightEntity;
let alternate: FlightEntity;
let roundId: number;
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp();
  agent = await signedIn(t, DEMO.agent);
  agentUser = (await agent.refreshCsrf()).user;
  const bos = await stationIdByIata(t.db, 'BOS');
  // 13:00 UTC on a day between 14 July and 12 October 2034 is 09:00 in Boston (EDT, UTC-4, until 5 November; IANA tz
  // database): the notices must say so, with the zone named.
  flight = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'ORH', departure: new Date(Date.UTC(2034, 6, 14, 13, 0) + Math.floor(Math.random() * 90) * 86_400_000), durationMinutes: 60 });
  alternate = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'ORH', departure: new Date(flight.scheduledDeparture.getTime() + 4 * 3_600_000), durationMinutes: 60 });
  flightIds.push(flight.id, alternate.id);
  roundId = (await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 40_000, extras: ['Meal voucher'], volunteersNeeded: 9 }).expect(201)).body.id;
});

afterAll(async () => {
  await settle(t);
  await removeFlights(t.db, flightIds);
  await t.close();
});

async function volunteer(names: [string, string][], contactEmail?: string | null): Promise<{ id: number; party: Booked }> {
  const party = await addBooking(t.db, flight, names, contactEmail);
  const id = (await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: party.passengers.map((p) => p.id) }).expect(201)).body.id;
  return { id, party };
}

const confirmationKey = (id: number) => `volunteer-confirmation:${id}`;
const rebookingKey = (id: number) => `rebooking-notice:volunteer:${id}`;

/** The real outbox writer, then a failure: the row exists inside the transaction, and the transaction fails after it. */
function failingAfterEnqueue(seen: string[]): Enqueue {
  return async (em, input) => {
    const r = await enqueueMessage(em, input);
    const [row] = await em.query('SELECT id FROM outbox_messages WHERE id = ?', [r.id]);
    seen.push(row.id);
    throw new Error('forced failure after the enqueue');
  };
}

describe('the written confirmation and the rebooking notice', () => {
  it('accept queues exactly one confirmation, to the booking’s address, with amount, extras and form of payment', async () => {
    const { id, party } = await volunteer([['Nell', 'Notice'], ['Otto', 'Notice']]);
    await agent.post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    const [mail, ...more] = await outboxByKey(t.db, confirmationKey(id));
    expect(more).toHaveLength(0);
    expect(mail).toMatchObject({ kind: 'volunteer-confirmation', toAddress: party.booking.contactEmail, flightId: flight.id });
    expect(mail.passengerIds.sort()).toEqual(party.passengers.map((p) => p.id).sort());
    expect(mail.subject).toBe(`Confirmed: you gave up your seats on ZV ${flight.flightNumber} (booking ${party.booking.pnr})`);
    expect(mail.text).toContain('Dear Nell Notice and Otto Notice,');
    // derived: 40,000 minor units of USD each, two passengers.
    expect(mail.text).toContain(`USD${NBSP}400.00 per passenger, USD${NBSP}800.00 in total`);
    expect(mail.text).toMatch(/Also provided: +Meal voucher/);
    expect(mail.text).toMatch(/Form of payment: +Prepaid card, spendable at once like cash/);
    expect(mail.text).toContain('09:00 (America/New_York, GMT-04:00)');
    expect(mail.text).not.toContain('Conditions of the travel voucher');
    expect(mail.html).toContain('Prepaid card');
  });

  it('rebooking queues exactly one rebooking notice: new flight, times with the zone named, what is owed and how paid', async () => {
    const { id, party } = await volunteer([['Pia', 'Notice']]);
    await agent.post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    await agent.post(`/api/volunteers/${id}/rebook`, { alternateFlightId: alternate.id }).expect(200);
    const [mail, ...more] = await outboxByKey(t.db, rebookingKey(id));
    expect(more).toHaveLength(0);
    expect(mail).toMatchObject({ kind: 'rebooking-notice', toAddress: party.booking.contactEmail });
    expect(mail.subject).toBe(`Your new flight: ZV ${alternate.flightNumber} to ORH (booking ${party.booking.pnr})`);
    expect(mail.text).toMatch(new RegExp(`New flight: +ZV ${alternate.flightNumber} from BOS to ORH`));
    // derived: four hours after 09:00 EDT, arriving an hour later.
    expect(mail.text).toMatch(/Leaves: +\w+ \d+ \w+ 2034, 13:00 \(America\/New_York, GMT-04:00\)/);
    expect(mail.text).toMatch(/Arrives: +\w+ \d+ \w+ 2034, 14:00 \(America\/New_York, GMT-04:00\)/);
    expect(mail.text).toContain('4 hours later than on your original flight');
    expect(mail.text).toMatch(new RegExp(`Agreed compensation: +USD${NBSP}400\\.00\\n`));
    expect(mail.text).toMatch(/Form of payment: +Prepaid card/);
    expect(await outboxByKey(t.db, confirmationKey(id))).toHaveLength(1);
  });

  it('the confirmation offers the card, and a rebooking after an agreed voucher names the voucher with the conditions shown', async () => {
    const { id } = await volunteer([['Quin', 'Voucher']]);
    await agent.post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    const [confirmation] = await outboxByKey(t.db, confirmationKey(id));
    expect(confirmation.text).toMatch(/Form of payment: +Prepaid card/);
    expect(confirmation.text).toContain('you receive the card unless you agree to the voucher');
    // The state the compensation's voucher steps leave behind (offer shown and sent, then the passenger's agreement).
    const [comp] = await t.db.getRepository(CompensationEntity).findBy({ sourceKind: 'volunteer', sourceId: id });
    expect(comp).toMatchObject({ form: 'prepaid-card', voucherAgreedAt: null });
    const agreedAt = new Date();
    await t.db.getRepository(VoucherOfferEntity).save({ compensationId: comp.id, cashAmountMinor: comp.amountMinor, currency: comp.currency, restrictions: ['Valid 12 months on our flights only.'], text: 'offer', sentTo: null, offeredByUserId: agentUser.id, offeredAt: agreedAt, agreedAt, statement: 'I agree', agreedRecordedByUserId: agentUser.id });
    await t.db.getRepository(CompensationEntity).update({ id: comp.id }, { form: 'voucher', voucherAgreedAt: agreedAt });
    await agent.post(`/api/volunteers/${id}/rebook`, { alternateFlightId: alternate.id }).expect(200);
    const [mail] = await outboxByKey(t.db, rebookingKey(id));
    expect(mail.text).toMatch(/Form of payment: +Travel voucher, which you chose instead of cash/);
    expect(mail.text).toContain('Conditions of the travel voucher:\n- Valid 12 months on our flights only.');
  });

  it('a booking with no contact address is accepted and rebooked without a message, and the audit row says why', async () => {
    const { id } = await volunteer([['Rex', 'Quiet']], null);
    await agent.post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    await agent.post(`/api/volunteers/${id}/rebook`, { manual: { carrier: 'XY', number: '88', departure: alternate.scheduledDeparture.toISOString(), arrival: alternate.scheduledArrival.toISOString() } }).expect(200);
    expect(await outboxByKey(t.db, confirmationKey(id))).toHaveLength(0);
    expect(await outboxByKey(t.db, rebookingKey(id))).toHaveLength(0);
    const rows = await t.db.getRepository(AuditLogEntity).findBy({ entityType: 'volunteer', entityId: String(id) });
    expect(rows.find((r) => r.action === 'volunteer.accepted')?.after).toMatchObject({ notice: 'no contact address' });
    expect(rows.find((r) => r.action === 'volunteer.rebooked')?.after).toMatchObject({ notice: 'no contact address' });
  });

  it('queuing the same confirmation again (a retry) adds no second message', async () => {
    const { id } = await volunteer([['Sid', 'Retry']]);
    await agent.post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    const again = await t.db.transaction(async (em) => {
      const round = await em.findOneByOrFail(VolunteerRoundEntity, { id: roundId });
      const v = await em.findOneByOrFail(VolunteerEntity, { id });
      return enqueueConfirmation(em, round, v, enqueueMessage);
    });
    expect(again).toBe('already queued');
    expect(await outboxByKey(t.db, confirmationKey(id))).toHaveLength(1);
  });
});

describe('a rolled-back action sends nothing', () => {
  it('an accept that fails after its confirmation was queued leaves no message, no compensation, no acceptance', async () => {
    const { id } = await volunteer([['Tia', 'Rollback']]);
    const seen: string[] = [];
    await expect(acceptVolunteer(t.db, agentUser, roundId, id, failingAfterEnqueue(seen))).rejects.toThrow('forced failure after the enqueue');
    expect(seen).toHaveLength(1);
    expect(await t.db.query('SELECT id FROM outbox_messages WHERE id = ?', [seen[0]])).toEqual([]);
    expect(await outboxByKey(t.db, confirmationKey(id))).toHaveLength(0);
    expect((await t.db.getRepository(VolunteerEntity).findOneByOrFail({ id })).status).toBe('offered');
    expect(await t.db.getRepository(CompensationEntity).countBy({ sourceKind: 'volunteer', sourceId: id })).toBe(0);
    expect(await t.db.getRepository(AuditLogEntity).countBy({ entityType: 'volunteer', entityId: String(id), action: 'volunteer.accepted' })).toBe(0);
    // The same accept, done properly afterwards, queues the one confirmation.
    await agent.post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    expect(await outboxByKey(t.db, confirmationKey(id))).toHaveLength(1);
  });

  it('a rebooking that fails after its notice was queued leaves no message and holds no seat', async () => {
    const { id } = await volunteer([['Uma', 'Rollback']]);
    await agent.post(`/api/rounds/${roundId}/volunteers/${id}/accept`).expect(200);
    const seen: string[] = [];
    await expect(rebookVolunteer(t.db, agentUser, id, { alternateFlightId: alternate.id }, failingAfterEnqueue(seen))).rejects.toThrow('forced failure after the enqueue');
    expect(seen).toHaveLength(1);
    expect(await outboxByKey(t.db, rebookingKey(id))).toHaveLength(0);
    expect(await t.db.getRepository(RebookingEntity).countBy({ volunteerId: id })).toBe(0);
  });
});
