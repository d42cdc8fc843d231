// Sealed bids: passengers name the least they would accept through the public link, the agent sees the asks lowest
// first, and the station's policy decides the price: each volunteer's own ask, or one common price (the highest
// accepted ask) for all. Runs on a station of its own (BGR) so changing its policy disturbs no one.
// Outside sources: 14 CFR 250.2b (volunteers are asked first; the carrier sets what it offers them) and Reg. (EC)
// 261/2004 Art. 4(1) (volunteers surrender their reservations "in exchange for benefits under conditions to be
// agreed"), from memory. Uniform-price versus pay-as-bid is common auction practice, no outside source.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CompensationEntity, VolunteerEntity, type FlightEntity, type StationEntity } from '../../server/src/db/entities';
import { defaultPolicy } from '../../server/src/modules/volunteers/policy.service';
import { Client, startTestApp, type TestApp } from './harness';
import { DEMO, TEST_PASSWORD, insertUser } from './helpers';
import { addBooking, makeFlight, outboxByKey, policyTestStation, tokenOf, type Booked, closeAfterFlights } from './volunteers-fixtures';

let t: TestApp;
let station: StationEntity;
let agent: Client;
let admin: Client;
let demoAdmin: Client;
let address = 10;
const flightIds: number[] = [];

async function as(role: 'agent' | 'admin'): Promise<Client> {
  const user = await insertUser(t.db, { label: `sealed-${role}`, role, stationIds: [station.id] });
  const c = new Client(t.app);
  const res = await c.signIn(user.email, TEST_PASSWORD);
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  return c;
}

beforeAll(async () => {
  t = await startTestApp();
  station = await policyTestStation(t.db);
  [agent, admin] = [await as('agent'), await as('admin')];
  demoAdmin = new Client(t.app);
  await demoAdmin.signIn(DEMO.admin);
});

afterAll(() => closeAfterFlights(t, flightIds));

const policyUrl = () => `/api/stations/${station.id}/volunteer-policy`;
const setPricing = (sealedBidPricing: 'own-ask' | 'common-price') => admin.put(policyUrl(), { ...defaultPolicy('USD'), sealedBidPricing }).expect(200);

/** A flight of its own with an open sealed round; returns the passenger link's token. */
async function sealedFlight(volunteersNeeded: number, parties: [string, string][][]) {
  const flight: FlightEntity = await makeFlight(t.db, { stationId: station.id, origin: 'BGR', destination: 'BOS' });
  flightIds.push(flight.id);
  const booked: Booked[] = [];
  for (const names of parties) booked.push(await addBooking(t.db, flight, names));
  const roundId: number = (await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'sealed', volunteersNeeded }).expect(201)).body.id;
  const token = tokenOf((await agent.get(`/api/flights/${flight.id}/rounds`).expect(200)).body.bidLink);
  return { flight, booked, roundId, token };
}

/** Identifies as the booking through the public link and names an ask, as the passenger's phone would. */
async function bid(token: string, party: Booked, askMinor: number) {
  const ip = `198.51.100.${address++}`;
  const who = await agent.agent.post(`/api/public/offers/${token}/identify`).set('X-Forwarded-For', ip).send({ pnr: party.booking.pnr, lastName: party.passengers[0].lastName }).expect(200);
  await agent.agent.post(`/api/public/offers/${token}/bids`).set('X-Forwarded-For', ip).send({ passengerToken: who.body.passengerToken, askMinor }).expect(201);
  return who.body.passengerToken as string;
}

const volunteerOf = (roundId: number, party: Booked) => t.db.getRepository(VolunteerEntity).findOneByOrFail({ roundId, bookingId: party.booking.id });
const amountsOf = async (volunteerId: number) => (await t.db.getRepository(CompensationEntity).findBy({ sourceKind: 'volunteer', sourceId: volunteerId })).map((c) => c.amountMinor);

describe('the station policy', () => {
  it('is set by an admin of the station; an agent may read it but not change it', async () => {
    await setPricing('own-ask');
    expect((await agent.get(policyUrl()).expect(200)).body.sealedBidPricing).toBe('own-ask');
    expect((await agent.put(policyUrl(), defaultPolicy('USD'))).status).toBe(403);
  });

  it('refuses a policy in a currency the station does not pay in, or a ladder that falls, naming the field', async () => {
    const wrongCurrency = await admin.put(policyUrl(), defaultPolicy('EUR'));
    expect([wrongCurrency.status, wrongCurrency.body.details[0].field]).toEqual([400, 'currency']);
    const falling = await admin.put(policyUrl(), { ...defaultPolicy('USD'), ladderMinor: [40_000, 20_000] });
    expect([falling.status, falling.body.details[0].field]).toEqual([400, 'ladderMinor']);
  });

  it('hides another station’s policy from an admin who does not belong to it', async () => {
    expect((await demoAdmin.get(policyUrl())).status).toBe(404);
    expect((await demoAdmin.put(policyUrl(), defaultPolicy('USD'))).status).toBe(404);
  });
});

