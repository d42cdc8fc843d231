// After the passenger proves their booking, the signed token is kept for this browser tab only, so a reload or a
// locked phone does not ask again; it names the booking for this one flight link and expires with it.

import type { Language } from '@shared/i18n';

export interface Identified {
  passengerToken: string;
  names: string[];
  /** The booking's language, when the booking system gave one. */
  language?: Language | null;
}

const keyOf = (linkToken: string) => `bumpboard.offer.${linkToken}`;

export function recallPassenger(linkToken: string, storage: Storage = sessionStorage): Identified | null {
  try {
    const raw = storage.getItem(keyOf(linkToken));
    const parsed: unknown = raw ? JSON.parse(raw) : null;
    if (parsed && typeof parsed === 'object' && 'passengerToken' in parsed && typeof parsed.passengerToken === 'string' && 'names' in parsed && Array.isArray(parsed.names)) {
      return { passengerToken: parsed.passengerToken, names: parsed.names.map(String) };
    }
  } catch {
    // A private-mode browser may refuse storage; the passenger simply identifies again.
  }
  return null;
}

export function rememberPassenger(linkToken: string, who: Identified, storage: Storage = sessionStorage) {
  try {
    storage.setItem(keyOf(linkToken), JSON.stringify(who));
  } catch {
    // See recallPassenger: nothing breaks without storage.
  }
}

export function forgetPassenger(linkToken: string, storage: Storage = sessionStorage) {
  try {
    storage.removeItem(keyOf(linkToken));
  } catch {
    // See recallPassenger.
  }
}
