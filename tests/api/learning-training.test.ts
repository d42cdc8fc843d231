// Training the show rates: one run at a time however many ask, a version saved with its calibration, a station that
// switches to it has its forecasts name the version, an admin can pin a version or go back to the hand-set profile,
// and a supervisor can correct an outcome (audited). The true rates are those of the invented demo history
// (server/src/demo/history.ts), so what is learned can be checked against them.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { In } from 'typeorm';
import { AuditLogEntity, BookingOutcomeEntity, FlightEntity, FlightForecastEntity, LearnedRatesEntity, LearningJobEntity, StationRatesChoiceEntity } from '../../server/src/db/entities';
import { trueMixedShowRate } from '../../server/src/demo/history';
import { requeueAbandoned } from '../../server/src/modules/learning/jobs.service';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';

let t: TestApp;
let admin: Client;
let supervisor: Client;
let agent: Client;
let bos: number;

async function finished(id: number) {
  return vi.waitFor(async () => {
    const { body } = await admin.get('/api/learning/jobs/latest').expect(200);
    if (body.job.id !== id) throw new Error(`run ${id} is not the latest`);
    if (body.job.status === 'queued' || body.job.status === 'running') throw new Error(`run ${id} still ${body.job.status} (${body.job.stage})`);
    return body.job;
  }, { timeout: 120_000, interval: 250 });
}

beforeAll(async () => {
  t = await startTestApp();
  // A run left by a test app that closed mid-run is taken up again (no server runs training on the test database).
  await requeueAbandoned(t.db);
  admin = await signedIn(t, DEMO.admin);
  supervisor = await signedIn(t, DEMO.supervisor);
  agent = await signedIn(t, DEMO.agent);
  bos = await stationIdByIata(t.db, 'BOS');
}, 60_000);

afterAll(async () => {
  // The demo stations go back to the hand-set profile, so the odds other tests expect stay as they were.
  await t.db.getRepository(StationRatesChoiceEntity).delete({ stationId: bos });
  await t.close();
});

describe('retraining', () => {
  it('runs once when asked twice at once, and saves one version with its calibration', async () => {
    const before = await t.db.getRepository(LearnedRatesEntity).count();
    const [a, b] = await Promise.all([admin.post('/api/learning/jobs').expect(202), admin.post('/api/learning/jobs').expect(202)]);
    expect(a.body.job.id).toBe(b.body.job.id);
    expect([a.body.joined, b.body.joined].sort()).toEqual([false, true]);
    const job = await finished(a.body.job.id);
    expect(job).toMatchObject({ status: 'done', progress: 100, requests: 2 });
    expect(await t.db.getRepository(LearnedRatesEntity).count()).toBe(before + 1);
    expect(await t.db.getRepository(LearnedRatesEntity).countBy({ jobId: job.id })).toBe(1);
    expect(await t.db.getRepository(LearningJobEntity).countBy({ status: In(['queued', 'running']) })).toBe(0);

    const { body } = await supervisor.get(`/api/learning/stations/${bos}`).expect(200);
    expect(body.latest.version).toBe(job.ratesVersion);
    const station = body.calibration.find((c: { route: string | null }) => c.route === null);
    expect(station.passengers).toBeGreaterThan(1000);
    expect(station.bins.reduce((s: number, x: { count: number }) => s + x.count, 0)).toBe(station.passengers);
    expect(body.calibration.some((c: { route: string | null }) => c.route === 'ORD')).toBe(true);
  }, 150_000);

  it('learns the true booking show rate of the demo history within the expected error', async () => {
    const { body } = await agent.get(`/api/learning/stations/${bos}/routes/ORD`).expect(200);
    const truth = trueMixedShowRate('BOS', 'ORD', false, 'Y', 'standard');
    // Thousands of local economy standard-fare bookings on the route: 4 standard errors with the day shock's design
    // effect come to about 0.02 (see the unit test of the same history for the derivation).
    expect(Math.abs(body.profile.bookingRates.local.Y - truth)).toBeLessThan(0.025);
    expect(body.version).toEqual(expect.any(Number));
  });
});

