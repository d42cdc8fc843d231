// Test flights get numbers from a block of their own; a clash with a leftover of an earlier run (the unique key on
// carrier, number, date and origin refuses it) is retried with another number.
import { randomInt } from 'node:crypto';
import { isDuplicateKey } from '../../server/src/db/driver-errors';

export async function withFreeFlightNumber<T>(block: { from: number; size: number }, save: (flightNumber: string) => Promise<T>, tries = 20): Promise<T> {
  for (let attempt = 0; attempt < tries; attempt++) {
    try {
      return await save(String(block.from + randomInt(block.size)));
    } catch (err) {
      if (!isDuplicateKey(err)) throw err;
    }
  }
  throw new Error(`no free flight number in ${block.from}–${block.from + block.size - 1} after ${tries} tries`);
}
