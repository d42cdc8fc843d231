// When a posted offer rises during a round, volunteers accepted earlier at less are handled by the station's raise
// policy: by default they get the new amount (so no one is worse off for saying yes early), told in writing and
// audited; a station may instead keep what they agreed. The passenger's disclosure says which.
// No outside source prescribes either; lifting earlier volunteers is common practice (no source). 14 CFR 250.2b
// and Reg. (EC) 261/2004 Art. 4(1) leave volunteers' benefits to agreement (from memory).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity, CompensationEntity, StationEntity, VolunteerEntity } from '../../server/src/db/entities';
import { confirmationKey } from '../../server/src/modules/volunteers/volunteer-notices';
import { defaultPolicy } from '../../server/src/modules/volunteers/policy.service';
import { Client, startTestApp, type TestApp } from './harness';
import { TEST_PASSWORD, insertUser } from './helpers';
import { addBooking, makeFlight, outboxByKey, tokenOf, closeAfterFlights } from './volunteers-fixtures';

let t: TestApp;
let station: StationEntity;
let agent: Client;
let admin: Client;
const flightIds: number[] = [];

async function as(role: 'agent' | 'admin'): Promise<Client> {
  const user = await insertUser(t.db, { label: `raises-${role}`, role, stationIds: [station.id] });
  const c = new Client(t.app);
  if ((await c.signIn(user.email, TEST_PASSWORD)).status !== 200) throw new Error('sign-in failed');
  return c;
}

/** Rutland, Vermont: a real US airport, used only by this file so its raise policy is its own. */
async function raisesStation(): Promise<StationEntity> {
  const repo = t.db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'RUT' })) ?? repo.save(repo.create({ iata: 'RUT', name: 'Rutland (raise policy API test station)', timeZone: 'America/New_York', regime: 'us-dot', currency: 'USD' }));
}

beforeAll(async () => {
  t = await startTestApp();
  station = await raisesStation();
  // Two password hashes and sign-ins: slow on a busy machine, so the set-up has two minutes.
  [agent, admin] = await Promise.all([as('agent'), as('admin')]);
}, 120_000);

afterAll(() => closeAfterFlights(t, flightIds));

const setRaisePolicy = (raisePolicy: 'lift-to-new-offer' | 'keep-agreed') =>
  admin.put(`/api/stations/${station.id}/volunteer-policy`, { ...defaultPolicy('USD'), raisePolicy }).expect(200);

/** A round at $200 with one volunteer accepted at it. */
async function roundWithEarlyVolunteer() {
  const flight = await makeFlight(t.db, { stationId: station.id, origin: 'RUT', destination: 'BOS' });
  flightIds.push(flight.id);
  const early = await addBooking(t.db, flight, [['Eve', 'Early']]);
  const { body: { id: roundId } } = await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: 2 }).expect(201);
  const { body: { id: volunteerId } } = await agent.post(`/api/rounds/${roundId}/volunteers`, { passengerIds: [early.passengers[0].id] }).expect(201);
  await agent.post(`/api/rounds/${roundId}/volunteers/${volunteerId}/accept`).expect(200);
  const token = tokenOf((await agent.get(`/api/flights/${flight.id}/rounds`).expect(200)).body.bidLink);
  return { flight, roundId, volunteerId, token };
}

const owed = async (volunteerId: number) => (await t.db.getRepository(CompensationEntity).findBy({ sourceKind: 'volunteer', sourceId: volunteerId })).map((c) => c.amountMinor);

describe('the default raise policy', () => {
  it('lifts a volunteer accepted at $200 to a $400 raise: agreed amount, what is owed, a new written confirmation, an audit row', async () => {
    await setRaisePolicy('lift-to-new-offer');
    const { roundId, volunteerId, token } = await roundWithEarlyVolunteer();
    expect((await agent.agent.get(`/api/public/offers/${token}`).expect(200)).body.disclosure.ifTheOfferRises).toMatch(/you get the higher amount too/);
    await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: 40_000 }).expect(200);
    expect((await t.db.getRepository(VolunteerEntity).findOneByOrFail({ id: volunteerId })).agreedMinor).toBe(40_000);
    expect(await owed(volunteerId)).toEqual([40_000]);
    expect(await outboxByKey(t.db, confirmationKey(volunteerId, 40_000))).toHaveLength(1);
    const audit = await t.db.getRepository(AuditLogEntity).findOneByOrFail({ entityType: 'volunteer', entityId: String(volunteerId), action: 'volunteer.repriced' });
    expect(audit).toMatchObject({ actorLabel: 'raise policy: earlier volunteers get the new offer', before: { agreedMinor: 20_000 }, after: { agreedMinor: 40_000, currency: 'USD' } });
  });
});

describe('a station that keeps what was agreed', () => {
  it('leaves the earlier volunteer at $200 and says so in the disclosure', async () => {
    await setRaisePolicy('keep-agreed');
    const { roundId, volunteerId, token } = await roundWithEarlyVolunteer();
    expect((await agent.agent.get(`/api/public/offers/${token}`).expect(200)).body.disclosure.ifTheOfferRises).toMatch(/you keep the amount you agreed/);
    await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: 40_000 }).expect(200);
    expect((await t.db.getRepository(VolunteerEntity).findOneByOrFail({ id: volunteerId })).agreedMinor).toBe(20_000);
    expect(await owed(volunteerId)).toEqual([20_000]);
    await setRaisePolicy('lift-to-new-offer');
  });
});
