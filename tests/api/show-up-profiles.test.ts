// The station's show-up profile: supervisors read it, admins change it, every change is audited with before and
// after, bad input is a 400 naming the field, and the open flights' odds are recomputed with the new figures.
// Runs on a station of its own, so no demo station's odds move. Outside sources, from memory: OWASP Logging Cheat
// Sheet (record who changed what, before and after); RFC 9110 §15.5.4/§15.5.5 (403 for a role that may not, 404 for
// what the caller may not see).
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { In } from 'typeorm';
import { DEFAULT_SHOW_UP_PROFILE, type ShowUpProfile } from '@shared/schemas/show-up-profile';
import { AuditLogEntity, BookingEntity, FlightEntity, FlightForecastEntity, PassengerEntity, ShowUpProfileEntity, StationEntity } from '../../server/src/db/entities';
import { Client, startTestApp, type TestApp } from './harness';
import { TEST_PASSWORD, insertUser, removeRunUsers, stationIdByIata } from './helpers';

let t: TestApp;
let station: StationEntity;
let bos: number;
const as = {} as Record<'admin' | 'supervisor' | 'agent', Client>;
const flightIds: number[] = [];
const url = (stationId: number) => `/api/stations/${stationId}/show-up-profile`;

/** Bergen, a real airport in Norway: a station of these tests alone, created once and reused. */
async function testStation(): Promise<StationEntity> {
  const repo = t.db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'BGO' })) ?? repo.save(repo.create({ iata: 'BGO', name: 'Bergen (API test station)', timeZone: 'Europe/Oslo', regime: 'eu-261', currency: 'NOK' }));
}

