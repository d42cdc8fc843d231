// The signed passenger links. Outside source: RFC 2104 (HMAC) and RFC 4648 §5 (base64url; the last character of a
// 32-byte value carries 4 data bits and 2 spare bits), from memory.
import { describe, expect, it } from 'vitest';
import { flightToken, passengerToken, readFlightToken, readPassengerToken } from './bid-link';

const SECRET = 'unit-test-secret-unit-test-secret-42';
const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_';
const departure = new Date('2034-03-01T12:00:00Z');
const flipLowBit = (s: string, at: number) => s.slice(0, at) + ALPHABET[ALPHABET.indexOf(s[at]) ^ 1] + s.slice(at + 1);

describe('flight links', () => {
  it('reads back the flight and expires 30 minutes after departure', () => {
    const token = flightToken(SECRET, 42, departure);
    expect(readFlightToken(SECRET, token, departure.getTime())).toEqual({ f: 42, exp: departure.getTime() + 30 * 60_000 });
    expect(readFlightToken(SECRET, token, departure.getTime() + 30 * 60_000)).toBeNull();
  });

  it('refuses every one-character change, including the spare bits of the last character', () => {
    const token = flightToken(SECRET, 42, departure);
    for (let i = 0; i < token.length; i++) {
      if (token[i] === '.') continue;
      expect(readFlightToken(SECRET, flipLowBit(token, i), 0), `position ${i}`).toBeNull();
    }
  });

  it('refuses anything appended, another secret, and a passenger token passed off as a flight link', () => {
    const token = flightToken(SECRET, 42, departure);
    expect(readFlightToken(SECRET, `${token}.x`, 0)).toBeNull();
    expect(readFlightToken('another-secret-another-secret-42', token, 0)).toBeNull();
    expect(readFlightToken(SECRET, passengerToken(SECRET, 42, 7, departure.getTime()), 0)).toBeNull();
    expect(readFlightToken(SECRET, '', 0)).toBeNull();
  });
});

describe('passenger tokens', () => {
  it('name the flight and the booking, and expire with the link', () => {
    const token = passengerToken(SECRET, 42, 7, departure.getTime());
    expect(readPassengerToken(SECRET, token, 0)).toEqual({ f: 42, b: 7, exp: departure.getTime() });
    expect(readPassengerToken(SECRET, token, departure.getTime())).toBeNull();
  });
});
