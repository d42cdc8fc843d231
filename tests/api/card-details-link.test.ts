// A prepaid card's full details reach the passenger once, on their own phone, through a single-use, short-lived
// link, and nowhere else: the mail carries the link, the server reads the details through the provider's
// ephemeral-key pattern (an ephemeral key made with a nonce, then the card retrieved with that key, expand number
// and cvc), and neither the mail catcher, the server's log, the audit log nor a staff screen ever holds the number.
// Outside sources: Stripe Issuing docs "Display card details" (ephemeral key + nonce, expand number/cvc) and
// stripe-node 23.1 EphemeralKeyCreateParams; ISO/IEC 7812-1 annex B (Luhn check) — from memory. The link's limits
// (24 hours, one use, five wrong proofs) are our own choice, not from a source.
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditLogEntity } from '../../server/src/db/entities';
import { luhnValid } from '../../payments-fake/src/resources/cardSecrets';
import { dueAt, linkToken, publicPost, startLinkWorld, type LinkWorld } from './payout-fixtures';

let w: LinkWorld;
beforeAll(async () => {
  w = await startLinkWorld();
});
afterAll(async () => {
  await w.close();
});

async function issuedCard() {
  const { rows: [comp], proofOf } = await dueAt(w, 1);
  await w.agent.post(`/api/compensations/${comp.id}/issue`).expect(200);
  const card = [...w.fake.fake.store.state.cards.values()].find((c) => c.metadata.compensationId === String(comp.id))!;
  return { comp, card, proof: proofOf(0), token: await linkToken(w, comp.id, 'card') };
}