async function signInAs(role: 'admin' | 'supervisor' | 'agent'): Promise<Client> {
  const user = await insertUser(t.db, { label: `profile-${role}`, role, stationIds: [station.id] });
  const c = new Client(t.app);
  expect((await c.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  return c;
}

/** A flight leaving in two hours with one seat and two booked passengers in separate bookings. */
async function openFlight(): Promise<FlightEntity> {
  const departure = new Date(Date.now() + 2 * 3_600_000);
  const repo = t.db.getRepository(FlightEntity);
  for (let attempt = 0; attempt < 20; attempt++) {
    const flightNumber = String(8000 + Math.floor(Math.random() * 1000));
    const serviceDate = departure.toISOString().slice(0, 10);
    if (await repo.existsBy({ carrierCode: 'ZZ', flightNumber, serviceDate, origin: 'BGO' })) continue;
    const f = await repo.save(repo.create({ stationId: station.id, carrierCode: 'ZZ', flightNumber, serviceDate, origin: 'BGO', destination: 'OSL', scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + 3_600_000), aircraftType: null, seatsByCabin: { Y: 1 }, gate: null, state: 'check-in-open', shock: null }));
    flightIds.push(f.id);
    for (const [pnr, firstName] of [['PRF001', 'Tove'], ['PRF002', 'Emil']]) {
      const booking = await t.db.getRepository(BookingEntity).save({ flightId: f.id, pnr, contactEmail: null, travelsTogether: true, status: 'active' as const });
      await t.db.getRepository(PassengerEntity).insert({ bookingId: booking.id, flightId: f.id, pnrSequence: 1, firstName, lastName: 'Lind', cabin: 'Y', fareMinor: 100000, fareCurrency: 'NOK', fareType: 'standard', ssrCodes: [], frequentFlyerTier: null, isChild: false, inboundFlight: null, inboundScheduledArrival: null, inboundEstimatedArrival: null, seat: null, status: 'booked', checkedInAt: null, boardedAt: null, statusChangedAt: null });
    }
    return f;
  }
  throw new Error('no free flight number for the test flight');
}

const edited: ShowUpProfile = {
  ...DEFAULT_SHOW_UP_PROFILE,
  bookingRates: { local: { J: 0.95, Y: 0.7 }, connecting: { J: 0.9, Y: 0.6 } },
  checkInCurve: [[1440, 0], [120, 0.5], [40, 1]],
  checkInCloseMinutes: 40,
  minimumConnectMinutes: 50,
};

beforeAll(async () => {
  t = await startTestApp();
  station = await testStation();
  bos = await stationIdByIata(t.db, 'BOS');
  // Each run starts from the default, whatever an earlier run stored.
  await t.db.getRepository(ShowUpProfileEntity).delete({ stationId: station.id });
  for (const role of ['admin', 'supervisor', 'agent'] as const) as[role] = await signInAs(role);
});
afterAll(async () => {
  await t.db.getRepository(ShowUpProfileEntity).delete({ stationId: station.id });
  if (flightIds.length) {
    await t.db.getRepository(FlightForecastEntity).delete({ flightId: In(flightIds) });
    await t.db.query('DELETE FROM forecast_snapshots WHERE flight_id IN (?)', [flightIds]);
    await t.db.getRepository(FlightEntity).delete({ id: In(flightIds) });
  }
  await removeRunUsers(t.db);
  await t.close();
});

describe('reading and writing', () => {
  it('answers the default until an admin saves one, then the saved profile, audited with before and after', async () => {
    const initial = await as.supervisor.get(url(station.id)).expect(200);
    expect(initial.body).toEqual({ stationId: station.id, profile: DEFAULT_SHOW_UP_PROFILE, isDefault: true, updatedAt: null, updatedByUserId: null });

    const put = await as.admin.put(url(station.id), edited).expect(200);
    expect(put.body).toMatchObject({ stationId: station.id, profile: edited, isDefault: false });
    expect(new Date(put.body.updatedAt).toISOString()).toBe(put.body.updatedAt);

    const read = await as.supervisor.get(url(station.id)).expect(200);
    expect(read.body.profile).toEqual(edited);

    const rows = await t.db.getRepository(AuditLogEntity).find({ where: { action: 'show_up_profile.updated', entityId: String(station.id) }, order: { id: 'DESC' }, take: 1 });
    expect(rows[0]).toMatchObject({ entityType: 'show_up_profile', stationId: station.id, before: { default: true, profile: DEFAULT_SHOW_UP_PROFILE }, after: edited });

    const second = { ...edited, flexibleFareFactor: 0.9 };
    await as.admin.put(url(station.id), second).expect(200);
    const [latest] = await t.db.getRepository(AuditLogEntity).find({ where: { action: 'show_up_profile.updated', entityId: String(station.id) }, order: { id: 'DESC' }, take: 1 });
    expect(latest).toMatchObject({ before: edited, after: second });
  });

  it('recomputes the odds of the station’s open flights with the new figures', async () => {
    const f = await openFlight();
    const rate = (q: number): ShowUpProfile => ({ ...edited, bookingRates: { local: { Y: q }, connecting: { Y: q } } });
    const pOversaleAfter = async (profile: ShowUpProfile) => {
      const previous = (await t.db.getRepository(FlightForecastEntity).findOneBy({ flightId: f.id }))?.computedAt.getTime() ?? 0;
      await as.admin.put(url(station.id), profile).expect(200);
      return vi.waitFor(async () => {
        const row = await t.db.getRepository(FlightForecastEntity).findOneBy({ flightId: f.id });
        if (!row || row.computedAt.getTime() <= previous) throw new Error('the flight was not recomputed within 5 s');
        return row.pOversale;
      }, { timeout: 5_000, interval: 100 });
    };
    // Two people for one seat, neither checked in, check-in still open (G = 0.5 two hours out on this curve).
    // P(show | not checked in) = q(1 - G) / (1 - qG) (Bayes): q = 1 gives 1, so both show and one has no seat;
    // q = 0 gives 0, so nobody shows (derived).
    expect(await pOversaleAfter(rate(1))).toBeCloseTo(1, 9);
    expect(await pOversaleAfter(rate(0))).toBeCloseTo(0, 9);
  });
});

describe('bad input', () => {
  it('names the field and the rule', async () => {
    const rate = await as.admin.put(url(station.id), { ...edited, bookingRates: { ...edited.bookingRates, local: { J: 0.9, Y: 1.5 } } }).expect(400);
    expect(rate.body.details).toEqual([{ field: 'bookingRates.local.Y', rule: 'bookingRates.local must be within [0, 1]' }]);

    const curve = await as.admin.put(url(station.id), { ...edited, checkInCurve: [[60, 0.5], [120, 0.8]] }).expect(400);
    expect(curve.body.details).toEqual([{ field: 'checkInCurve', rule: 'checkInCurve must list minutes before departure from most to fewest, with shares never falling' }]);

    const factor = await as.admin.put(url(station.id), { ...edited, flexibleFareFactor: 2 }).expect(400);
    expect(factor.body.details).toEqual([{ field: 'flexibleFareFactor', rule: 'flexibleFareFactor must be at most 1.2' }]);

    const missing = await as.admin.put(url(station.id), { ...edited, checkedInShowRate: undefined }).expect(400);
    expect(missing.body.details).toEqual([{ field: 'checkedInShowRate', rule: 'checkedInShowRate must be a number' }]);

    // Nothing was stored by the refused writes.
    expect((await as.admin.get(url(station.id)).expect(200)).body.profile.flexibleFareFactor).not.toBe(2);
  });
});

describe('who may', () => {
  it('lets a supervisor read but not write, refuses agents, and hides other stations', async () => {
    await as.supervisor.get(url(station.id)).expect(200);
    const refused = await as.supervisor.put(url(station.id), edited).expect(403);
    expect(refused.body.error).toBe('forbidden');
    await as.agent.get(url(station.id)).expect(403);
    await as.agent.put(url(station.id), edited).expect(403);
    // The users of this run belong to the test station only: BOS is another station to them.
    await as.admin.get(url(bos)).expect(404);
    await as.admin.put(url(bos), edited).expect(404);
    await as.supervisor.get(url(bos)).expect(404);
    const anon = new Client(t.app);
    await anon.refreshCsrf();
    await anon.get(url(station.id)).expect(401);
  });
});
