import { randomInt } from 'node:crypto';
import type { CardRecord } from '../store/types.js';

// Test card numbers start 4000 00 here, a made-up range of the stand-in; they pass the Luhn check (ISO/IEC 7812-1,
// annex B) so a phone's wallet would accept them as well-formed.
const PREFIX = '400000';

function luhnSumWithout(digits: number[], skip: number): number {
  let sum = 0;
  for (let i = 0; i < digits.length; i += 1) {
    if (i === skip) continue;
    const fromRight = digits.length - 1 - i;
    let d = digits[i];
    if (fromRight % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return sum;
}

/** A 16-digit number ending in `last4`; position 11 (never doubled) is chosen so the Luhn sum is a multiple of 10. */
export function cardNumberEnding(last4: string): string {
  const digits = [...PREFIX].map(Number);
  while (digits.length < 12) digits.push(randomInt(0, 10));
  digits.push(...[...last4].map(Number));
  digits[11] = (10 - (luhnSumWithout(digits, 11) % 10)) % 10;
  return digits.join('');
}

export function luhnValid(number: string): boolean {
  const digits = [...number].map(Number);
  return luhnSumWithout(digits, -1) % 10 === 0;
}

/** Fills in the secrets a card made by an older stand-in lacks. */
export function ensureSecrets(card: CardRecord): { number: string; cvc: string } {
  card.number ??= cardNumberEnding(card.last4);
  card.cvc ??= String(randomInt(0, 1000)).padStart(3, '0');
  return { number: card.number, cvc: card.cvc };
}
