// Stripe needs a billing address for every Issuing cardholder (stripe-node 23.1 CardholderCreateParams.billing).
// A passenger's home address is neither known nor needed for a card the carrier hands over at the airport, so the
// station's airport stands in: the carrier's passenger-services desk there (common practice for cards a business
// issues to people it pays).
import { findAirport } from '../../reference/airports';

export interface BillingAddress {
  line1: string;
  city: string;
  postal_code: string;
  country: string;
}

let countryCodes: Map<string, string> | null = null;

/** English country name -> ISO 3166-1 alpha-2, built once from the runtime's own region names (ICU). */
function countryCodeOf(name: string): string | undefined {
  if (!countryCodes) {
    countryCodes = new Map();
    const names = new Intl.DisplayNames(['en'], { type: 'region' });
    for (let a = 65; a <= 90; a += 1) {
      for (let b = 65; b <= 90; b += 1) {
        const code = String.fromCharCode(a, b);
        const label = names.of(code);
        // The first code wins: GB before its alias UK, which is not an ISO 3166-1 code.
        if (label && label !== code && !countryCodes.has(label.toLowerCase())) countryCodes.set(label.toLowerCase(), code);
      }
    }
  }
  return countryCodes.get(name.toLowerCase());
}

/**
 * The postcode is not in the airport data; the IATA code marks the desk until the carrier configures its own
 * station addresses. The local stand-in only checks that one is present.
 */
export function stationBillingAddress(station: { iata: string; name: string }): BillingAddress {
  const airport = findAirport(station.iata);
  const country = airport ? countryCodeOf(airport.country) : undefined;
  if (!airport || !country) {
    throw new Error(`No billing address for station ${station.iata}: its airport or country is not in the reference data.`);
  }
  return {
    line1: `Passenger services, ${airport.name}`.slice(0, 200),
    city: airport.city || station.name,
    postal_code: station.iata,
    country,
  };
}
