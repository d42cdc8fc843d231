// What a passenger is owed for being placed in another cabin than the one booked, by the station's rule.
// Pure, so the percentages can be checked against the rule's text.
import { distanceBand, type DistanceBand } from '@shared/compensation/eu-uk-rules';
import type { RegimeCode } from '@shared/schemas/common';

/** Reg. (EC) 261/2004 Art. 10(2)(a)-(c) (and the retained UK text): share of the ticket price reimbursed. */
export const ART_10_PERCENT: Readonly<Record<DistanceBand, number>> = { a: 30, b: 50, c: 75 };

export interface CabinChangeFacts {
  regime: RegimeCode;
  direction: 'upgrade' | 'downgrade';
  /** The price of the ticket (Art. 10(2) reimburses a share of it). */
  ticketPriceMinor: number;
  /** The difference between the two cabins' fares, as the desk recorded it. */
  fareDifferenceMinor: number;
  /** Great-circle distance of the flight, and whether it is within the Community (EU/UK only). */
  distanceKm: number | null;
  intraCommunity: boolean;
}

export interface CabinChangeOwed {
  owedMinor: number;
  rule: string;
}

export function cabinChangeOwed(f: CabinChangeFacts): CabinChangeOwed {
  if (f.direction === 'upgrade') {
    const rule = f.regime === 'eu-261' || f.regime === 'uk-261' ? 'Art. 10(1): no supplementary payment may be asked for a higher class' : 'No charge for a higher class';
    return { owedMinor: 0, rule };
  }
  if (f.regime === 'eu-261' || f.regime === 'uk-261') {
    if (f.distanceKm === null) throw new RangeError('the flight’s distance is needed for the Art. 10(2) band');
    const band = distanceBand(f.distanceKm, f.intraCommunity);
    const pct = ART_10_PERCENT[band];
    // Half a minor unit rounds up: the passenger is never short-changed by rounding.
    return { owedMinor: Math.round((f.ticketPriceMinor * pct) / 100), rule: `Art. 10(2): ${pct} % of the ticket price (${Math.round(f.distanceKm)} km, band ${band})` };
  }
  if (f.regime === 'us-dot') return { owedMinor: f.fareDifferenceMinor, rule: '14 CFR 250.6(c): seated elsewhere at no extra charge; the fare difference refunded' };
  return { owedMinor: f.fareDifferenceMinor, rule: 'APPR: the fare difference for a lower class refunded (from memory)' };
}
