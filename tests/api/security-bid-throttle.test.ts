// The passenger's "Offer your seat" page is throttled per link and per round, never per client address: everyone at
// an airport often shares one address, and a guesser there must not shut the other passengers out; a guesser who
// rotates addresses gets no more tries than one.
// Yardsticks: OWASP ASVS 5.0 V6.3.1 (brute-force controls) and V2.4.1 (anti-automation), requirement numbers from
// memory. Client addresses are from the documentation ranges of RFC 5737.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FlightEntity } from '../../server/src/db/entities';
import { Client, signedIn, startTestApp, type TestApp } from './harness';
import { DEMO, stationIdByIata } from './helpers';
import { addBooking, makeFlight, removeFlights, tokenOf, type Booked } from './volunteers-fixtures';

// The allowance per link and round (the route's default).
const ALLOWANCE = 30;

let t: TestApp;
let agent: Client;
const flightIds: number[] = [];

beforeAll(async () => {
  t = await startTestApp();
  agent = await signedIn(t, DEMO.agent);
});
afterAll(async () => {
  await removeFlights(t.db, flightIds);
  await t.close();
});

async function flightWithRound(): Promise<{ flight: FlightEntity; party: Booked; token: string; roundId: number }> {
  const flight = await makeFlight(t.db, { stationId: await stationIdByIata(t.db, 'BOS'), origin: 'BOS', destination: 'HYA' });
  flightIds.push(flight.id);
  const party = await addBooking(t.db, flight, [['Rosa', 'Quillfeather']]);
  const opened = await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'sealed', volunteersNeeded: 1 }).expect(201);
  const listed = await agent.get(`/api/flights/${flight.id}/rounds`).expect(200);
  return { flight, party, token: tokenOf(listed.body.bidLink), roundId: opened.body.id ?? listed.body.rounds[0].id };
}

const identify = (token: string, ip: string, body: { pnr: string; lastName: string }) =>
  agent.agent.post(`/api/public/offers/${token}/identify`).set('X-Forwarded-For', ip).send(body);

describe('identify on a passenger link', () => {
  it('holds a guesser who rotates addresses to one allowance for the link', async () => {
    const { party, token } = await flightWithRound();
    for (let i = 0; i < ALLOWANCE; i++) expect((await identify(token, `203.0.113.${i + 1}`, { pnr: party.booking.pnr, lastName: `Wrong${i}` })).status).toBe(404);
    const res = await identify(token, '203.0.113.250', { pnr: party.booking.pnr, lastName: 'Quillfeather' });
    expect([res.status, res.body.error]).toEqual([429, 'too_many_attempts']);
  });

  it('does not let a guess on one flight’s link shut out a passenger of another flight behind the same address', async () => {
    const guessed = await flightWithRound();
    const other = await flightWithRound();
    const shared = '198.51.100.77';
    for (let i = 0; i < ALLOWANCE + 1; i++) await identify(guessed.token, shared, { pnr: guessed.party.booking.pnr, lastName: `Wrong${i}` });
    await identify(other.token, shared, { pnr: other.party.booking.pnr, lastName: 'Quillfeather' }).expect(200);
  });

  it('starts a new count when the gate opens a new round', async () => {
    const { flight, party, token } = await flightWithRound();
    const shared = '198.51.100.78';
    for (let i = 0; i < ALLOWANCE; i++) await identify(token, shared, { pnr: party.booking.pnr, lastName: `Wrong${i}` });
    expect((await identify(token, shared, { pnr: party.booking.pnr, lastName: 'Quillfeather' })).status).toBe(429);

    const rounds = (await agent.get(`/api/flights/${flight.id}/rounds`).expect(200)).body.rounds as { id: number; status: string }[];
    await agent.post(`/api/rounds/${rounds.find((r) => r.status === 'open')!.id}/close`).expect(200);
    await agent.post(`/api/flights/${flight.id}/rounds`, { kind: 'sealed', volunteersNeeded: 1 }).expect(201);
    await identify(token, shared, { pnr: party.booking.pnr, lastName: 'Quillfeather' }).expect(200);
  });

  it('counts the guesses of every server process together: two processes give a guesser one allowance, not two', async () => {
    const { party, token } = await flightWithRound();
    const second = await startTestApp();
    try {
      const other = new Client(second.app);
      const at = (c: Client, i: number, lastName: string) =>
        c.agent.post(`/api/public/offers/${token}/identify`).set('X-Forwarded-For', `192.0.2.${i + 1}`).send({ pnr: party.booking.pnr, lastName });
      // Half the guesses through each process (a balancer spreading them), then the right name through either.
      for (let i = 0; i < ALLOWANCE; i++) expect((await at(i % 2 ? other : agent, i, `Wrong${i}`)).status).toBe(404);
      for (const c of [agent, other]) {
        const res = await at(c, 99, 'Quillfeather');
        expect([res.status, res.body.error]).toEqual([429, 'too_many_attempts']);
      }
    } finally {
      await second.close();
    }
  });
});
