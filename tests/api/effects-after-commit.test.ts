// After-commit effects leave through one dispatcher: what a change records inside its transaction reaches the
// consoles' notices and the outbox worker only once that transaction has committed, once per flight and commit, and
// never when it rolled back. Checked against MariaDB's own transactions and savepoints, and through the API.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessageEntity, StationEntity } from '../../server/src/db/entities';
import { domainEventsOf, type DomainEvent } from '../../server/src/events';
import { enqueueMessage } from '../../server/src/modules/outbox/outbox.service';
import type { Publisher } from '../../server/src/realtime/publisher';
import { Client, startTestApp, type TestApp } from './harness';
import { RUN_ID, TEST_PASSWORD, insertUser } from './helpers';
import { addBooking, makeFlight, closeAfterFlights } from './volunteers-fixtures';

let t: TestApp;
let station: StationEntity;
let agent: Client;
const flightIds: number[] = [];
/** What the app told the consoles (flight id, topics), in order. */
const notices: { flightId: number; topics: string[] }[] = [];
/** Everything the dispatcher handed out, in order. */
const dispatched: DomainEvent[] = [];
const publisher: Publisher = { flightChanged: (flightId, _stationId, topics) => void notices.push({ flightId, topics: topics ?? [] }) };

beforeAll(async () => {
  t = await startTestApp({ publisher });
  const events = domainEventsOf(t.db);
  events.subscribe('flight-changed', (e) => void dispatched.push(e));
  events.subscribe('mail-queued', (e) => void dispatched.push(e));
  const repo = t.db.getRepository(StationEntity);
  // Burlington, Vermont: a real US airport, used only by this file so its volunteer policy is the default one.
  station = (await repo.findOneBy({ iata: 'BTV' })) ?? (await repo.save(repo.create({ iata: 'BTV', name: 'Burlington (effects API test station)', timeZone: 'America/New_York', regime: 'us-dot', currency: 'USD' })));
  const user = await insertUser(t.db, { label: 'effects-agent', role: 'agent', stationIds: [station.id] });
  agent = new Client(t.app);
  if ((await agent.signIn(user.email, TEST_PASSWORD)).status !== 200) throw new Error('sign-in failed');
}, 120_000);

afterAll(() => closeAfterFlights(t, flightIds));

async function flight() {
  const f = await makeFlight(t.db, { stationId: station.id, origin: 'BTV', destination: 'BOS' });
  flightIds.push(f.id);
  return f;
}

const mailTo = (flightId: number, key: string) => ({
  stationId: station.id, flightId, passengerIds: [], kind: 'volunteer-confirmation' as const, to: `effects-${RUN_ID}@example.test`,
  subject: 'Effects test', text: 'A test notice.', html: '<p>A test notice.</p>', dedupeKey: `effects-test:${RUN_ID}:${key}`,
});
const of = (flightId: number) => notices.filter((n) => n.flightId === flightId);
const outboxRows = (flightId: number) => t.db.getRepository(OutboxMessageEntity).countBy({ flightId });

describe('effects recorded in a MariaDB transaction', () => {
  it('leave only after the commit: a rolled-back notice is neither sent nor stored', async () => {
    const f = await flight();
    const before = dispatched.length;
    await expect(t.db.transaction(async (em) => {
      await enqueueMessage(em, mailTo(f.id, 'rolled-back'));
      throw new Error('the action failed after queuing its notice');
    })).rejects.toThrow('the action failed');
    expect(dispatched.length).toBe(before);
    expect(of(f.id)).toEqual([]);
    expect(await outboxRows(f.id)).toBe(0);

    await t.db.transaction(async (em) => {
      await enqueueMessage(em, mailTo(f.id, 'committed'));
      expect(dispatched.length).toBe(before);
    });
    expect(dispatched.slice(before)).toEqual([{ type: 'mail-queued' }, { type: 'flight-changed', flightId: f.id, stationId: station.id, topics: ['notices'] }]);
    expect(of(f.id)).toEqual([{ flightId: f.id, topics: ['notices'] }]);
    expect(await outboxRows(f.id)).toBe(1);
  });

  it('of a savepoint rolled back are dropped while the transaction around it commits its own', async () => {
    const f = await flight();
    const before = dispatched.length;
    await t.db.transaction(async (em) => {
      await em.transaction(async (inner) => {
        await enqueueMessage(inner, mailTo(f.id, 'kept'));
      });
      await em.transaction(async (inner) => {
        await enqueueMessage(inner, mailTo(f.id, 'undone'));
        throw new Error('this savepoint rolls back');
      }).catch(() => undefined);
    });
    expect(dispatched.slice(before)).toEqual([{ type: 'mail-queued' }, { type: 'flight-changed', flightId: f.id, stationId: station.id, topics: ['notices'] }]);
    expect(await outboxRows(f.id)).toBe(1);
  });
});

describe('effects of an action through the API', () => {
  it('a refused raise sends no notice; an accepted one sends exactly one per flight, with what moved', async () => {
    const f = await flight();
    await addBooking(t.db, f, [['Vera', 'Volunteer']]);
    const { body: { id: roundId } } = await agent.post(`/api/flights/${f.id}/rounds`, { kind: 'posted', offerMinor: 20_000, volunteersNeeded: 1 }).expect(201);
    expect(of(f.id)).toEqual([{ flightId: f.id, topics: ['rounds'] }]);

    // Above the agent's limit (600.00 by default): the raise waits for a supervisor, announced once with both topics.
    expect((await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: 70_000 }).expect(200)).body.approvalRequested).toBe(true);
    expect(of(f.id).slice(1)).toEqual([{ flightId: f.id, topics: ['rounds', 'approvals'] }]);

    // A second raise while the first waits is refused after it had recorded its notice: the rollback drops it.
    const refused = await agent.post(`/api/rounds/${roundId}/raise`, { offerMinor: 80_000 });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toBe('approval_pending');
    expect(of(f.id)).toHaveLength(2);
  });
});
