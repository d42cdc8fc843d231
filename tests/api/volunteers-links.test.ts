// The passenger's signed link ("Offer your seat", no sign-in): an altered or expired link is refused with one
// answer and stores nothing; a wrong booking reference and a wrong last name get the very same answer. Its throttling
// (per link and round) is tested in security-bid-throttle.test.ts.
// Outside sources: RFC 2104 (HMAC: any change to the message or the tag fails verification) and the OWASP
// Authentication Cheat Sheet (generic failure messages that do not say which part was wrong; throttling of
// repeated failures), both from memory.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FlightEntity, VolunteerEntity } from '../../server/src/db/entities';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { addBooking, makeFlight, removeFlights, tokenOf, type Booked } from './volunteers-fixtures';

let t: TestApp;
let agent: Client;
let flight: FlightEntity;
let pastFlight: FlightEntity;
let party: Booked;
let token: string;
let pastToken: string;
let address = 10;
const flightIds: number[] = [];

/** Each check from its own documentation address (RFC 5737), so the throttle of one never bleeds into another. */
const nextAddress = () => `192.0.2.${address++}`;
const pub = (method: 'get' | 'post', path: string, ip = nextAddress()) => agent.agent[method](`/api/public/offers/${path}`).set('X-Forwarded-For', ip);

beforeAll(async () => {
  t = await startTestApp();
  agent = await signedIn(t, DEMO.agent);
  const bos = await stationIdByIata(t.db, 'BOS');
  flight = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'HYA' });
  pastFlight = await makeFlight(t.db, { stationId: bos, origin: 'BOS', destination: 'HYA' });
  flightIds.push(flight.id, pastFlight.id);
  party = await addBooking(t.db, flight, [['Ines', 'Linkwood'], ['Jo', 'Linkwood']]);
  await addBooking(t.db, pastFlight, [['Kit', 'Late']]);
  // Its round was opened before it left (no round opens on a departed flight); then it left two hours ago, so its
  // link expired half an hour after departure.
  for (const f of [flight, pastFlight]) await agent.post(`/api/flights/${f.id}/rounds`, { kind: 'sealed', volunteersNeeded: 2 }).expect(201);
  await t.db.getRepository(FlightEntity).update({ id: pastFlight.id }, { scheduledDeparture: new Date(Date.now() - 2 * 3_600_000) });
  token = tokenOf((await agent.get(`/api/flights/${flight.id}/rounds`).expect(200)).body.bidLink);
  pastToken = tokenOf((await agent.get(`/api/flights/${pastFlight.id}/rounds`).expect(200)).body.bidLink);
});

afterAll(async () => {
  await removeFlights(t.db, flightIds);
  await t.close();
});

const BASE64URL = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_';

/** Flips the lowest bit of one base64url character (RFC 4648 §5): the smallest change a link can suffer. */
function flip(s: string, at: number): string {
  return s.slice(0, at) + BASE64URL[BASE64URL.indexOf(s[at]) ^ 1] + s.slice(at + 1);
}

/** Volunteer rows of the flight, and audit rows written in the name of its bookings' passenger links. */
async function storedFor(f: FlightEntity) {
  const volunteers = await t.db.getRepository(VolunteerEntity).countBy({ flightId: f.id });
  const [{ n }] = await t.db.query(
    `SELECT COUNT(*) AS n FROM audit_log WHERE actor_label IN (SELECT CONCAT('passenger link (booking ', id, ')') FROM bookings WHERE flight_id = ?)`,
    [f.id],
  );
  return { volunteers, audits: Number(n) };
}

