import { randomBytes } from 'node:crypto';

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/** Stripe-looking identifier: a type prefix and 24 random base-62 characters, e.g. `ic_1Nv0…`. */
export function newId(prefix: string): string {
  const bytes = randomBytes(24);
  let suffix = '';
  // Modulo bias is irrelevant here: the ids only need to be unique and look like Stripe's.
  for (const byte of bytes) suffix += ALPHABET[byte % ALPHABET.length];
  return `${prefix}_${suffix}`;
}

export const ID_PREFIX = {
  cardholder: 'ich',
  card: 'ic',
  transaction: 'ipi',
  event: 'evt',
  request: 'req',
  delivery: 'whd',
  ephemeralKey: 'ephkey',
  ephemeralSecret: 'ek_test',
  paymentMethod: 'pm',
  outboundPayment: 'obp',
} as const;
