// The station's Notices screen: every mail with its state and tries, the message as sent, retry of a failed one,
// a fresh copy of a sent one; nothing mailed twice by a retry; another station's notices are "not found".
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { noticeDetailSchema, stationNoticeListSchema } from '@shared/schemas/admin-notices';
import { AuditLogEntity } from '../../server/src/db/entities';
import { enqueueMessage } from '../../server/src/modules/outbox/outbox.service';
import { Client, startTestApp, type TestApp } from './harness';
import { RUN_ID, TEST_PASSWORD, foreignStation, insertUser, removeRunUsers, stationIdByIata } from './helpers';

let t: TestApp;
let supervisor: Client;
let fco: number;
let foreign: number;
const SUBJECT = `Notices screen ${RUN_ID}`;

async function notice(stationId: number, status: 'pending' | 'sent' | 'failed', to = 'guest@passengers.bumpboard.test') {
  const { id } = await t.db.transaction((em) => enqueueMessage(em, { stationId, flightId: null, passengerIds: [], kind: 'rebooking-notice', to, subject: SUBJECT, text: 'Your new flight is ZZ 208.', html: '<p>Your new flight is <b>ZZ 208</b>.</p>' }));
  if (status !== 'pending') await t.db.query('UPDATE outbox_messages SET status = ?, attempts = 3, sent_at = IF(? = "sent", UTC_TIMESTAMP(3), NULL), last_error = IF(? = "failed", "550 mailbox unavailable", NULL) WHERE id = ?', [status, status, status, id]);
  return id;
}

beforeAll(async () => {
  t = await startTestApp();
  fco = await stationIdByIata(t.db, 'FCO');
  foreign = (await foreignStation(t.db)).id;
  const user = await insertUser(t.db, { label: 'notices-supervisor', role: 'supervisor', stationIds: [fco] });
  supervisor = new Client(t.app);
  expect((await supervisor.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
});
afterAll(async () => {
  await t.db.query('DELETE FROM outbox_messages WHERE subject = ?', [SUBJECT]);
  await removeRunUsers(t.db);
  await t.close();
});

describe('the notices list', () => {
  it('shows recipient, subject, state and tries, filtered by state and by words', async () => {
    const failed = await notice(fco, 'failed', `failed-${RUN_ID}@passengers.bumpboard.test`);
    await notice(fco, 'sent');
    const all = stationNoticeListSchema.parse((await supervisor.get(`/api/stations/${fco}/notices?q=${encodeURIComponent(SUBJECT)}`)).body);
    expect(all.notices.length).toBeGreaterThanOrEqual(2);
    const onlyFailed = stationNoticeListSchema.parse((await supervisor.get(`/api/stations/${fco}/notices?status=failed&q=failed-${RUN_ID}`)).body);
    expect(onlyFailed.notices.map((n) => n.id)).toEqual([failed]);
    expect(onlyFailed.notices[0]).toMatchObject({ status: 'failed', attempts: 3, lastError: '550 mailbox unavailable', subject: SUBJECT });
    const bad = await supervisor.get(`/api/stations/${fco}/notices?status=lost`);
    expect(bad.status).toBe(400);
    expect(bad.body.details[0].field).toBe('status');
  });

  it('opens the message as the passenger got it, text and HTML', async () => {
    const id = await notice(fco, 'sent');
    const res = await supervisor.get(`/api/stations/${fco}/notices/${id}`);
    const d = noticeDetailSchema.parse(res.body);
    expect(d.text).toBe('Your new flight is ZZ 208.');
    expect(d.html).toContain('<b>ZZ 208</b>');
  });

  it('hides another station’s notices', async () => {
    const other = await notice(foreign, 'failed');
    expect((await supervisor.get(`/api/stations/${foreign}/notices`)).status).toBe(404);
    // Named under the caller's own station, the other station's notice is still not there.
    expect((await supervisor.get(`/api/stations/${fco}/notices/${other}`)).status).toBe(404);
    expect((await supervisor.post(`/api/stations/${fco}/notices/${other}/retry`)).status).toBe(404);
  });
});

describe('retry and send again', () => {
  it('re-queues a failed notice once, audited; a second retry while it waits is refused', async () => {
    const id = await notice(fco, 'failed');
    const res = await supervisor.post(`/api/stations/${fco}/notices/${id}/retry`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'pending', attempts: 0 });
    expect((await supervisor.post(`/api/stations/${fco}/notices/${id}/retry`)).status).toBe(409);
    expect(await t.db.getRepository(AuditLogEntity).findBy({ action: 'notice.requeued', entityId: id })).toHaveLength(1);
  });

  it('sends a copy of a sent notice as a new message, keeps the original, and refuses a second copy while one waits', async () => {
    const id = await notice(fco, 'sent');
    const res = await supervisor.post(`/api/stations/${fco}/notices/${id}/resend`);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.id).not.toBe(id);
    expect(res.body).toMatchObject({ status: 'pending', resendOf: id, subject: SUBJECT });
    const [orig] = await t.db.query('SELECT status FROM outbox_messages WHERE id = ?', [id]);
    expect(orig.status).toBe('sent');
    const again = await supervisor.post(`/api/stations/${fco}/notices/${id}/resend`);
    expect(again.status).toBe(409);
    expect(again.body.error).toBe('resend_pending');
    expect(await t.db.getRepository(AuditLogEntity).findBy({ action: 'notice.resent', entityId: res.body.id })).toHaveLength(1);
  });

  it('refuses to copy a notice that has not gone (pending or failed): that could mail it twice', async () => {
    expect((await supervisor.post(`/api/stations/${fco}/notices/${await notice(fco, 'pending')}/resend`)).status).toBe(409);
    expect((await supervisor.post(`/api/stations/${fco}/notices/${await notice(fco, 'failed')}/resend`)).status).toBe(409);
  });
});
