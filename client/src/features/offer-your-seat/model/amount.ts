// What a passenger types as "the least I would accept" ("$450", "450,00") to integer minor units, read in their
// browser's locale by the shared money module, like every other money field.
import { currencyDecimals as decimalsOf, readMoneyField } from '../../../lib/money';

export function currencyDecimals(currency: string) {
  return decimalsOf(currency);
}

/** The amount in minor units, or a plain-words reason it cannot be read. */
export function readAmount(text: string, currency: string): { ok: true; minor: number } | { ok: false; reason: string } {
  const r = readMoneyField(text, currency, 'Your amount', { allowZero: false });
  return r.ok ? r : { ok: false, reason: `${r.message}.` };
}
