// The passenger's link: signed with the server's secret, it names the flight (never a passenger) and expires with it.
// After the passenger identifies their booking, a second signed token names the booking for this flight only.
import { createHmac, timingSafeEqual } from 'node:crypto';

interface FlightClaim { f: number; exp: number }
interface PassengerClaim { f: number; b: number; exp: number }

function sign(secret: string, purpose: string, payload: object): string {
  const body = Buffer.from(JSON.stringify(payload)).toString('base64url');
  const mac = createHmac('sha256', secret).update(`${purpose}.${body}`).digest('base64url');
  return `${body}.${mac}`;
}

function verify<T extends { exp: number }>(secret: string, purpose: string, token: string, now: number): T | null {
  // Exactly two parts: anything appended to a valid link makes it a different, invalid link.
  const parts = token.split('.');
  if (parts.length !== 2) return null;
  const [body, mac] = parts;
  if (!body || !mac) return null;
  // Compare the text of the MAC, not its decoded bytes: a base64url decoder ignores the spare low bits of the last
  // character, so several spellings decode to the same bytes and an altered link would still pass.
  const expected = Buffer.from(createHmac('sha256', secret).update(`${purpose}.${body}`).digest('base64url'));
  const given = Buffer.from(mac);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  try {
    const claim = JSON.parse(Buffer.from(body, 'base64url').toString()) as T;
    return typeof claim.exp === 'number' && claim.exp > now ? claim : null;
  } catch {
    return null;
  }
}

/** The link expires half an hour after departure: late bids on a closed flight are meaningless. */
export function flightToken(secret: string, flightId: number, departure: Date): string {
  return sign(secret, 'offer', { f: flightId, exp: departure.getTime() + 30 * 60_000 } satisfies FlightClaim);
}

export function readFlightToken(secret: string, token: string, now = Date.now()) {
  return verify<FlightClaim>(secret, 'offer', token, now);
}

export function passengerToken(secret: string, flightId: number, bookingId: number, exp: number): string {
  return sign(secret, 'passenger', { f: flightId, b: bookingId, exp } satisfies PassengerClaim);
}

export function readPassengerToken(secret: string, token: string, now = Date.now()) {
  return verify<PassengerClaim>(secret, 'passenger', token, now);
}
