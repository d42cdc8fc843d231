import type { Money } from './money';
import type { TicketKind } from './tickets';

export type Regime = 'us-dot' | 'eu-261' | 'uk-261' | 'ca-appr';

export const REGIMES: readonly Regime[] = ['us-dot', 'eu-261', 'uk-261', 'ca-appr'];

export interface CompensationInput {
  regime: Regime;
  /** ISO date of the denial: selects the amounts in force that day. */
  deniedOn: string;
  /** Default false. Volunteers agree their own benefits; no regulated amount is computed. */
  voluntary?: boolean;
  /** us-dot: one-way fare including mandatory taxes and fees, in USD. */
  oneWayFare?: Money;
  /** us-dot: foreign air transportation departing a US airport. */
  international?: boolean;
  /** Planned arrival of the alternate vs the original, in minutes; null when no alternate was offered. */
  plannedArrivalDelayMinutes: number | null;
  /** eu-261 / uk-261: great-circle distance to the final destination. */
  distanceKm?: number;
  /** eu-261: both ends in the EU; uk-261: a UK domestic flight. */
  intraCommunity?: boolean;
  /** eu-261 / uk-261 Art. 7(2): the carrier chooses to halve when the rerouting arrives close to schedule. */
  applyReroutingReduction?: boolean;
  /** A documented exemption code from EXEMPTIONS for the regime. */
  exemption?: string;
  /** us-dot: designed seating capacity; Part 250 covers aircraft of 30 seats or more. */
  aircraftSeats?: number;
  /** us-dot: for a zero-fare ticket, the lowest cash fare in the same class on that flight. */
  lowestCashFareSameClass?: Money;
  /**
   * How the ticket was paid for (default cash). us-dot: a frequent-flyer or free ticket is a zero-fare ticket priced at
   * the lowest cash fare in its class; eu-261 / uk-261: free and non-public reduced fares are outside the rule (Art. 3(3)).
   */
  ticket?: TicketKind;
  /** us-dot: optional fees (seat, bag) paid for services the passenger will not receive. */
  unusedOptionalFeesMinor?: number;
}

export interface CompensationResult {
  amountMinor: number;
  currency: string;
  /** Stable band code, e.g. 'us-200pct', 'eu-b', 'ca-6h-to-9h', 'exempt', 'volunteer'. */
  band: string;
  ruleRef: string;
  explanation: string;
  /** Further facts for the agent and the written statement. */
  notes: string[];
  /** Conditions a person must check before paying (band edges, assumptions). */
  reviewFlags: string[];
  /** eu-261 / uk-261: the Art. 7(1) amount before any Art. 7(2) reduction. */
  fullAmountMinor?: number;
  /** eu-261 / uk-261: true when the rerouting arrived close enough for the carrier to halve. */
  reducibleUnderArt7_2?: boolean;
  /** The rules table row used, for the audit trail. */
  rulesInForce: { effectiveFrom: string; source: string };
}
