// The station's offer ladder and approval limits are edited from the screens, not a database console: the admin's
// save is validated field by field (a bad value names the field and the rule, and nothing changes), audited with the
// before and after, and closed to every other role. Amounts are integer minor units (USD cents, ISO 4217, from memory).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity } from '../../server/src/db/entities';
import type { Client } from './harness';
import { signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';

let t: TestApp;
let agent: Client;
let supervisor: Client;
let admin: Client;
let bos: number;
let original: Record<string, unknown>;

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor, admin] = await Promise.all([DEMO.agent, DEMO.supervisor, DEMO.admin].map((e) => signedIn(t, e)));
  bos = await stationIdByIata(t.db, 'BOS');
  original = (await admin.get(`/api/stations/${bos}/volunteer-policy`).expect(200)).body;
});

afterAll(async () => {
  if (original) await admin.put(`/api/stations/${bos}/volunteer-policy`, original);
  await t.close();
});

const policy = () => admin.get(`/api/stations/${bos}/volunteer-policy`).expect(200).then((r) => r.body);
const audits = () => t.db.getRepository(AuditLogEntity).count();

describe('the volunteer policy editor (offer ladder and approval limits)', () => {
  it.each([
    [{ ladderMinor: [40_000, 30_000] }, 'ladderMinor', 'ladderMinor must rise at every step'],
    [{ ladderMinor: [] }, 'ladderMinor', 'ladderMinor needs at least one step'],
    [{ agentLimitMinor: 600.5 }, 'agentLimitMinor', 'agentLimitMinor must be a whole number of minor units (e.g. cents)'],
  ])('refuses %j naming %s, and changes nothing', async (change, field, rule) => {
    const before = await audits();
    const res = await admin.put(`/api/stations/${bos}/volunteer-policy`, { ...original, ...change });
    expect(res.status).toBe(400);
    expect(res.body.details).toContainEqual({ field, rule });
    expect(await policy()).toEqual(original);
    expect(await audits()).toBe(before);
  });

  it('saves a new ladder and limits, with the before and after in the audit log', async () => {
    const next = { ...original, ladderMinor: [35_000, 50_000, 75_000], agentLimitMinor: 50_000, supervisorLimitMinor: 150_000 };
    await admin.put(`/api/stations/${bos}/volunteer-policy`, next).expect(200);
    expect(await policy()).toMatchObject({ ladderMinor: [35_000, 50_000, 75_000], agentLimitMinor: 50_000, supervisorLimitMinor: 150_000 });
    const row = await t.db.getRepository(AuditLogEntity).findOne({ where: { action: 'volunteer_policy.updated', entityId: String(bos) }, order: { id: 'DESC' } });
    expect(row?.before).toMatchObject({ ladderMinor: original.ladderMinor });
    expect(row?.after).toMatchObject({ ladderMinor: [35_000, 50_000, 75_000], agentLimitMinor: 50_000 });
  });

  it('is the admin’s alone: an agent and a supervisor are refused', async () => {
    for (const who of [agent, supervisor]) {
      const res = await who.put(`/api/stations/${bos}/volunteer-policy`, { ...original, agentLimitMinor: 1 });
      expect(res.status).toBe(403);
    }
    expect((await policy()).agentLimitMinor).not.toBe(1);
  });
});