describe('a sealed-bid round', () => {
  it('takes asks through the passenger link and lists them lowest first, agent-entered ones included', async () => {
    const { flight, booked, roundId, token } = await sealedFlight(2, [[['Amy', 'Sealy']], [['Bea', 'Sealy']], [['Cas', 'Sealy']], [['Dan', 'Sealy']]]);
    const page = await agent.agent.get(`/api/public/offers/${token}`).expect(200);
    expect(page.body.round).toMatchObject({ kind: 'sealed', offerMinor: null });
    await bid(token, booked[0], 45_000);
    await bid(token, booked[1], 30_000);
    await bid(token, booked[2], 60_000);
    await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [booked[3].passengers[0].id], askMinor: 38_000 }).expect(201);
    const [round] = (await agent.get(`/api/flights/${flight.id}/rounds`).expect(200)).body.rounds;
    expect(round.volunteers.map((v: { askMinor: number }) => v.askMinor)).toEqual([30_000, 38_000, 45_000, 60_000]);
    expect(round.volunteers.map((v: { source: string }) => v.source)).toEqual(['passenger-link', 'agent', 'passenger-link', 'passenger-link']);
  });

  it('refuses a sealed bid without an ask, naming askMinor', async () => {
    const { booked, token } = await sealedFlight(1, [[['Eve', 'Noask']]]);
    const who = await agent.agent.post(`/api/public/offers/${token}/identify`).set('X-Forwarded-For', `198.51.100.${address++}`).send({ pnr: booked[0].booking.pnr, lastName: 'Noask' }).expect(200);
    const res = await agent.agent.post(`/api/public/offers/${token}/bids`).send({ passengerToken: who.body.passengerToken, acceptPosted: true });
    expect([res.status, res.body.details[0].field]).toEqual([400, 'askMinor']);
  });

  it('own-ask pricing pays each volunteer what they asked, and tells the passenger on the status page', async () => {
    await setPricing('own-ask');
    const { booked, roundId, token } = await sealedFlight(2, [[['Fay', 'Own']], [['Gus', 'Own']]]);
    const fayToken = await bid(token, booked[0], 30_000);
    await bid(token, booked[1], 45_000);
    const [fay, gus] = [await volunteerOf(roundId, booked[0]), await volunteerOf(roundId, booked[1])];
    const status = await agent.agent.get(`/api/public/offers/${token}/status?passengerToken=${encodeURIComponent(fayToken)}`).expect(200);
    expect(status.body.status).toBe('offered');
    await agent.post(`/api/rounds/${roundId}/volunteers/${fay.id}/accept`).expect(200);
    await agent.post(`/api/rounds/${roundId}/volunteers/${gus.id}/accept`).expect(200);
    expect(await amountsOf(fay.id)).toEqual([30_000]);
    expect(await amountsOf(gus.id)).toEqual([45_000]);
    const after = await agent.agent.get(`/api/public/offers/${token}/status?passengerToken=${encodeURIComponent(fayToken)}`).expect(200);
    expect(after.body).toMatchObject({ status: 'accepted', agreedMinor: 30_000, currency: 'USD' });
  });

  it('common-price pricing lifts every accepted volunteer to the highest accepted ask, and writes to the earlier one again', async () => {
    await setPricing('common-price');
    const { booked, roundId, token } = await sealedFlight(3, [[['Hal', 'Common']], [['Ivy', 'Common'], ['Jon', 'Common']]]);
    await bid(token, booked[0], 30_000);
    await bid(token, booked[1], 45_000);
    const [hal, pair] = [await volunteerOf(roundId, booked[0]), await volunteerOf(roundId, booked[1])];
    await agent.post(`/api/rounds/${roundId}/volunteers/${hal.id}/accept`).expect(200);
    expect(await amountsOf(hal.id)).toEqual([30_000]);
    await agent.post(`/api/rounds/${roundId}/volunteers/${pair.id}/accept`).expect(200);
    expect(await amountsOf(hal.id)).toEqual([45_000]);
    expect(await amountsOf(pair.id)).toEqual([45_000, 45_000]);
    expect((await t.db.getRepository(VolunteerEntity).findOneByOrFail({ id: hal.id })).agreedMinor).toBe(45_000);
    const first = await outboxByKey(t.db, `volunteer-confirmation:${hal.id}`);
    const updated = await outboxByKey(t.db, `volunteer-confirmation:${hal.id}:price-45000`);
    expect([first.length, updated.length]).toEqual([1, 1]);
    expect(updated[0].subject).toMatch(/^Updated: what you are owed/);
    expect(updated[0].text).toContain('USD\u00a0450.00');
  });

  it('common-price pricing refuses a higher ask once an earlier volunteer is being paid, changing nothing', async () => {
    await setPricing('common-price');
    const { booked, roundId, token } = await sealedFlight(2, [[['Kay', 'Locked']], [['Lou', 'Locked']]]);
    await bid(token, booked[0], 20_000);
    await bid(token, booked[1], 50_000);
    const [kay, lou] = [await volunteerOf(roundId, booked[0]), await volunteerOf(roundId, booked[1])];
    await agent.post(`/api/rounds/${roundId}/volunteers/${kay.id}/accept`).expect(200);
    await t.db.getRepository(CompensationEntity).update({ sourceKind: 'volunteer', sourceId: kay.id }, { state: 'issued' });
    const res = await agent.post(`/api/rounds/${roundId}/volunteers/${lou.id}/accept`);
    expect([res.status, res.body.error]).toEqual([409, 'price_locked']);
    expect((await volunteerOf(roundId, booked[1])).status).toBe('offered');
    expect(await amountsOf(kay.id)).toEqual([20_000]);
    expect(await amountsOf(lou.id)).toEqual([]);
  });

  it('lets a passenger change their ask while it is still open', async () => {
    await setPricing('own-ask');
    const { booked, roundId, token } = await sealedFlight(1, [[['May', 'Change']]]);
    await bid(token, booked[0], 70_000);
    await bid(token, booked[0], 55_000);
    const rows = await t.db.getRepository(VolunteerEntity).findBy({ roundId });
    expect(rows.map((r) => r.askMinor)).toEqual([55_000]);
  });
});
