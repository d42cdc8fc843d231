// Stripe prints the cardholder name on the card: at most 24 characters, and no special characters or numbers
// (stripe-node 23.1, Issuing CardholderCreateParams.name). Passenger names from a manifest are anything but that.

export const CARDHOLDER_NAME_MAX = 24;
const FALLBACK = 'Passenger';

/** Plain letters and single spaces: accents are folded (NFKD, then the marks dropped), everything else goes. */
function lettersOnly(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/\p{M}/gu, '')
    .replace(/[^A-Za-z ]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

/**
 * "First Last", shortened when too long: first the given names to an initial, then cut at a word boundary.
 * Never empty, never over 24 characters.
 */
export function cardholderName(firstName: string, lastName: string): string {
  const first = lettersOnly(firstName);
  const last = lettersOnly(lastName);
  const full = [first, last].filter(Boolean).join(' ');
  if (!full) return FALLBACK;
  if (full.length <= CARDHOLDER_NAME_MAX) return full;
  const initialled = [first.slice(0, 1), last].filter(Boolean).join(' ');
  if (initialled.length <= CARDHOLDER_NAME_MAX) return initialled;
  const cut = initialled.slice(0, CARDHOLDER_NAME_MAX);
  const lastSpace = cut.lastIndexOf(' ');
  return (lastSpace > 0 ? cut.slice(0, lastSpace) : cut).trim();
}