describe('the card-details link', () => {
  it('tells the page the booking\'s language, so it opens in it', async () => {
    const { comp, token } = await issuedCard();
    expect((await publicPost(w, '/card-details/status', { token })).body.language).toBeNull();
    await w.app.db.query('UPDATE bookings b JOIN passengers p ON p.booking_id = b.id SET b.language = ? WHERE p.id = ?', ['it', comp.passengerId]);
    expect((await publicPost(w, '/card-details/status', { token })).body.language).toBe('it');
  });

  it('shows the full details once, to the holder of the booking proof, and never again', async () => {
    const { comp, card, proof, token } = await issuedCard();
    const status = await publicPost(w, '/card-details/status', { token });
    expect(status.status).toBe(200);
    expect(status.body).toMatchObject({ state: 'ready', amountMinor: comp.amountMinor, currency: 'USD' });
    expect(JSON.stringify(status.body)).not.toContain(card.number!);

    const shown = await publicPost(w, '/card-details/reveal', { token, ...proof });
    expect(shown.status).toBe(200);
    expect(shown.body).toMatchObject({ number: card.number, cvc: card.cvc, expMonth: card.exp_month, expYear: card.exp_year });
    expect(luhnValid(String(shown.body.number))).toBe(true);
    expect(String(shown.body.number).endsWith(card.last4)).toBe(true);

    const again = await publicPost(w, '/card-details/reveal', { token, ...proof });
    expect(again).toMatchObject({ status: 410, body: { error: 'link_used' } });
    expect((await publicPost(w, '/card-details/status', { token })).body.state).toBe('used');
    // The provider was asked through an ephemeral key bound to this card, never with the secret key.
    expect([...w.fake.fake.store.state.ephemeralKeys.values()].filter((k) => k.cardId === card.id)).toHaveLength(1);
    const audits = await w.app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(comp.id), action: 'compensation.card_details_shown' });
    expect(audits).toHaveLength(1);
  });

  it('keeps the number out of the mail catcher, the server log, the audit log and the staff screens', async () => {
    const { comp, card, proof, token } = await issuedCard();
    expect((await publicPost(w, '/card-details/reveal', { token, ...proof })).status).toBe(200);
    // A malformed body with the number in it must not be echoed into a log either.
    await fetch(`${w.app.baseUrl}/api/public/payments/card-details/reveal`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: `{"token": ${card.number!}x` });
    await w.deliverMail();
    const mail = w.mailText();
    expect(mail).toContain(`/card/${token}`);
    expect(mail).toContain(card.last4);
    const number = card.number!;
    for (const [where, text] of [['mail catcher', mail], ['server log', w.logs.join('\n')]] as const) {
      expect(text, where).not.toContain(number);
      expect(text, where).not.toContain(`${number.slice(0, 4)} ${number.slice(4, 8)}`);
    }
    const audit = JSON.stringify(await w.app.db.getRepository(AuditLogEntity).findBy({ entityType: 'compensation', entityId: String(comp.id) }));
    expect(audit).not.toContain(number);
    const desk = await w.agent.get(`/api/flights/${comp.flightId}/compensations`).expect(200);
    expect(JSON.stringify(desk.body)).toContain(String(comp.id));
    expect(JSON.stringify(desk.body)).not.toContain(number);
    const [stored]: { n: number | string }[] = await w.app.db.query('SELECT COUNT(*) AS n FROM payment_links WHERE token_hash = ?', [token]);
    expect(Number(stored.n)).toBe(0); // only a hash of the token is kept
  });

  it('refuses another holder: wrong booking proofs count down, then the link locks for everyone', async () => {
    const { proof, token } = await issuedCard();
    const wrong = { pnr: proof.pnr, lastName: 'Somebody' };
    const first = await publicPost(w, '/card-details/reveal', { token, ...wrong });
    expect(first).toMatchObject({ status: 403, body: { error: 'booking_not_matched' } });
    expect(String(first.body.message)).toContain('4 tries left');
    for (let i = 0; i < 4; i += 1) await publicPost(w, '/card-details/reveal', { token, ...wrong });
    expect(await publicPost(w, '/card-details/reveal', { token, ...proof })).toMatchObject({ status: 423, body: { error: 'link_locked' } });
  });

  it('expires after 24 hours on the clock, shown or not', async () => {
    const { proof, token } = await issuedCard();
    const start = w.clock.ms;
    try {
      w.clock.ms = start + 24 * 3_600_000 + 1;
      expect((await publicPost(w, '/card-details/status', { token })).body.state).toBe('expired');
      expect(await publicPost(w, '/card-details/reveal', { token, ...proof })).toMatchObject({ status: 410, body: { error: 'link_expired' } });
    } finally {
      w.clock.ms = start;
    }
  });

  it('answers two opens at the same moment with the details once and "used" once', async () => {
    const { proof, token } = await issuedCard();
    const both = await Promise.all([publicPost(w, '/card-details/reveal', { token, ...proof }), publicPost(w, '/card-details/reveal', { token, ...proof })]);
    expect(both.map((r) => r.status).sort()).toEqual([200, 410]);
  });

  it('keeps the link usable when the provider fails, and shows the details on the next try', async () => {
    const { card, proof, token } = await issuedCard();
    w.fake.fake.faults.api.add({ kind: 'error500', count: 3, method: 'POST', pathPrefix: '/v1/ephemeral_keys' });
    const failed = await publicPost(w, '/card-details/reveal', { token, ...proof });
    expect(failed).toMatchObject({ status: 502, body: { error: 'provider_unavailable' } });
    expect((await publicPost(w, '/card-details/status', { token })).body.state).toBe('ready');
    const shown = await publicPost(w, '/card-details/reveal', { token, ...proof });
    expect(shown).toMatchObject({ status: 200, body: { number: card.number } });
  });

  it('answers an unknown or cut-short link with a clear refusal, and a bad body with the field and the rule', async () => {
    expect(await publicPost(w, '/card-details/status', { token: 'x'.repeat(43) })).toMatchObject({ status: 404, body: { error: 'link_invalid' } });
    expect(await publicPost(w, '/card-details/status', {})).toMatchObject({ status: 400, body: { details: [{ field: 'token' }] } });
    const { token } = await issuedCard();
    expect(await publicPost(w, '/card-details/reveal', { token, pnr: '!', lastName: '' })).toMatchObject({ status: 400, body: { error: 'invalid_request' } });
  });
});

describe('the stand-in guards card details the way the provider does', () => {
  it('gives number and cvc only to an ephemeral key of that card, never to the secret key', async () => {
    const { card } = await issuedCard();
    const stripe = new Stripe('sk_test_card_details', { host: '127.0.0.1', port: w.fake.port, protocol: 'http', telemetry: false, maxNetworkRetries: 0 });
    await expect(stripe.issuing.cards.retrieve(card.id, { expand: ['number'] })).rejects.toMatchObject({ statusCode: 400, param: 'expand' });
    await expect(stripe.ephemeralKeys.create({ issuing_card: card.id }, { apiVersion: Stripe.API_VERSION })).rejects.toMatchObject({ param: 'nonce' });
    const key = await stripe.ephemeralKeys.create({ issuing_card: card.id, nonce: 'n'.repeat(24) }, { apiVersion: Stripe.API_VERSION });
    const read = await stripe.issuing.cards.retrieve(card.id, { expand: ['number', 'cvc'] }, { apiKey: key.secret });
    expect(read.number).toBe(card.number);
    const other = [...w.fake.fake.store.state.cards.values()].find((c) => c.id !== card.id)!;
    await expect(stripe.issuing.cards.retrieve(other.id, { expand: ['number'] }, { apiKey: key.secret })).rejects.toMatchObject({ statusCode: 403 });
    await expect(stripe.issuing.cards.list({ limit: 1 }, { apiKey: key.secret })).rejects.toMatchObject({ statusCode: 403 });
  });
});