describe('altered and expired links', () => {
  it('serves the genuine link, with the solicitation disclosure', async () => {
    const res = await pub('get', token).expect(200);
    expect(res.body.flight.label).toBe(`ZV ${flight.flightNumber}`);
    expect(res.body.round).toMatchObject({ kind: 'sealed', offerMinor: null, currency: 'USD' });
    // 14 CFR 250.2b(b) (from memory): a volunteer is told, when asked, what an involuntary denial would pay.
    expect(res.body.disclosure.involuntaryRule).toContain('14 CFR 250.5');
    expect(typeof res.body.disclosure.mayBeDeniedInvoluntarily).toBe('boolean');
  });

  it('refuses a link with one character changed anywhere, or with anything appended: 404 link_invalid, nothing stored', async () => {
    const [body, mac] = token.split('.');
    const genuine = await pub('post', `${token}/identify`).send({ pnr: party.booking.pnr, lastName: 'Linkwood' }).expect(200);
    const before = await storedFor(flight);
    const altered = [
      `${flip(body, 3)}.${mac}`,
      `${body}.${flip(mac, 0)}`,
      // The last character of a 256-bit tag carries two spare bits a base64 decoder drops: it must still count.
      `${body}.${flip(mac, mac.length - 1)}`,
      `${token}.x`,
    ];
    for (const bad of altered) {
      for (const res of [
        await pub('get', bad),
        await pub('post', `${bad}/identify`).send({ pnr: party.booking.pnr, lastName: 'Linkwood' }),
        await pub('post', `${bad}/bids`).send({ passengerToken: genuine.body.passengerToken, askMinor: 12_300 }),
        await pub('get', `${bad}/status?passengerToken=${encodeURIComponent(genuine.body.passengerToken)}`),
      ]) {
        expect(res.status, bad).toBe(404);
        expect(res.body.error).toBe('link_invalid');
      }
    }
    expect(await storedFor(flight)).toEqual(before);
  });

  it('refuses the link of a flight that left: 404 link_invalid, and a bid on it stores nothing', async () => {
    const before = await storedFor(pastFlight);
    expect((await pub('get', pastToken)).body.error).toBe('link_invalid');
    const identify = await pub('post', `${pastToken}/identify`).send({ pnr: 'ABCDEF', lastName: 'Late' });
    expect([identify.status, identify.body.error]).toEqual([404, 'link_invalid']);
    const bid = await pub('post', `${pastToken}/bids`).send({ passengerToken: 'x'.repeat(40), askMinor: 5_000 });
    expect([bid.status, bid.body.error]).toEqual([404, 'link_invalid']);
    expect(await storedFor(pastFlight)).toEqual(before);
  });

  it('refuses a passenger token made for another flight’s link', async () => {
    const genuine = await pub('post', `${token}/identify`).send({ pnr: party.booking.pnr, lastName: 'Linkwood' }).expect(200);
    const other = await makeFlight(t.db, { stationId: flight.stationId, origin: 'BOS', destination: 'HYA' });
    flightIds.push(other.id);
    await agent.post(`/api/flights/${other.id}/rounds`, { kind: 'sealed', volunteersNeeded: 1 }).expect(201);
    const otherToken = tokenOf((await agent.get(`/api/flights/${other.id}/rounds`).expect(200)).body.bidLink);
    const res = await pub('post', `${otherToken}/bids`).send({ passengerToken: genuine.body.passengerToken, askMinor: 5_000 });
    expect([res.status, res.body.error]).toEqual([401, 'passenger_token_invalid']);
    expect(await t.db.getRepository(VolunteerEntity).countBy({ flightId: other.id })).toBe(0);
  });
});

describe('proving the booking', () => {
  it('answers a wrong booking reference and a wrong last name identically', async () => {
    const wrongPnr = await pub('post', `${token}/identify`).send({ pnr: 'ZZZZZ9', lastName: 'Linkwood' });
    const wrongName = await pub('post', `${token}/identify`).send({ pnr: party.booking.pnr, lastName: 'Linkwould' });
    expect(wrongPnr.status).toBe(404);
    expect([wrongName.status, wrongName.body]).toEqual([wrongPnr.status, wrongPnr.body]);
    expect(wrongPnr.body.error).toBe('booking_not_matched');
  });

  it('matches the last name without regard to case, and names the party', async () => {
    const res = await pub('post', `${token}/identify`).send({ pnr: party.booking.pnr.toLowerCase(), lastName: 'LINKWOOD' }).expect(200);
    expect(res.body.names).toEqual(['Ines Linkwood', 'Jo Linkwood']);
  });

  it('refuses a bid without a passenger token from identify, storing nothing', async () => {
    const before = await storedFor(flight);
    const res = await pub('post', `${token}/bids`).send({ passengerToken: 'not-a-real-token-at-all', askMinor: 5_000 });
    expect([res.status, res.body.error]).toEqual([401, 'passenger_token_invalid']);
    expect(await storedFor(flight)).toEqual(before);
  });
});
