// The desk sends a passenger a new payout or card-details link: every older live link of that compensation and
// purpose stops working (410), the new one works, the staff member is audited, and it is refused once the link's
// job is done (account given, card details shown) or after too many in an hour. The hourly limit (3) is our own
// choice, not from a source.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity } from '../../server/src/db/entities';
import { MAX_NEW_LINKS_PER_HOUR } from '../../server/src/modules/payouts/link-resend';
import { dueAt, linkToken, publicPost, startLinkWorld, type LinkWorld } from './payout-fixtures';

let w: LinkWorld;
beforeAll(async () => {
  w = await startLinkWorld();
});
afterAll(async () => {
  await w.close();
});

const ROUTING = '110000000';
const account = (p: { pnr: string; lastName: string }, token: string, n: string) => ({ token, ...p, holderName: 'Ana Tester', routingNumber: ROUTING, accountNumber: n, accountNumberAgain: n, accountType: 'checking' });

async function deskView(row: { id: number; flightId: number }) {
  const res = await w.agent.get(`/api/flights/${row.flightId}/compensations`).expect(200);
  return (res.body.compensations as { id: number; payment: { passengerLink: unknown } }[]).find((c) => c.id === row.id)!;
}

async function transferDue() {
  const { rows: [row], proofOf } = await dueAt(w, 1, () => ({ medium: 'bank-transfer' }));
  await w.agent.post(`/api/compensations/${row.id}/issue`).expect(200);
  return { row, proof: proofOf(0), token: await linkToken(w, row.id, 'payout') };
}

async function cardIssued() {
  const { rows: [row], proofOf } = await dueAt(w, 1);
  await w.agent.post(`/api/compensations/${row.id}/issue`).expect(200);
  return { row, proof: proofOf(0), token: await linkToken(w, row.id, 'card') };
}

describe('a new passenger link from the desk', () => {
  it('kills the old payout link, mails a new one that takes the account, and audits the agent', async () => {
    const { row, proof, token: old } = await transferDue();
    await w.app.db.query('UPDATE bookings b JOIN passengers p ON p.booking_id = b.id SET b.language = ? WHERE p.id = ?', ['de', row.passengerId]);
    const res = await w.agent.post(`/api/compensations/${row.id}/new-link`).expect(200);
    expect(res.body.link.purpose).toBe('payout');
    const fresh = await linkToken(w, row.id, 'payout');
    expect(fresh).not.toBe(old);
    // Mailed through the outbox in the booking's language.
    const [mail]: { html: string; text: string; subject: string }[] = await w.app.db.query('SELECT html, text, subject FROM outbox_messages WHERE text LIKE ?', [`%/payout/${fresh}%`]);
    expect(mail.html).toContain('<html lang="de">');
    expect(mail.subject).toMatch(/^Ein neuer Link für Ihre Entschädigung/);
    expect(mail.text).toContain('Frühere Links funktionieren nicht mehr');
    expect(await publicPost(w, '/payout/account', account(proof, old, '000123456789'))).toMatchObject({ status: 410, body: { error: 'link_expired' } });
    expect(await publicPost(w, '/payout/account', account(proof, fresh, '000123456789'))).toMatchObject({ status: 200, body: { accountEnding: '6789' } });
    const audits = await w.app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(row.id), action: 'compensation.link_resent' });
    expect(audits).toHaveLength(1);
    expect(audits[0].actorLabel).toContain('@');
    expect(audits[0].after).toMatchObject({ purpose: 'payout' });
    // The account is given: a new link would take nothing, and the desk's card says so before anyone asks.
    expect((await deskView(row)).payment.passengerLink).toMatchObject({ purpose: 'payout', state: 'used', replaceable: false });
    expect((await w.agent.post(`/api/compensations/${row.id}/new-link`).expect(409)).body.error).toBe('link_job_done');
  });

  it('replaces a locked card-details link; the new one shows the details once, then no new link is sent', async () => {
    const { row, proof, token: old } = await cardIssued();
    expect((await deskView(row)).payment.passengerLink).toMatchObject({ purpose: 'card-details', state: 'ready', replaceable: true });
    for (let i = 0; i < 5; i += 1) await publicPost(w, '/card-details/reveal', { token: old, pnr: proof.pnr, lastName: 'Wrongname' });
    expect((await publicPost(w, '/card-details/reveal', { token: old, ...proof })).status).toBe(423);
    expect((await deskView(row)).payment.passengerLink).toMatchObject({ state: 'locked', replaceable: true });
    expect((await w.agent.post(`/api/compensations/${row.id}/new-link`).expect(200)).body.link.purpose).toBe('card-details');
    const fresh = await linkToken(w, row.id, 'card');
    expect(fresh).not.toBe(old);
    expect((await publicPost(w, '/card-details/reveal', { token: fresh, ...proof })).status).toBe(200);
    expect((await publicPost(w, '/card-details/reveal', { token: fresh, ...proof })).status).toBe(410);
    expect((await deskView(row)).payment.passengerLink).toMatchObject({ state: 'used', replaceable: false });
    const refused = await w.agent.post(`/api/compensations/${row.id}/new-link`).expect(409);
    expect(refused.body).toMatchObject({ error: 'link_job_done' });
    expect(refused.body.message).toMatch(/already shown/);
  });

  it(`sends at most ${MAX_NEW_LINKS_PER_HOUR} new links an hour, then again after the hour`, async () => {
    const { row } = await transferDue();
    for (let i = 0; i < MAX_NEW_LINKS_PER_HOUR; i += 1) await w.agent.post(`/api/compensations/${row.id}/new-link`).expect(200);
    const refused = await w.agent.post(`/api/compensations/${row.id}/new-link`).expect(429);
    expect(refused.body.message).toMatch(/at most 3 new links an hour/);
    const [live]: { n: number | string }[] = await w.app.db.query('SELECT COUNT(*) AS n FROM payment_links WHERE compensation_id = ? AND expires_at > ?', [row.id, new Date(w.clock.ms)]);
    expect(Number(live.n)).toBe(1); // only the newest link works
    w.clock.ms += 3_600_001;
    await w.agent.post(`/api/compensations/${row.id}/new-link`).expect(200);
  });

  it('refuses a compensation with no passenger link (not issued yet)', async () => {
    const { rows: [row] } = await dueAt(w, 1, () => ({ medium: 'bank-transfer' }));
    expect((await w.agent.post(`/api/compensations/${row.id}/new-link`).expect(409)).body.error).toBe('no_passenger_link');
    expect((await deskView(row)).payment.passengerLink).toBeNull();
  });
});