describe('which rates a station uses', () => {
  it('starts on the hand-set profile; once switched, each forecast names the learned version; pinning and falling back are audited', async () => {
    const latest = (await supervisor.get(`/api/learning/stations/${bos}`).expect(200)).body.latest.version as number;
    const flight = await t.db.getRepository(FlightEntity).findOneOrFail({ where: { stationId: bos, state: In(['scheduled', 'check-in-open', 'boarding']) }, order: { scheduledDeparture: 'ASC' } });
    const versionOfForecast = async (expected: number | null) => {
      t.forecast.markDirty(flight.id);
      await t.forecast.flush();
      return vi.waitFor(async () => {
        const row = await t.db.getRepository(FlightForecastEntity).findOneByOrFail({ flightId: flight.id });
        if (row.ratesVersion !== expected) throw new Error(`forecast used ${row.ratesVersion}, not ${expected}`);
        return row.ratesVersion;
      }, { timeout: 10_000, interval: 100 });
    };
    await t.db.getRepository(StationRatesChoiceEntity).delete({ stationId: bos });
    expect(await versionOfForecast(null)).toBeNull();

    await admin.put(`/api/learning/stations/${bos}/choice`, { mode: 'learned', pinnedVersion: null }).expect(200);
    expect(await versionOfForecast(latest)).toBe(latest);

    await admin.put(`/api/learning/stations/${bos}/choice`, { mode: 'learned', pinnedVersion: latest }).expect(200);
    const [audited] = await t.db.getRepository(AuditLogEntity).find({ where: { action: 'rates_choice.updated', entityId: String(bos) }, order: { id: 'DESC' }, take: 1 });
    expect(audited).toMatchObject({ before: { mode: 'learned', pinnedVersion: null }, after: { mode: 'learned', pinnedVersion: latest } });

    await admin.put(`/api/learning/stations/${bos}/choice`, { mode: 'hand-set', pinnedVersion: null }).expect(200);
    expect(await versionOfForecast(null)).toBeNull();
  }, 60_000);

  it('refuses a bad choice with the field and the rule, and lets only admins choose', async () => {
    const missing = await admin.put(`/api/learning/stations/${bos}/choice`, { mode: 'learned', pinnedVersion: 999_999 }).expect(400);
    expect(missing.body.details).toEqual([{ field: 'pinnedVersion', rule: 'must be a stored version of the learned rates' }]);
    const mixed = await admin.put(`/api/learning/stations/${bos}/choice`, { mode: 'hand-set', pinnedVersion: 1 }).expect(400);
    expect(mixed.body.details).toEqual([{ field: 'pinnedVersion', rule: "pinnedVersion must be null with mode 'hand-set'" }]);
    const mode = await admin.put(`/api/learning/stations/${bos}/choice`, { mode: 'guess', pinnedVersion: null }).expect(400);
    expect(mode.body.details[0]).toEqual({ field: 'mode', rule: "mode must be 'learned' or 'hand-set'" });
    await supervisor.put(`/api/learning/stations/${bos}/choice`, { mode: 'hand-set', pinnedVersion: null }).expect(403);
    await agent.post('/api/learning/jobs').expect(403);
  });
});

describe('outcomes', () => {
  it('lists closed flights and lets a supervisor correct an outcome, audited with before and after', async () => {
    const { body } = await supervisor.get(`/api/learning/stations/${bos}/closed-flights`).expect(200);
    expect(body.flights.length).toBeGreaterThan(0);
    const flight = body.flights[0];
    const outcomes = (await supervisor.get(`/api/learning/closed-flights/${flight.id}/outcomes`).expect(200)).body.outcomes;
    expect(outcomes.length).toBe(flight.booked);
    const target = outcomes.find((o: { outcome: string }) => o.outcome === 'no-show') ?? outcomes[0];
    const next = target.outcome === 'no-show' ? 'missed-connection' : 'no-show';
    const bad = await supervisor.patch(`/api/learning/outcomes/${target.id}`, { outcome: 'vanished', reason: 'checked the gate log' }).expect(400);
    expect(bad.body.details[0].field).toBe('outcome');
    const noReason = await supervisor.patch(`/api/learning/outcomes/${target.id}`, { outcome: next }).expect(400);
    expect(noReason.body.details[0].field).toBe('reason');
    await supervisor.patch(`/api/learning/outcomes/${target.id}`, { outcome: next, reason: 'checked the gate log' }).expect(200);
    const row = await t.db.getRepository(BookingOutcomeEntity).findOneByOrFail({ id: target.id });
    expect(row.outcome).toBe(next);
    expect(row.correctedAt).not.toBeNull();
    const [audited] = await t.db.getRepository(AuditLogEntity).find({ where: { action: 'booking_outcome.corrected', entityId: String(target.id) }, order: { id: 'DESC' }, take: 1 });
    expect(audited).toMatchObject({ actorLabel: DEMO.supervisor, before: { outcome: target.outcome }, after: { outcome: next, reason: 'checked the gate log' } });
    // Put back, so the demo history stays as generated.
    await supervisor.patch(`/api/learning/outcomes/${target.id}`, { outcome: target.outcome, reason: 'restored by the test' }).expect(200);
    await agent.get(`/api/learning/closed-flights/${flight.id}/outcomes`).expect(403);
  });
});
