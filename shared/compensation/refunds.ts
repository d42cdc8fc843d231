// Refunds the rules add to compensation: a downgrade's reimbursement and the optional fees for services not
// received. Kept apart from compensation in the ledger and the reports.
import { BAND_B_MAX_KM, EXACTLY_3500_KM_POLICY } from './eu-uk-rules';
import { REGIMES, type Regime } from './types';
import { assertDistanceKm, assertOptionalBoolean } from './validation';

export interface DowngradeInput {
  regime: Regime;
  /**
   * eu/uk: the price of the flight on which the passenger was downgraded (CJEU C-255/15 Mennens): where the ticket does
   * not show it, the share of the ticket price that flight's distance bears to the journey's; taxes and charges that do
   * not depend on the class booked are left out.
   */
  ticketPriceMinor: number;
  currency: string;
  distanceKm: number;
  /**
   * Intra-Community as Art. 10(2)(b) reads it: false for a flight between the European territory of the Member States
   * and a French overseas department, which point (c) reimburses at 75 % (unlike Art. 7).
   */
  intraCommunity?: boolean;
  /** us-dot / ca-appr: the fare of the lower class on that flight; the refund is the difference. */
  lowerClassFareMinor?: number;
}

export interface Refund {
  amountMinor: number;
  currency: string;
  ruleRef: string;
}

const SHORT_KM = 1500;

function assertMinor(field: string, value: unknown): asserts value is number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 0) {
    throw new RangeError(`${field}: expected whole minor units, 0 or more, got ${JSON.stringify(value)}`);
  }
}

function assertCurrency(value: unknown): asserts value is string {
  if (typeof value !== 'string' || !/^[A-Z]{3}$/.test(value)) {
    throw new RangeError(`currency: expected an ISO 4217 code such as EUR, got ${JSON.stringify(value)}`);
  }
}

/** Art. 10(2) percentage by distance; 3,500 km itself follows the project's Art. 7(1) reading. */
function art10Percent(distanceKm: number, intra: boolean): { percent: number; point: string } {
  if (distanceKm <= SHORT_KM) return { percent: 30, point: '(a)' };
  if (intra || distanceKm <= BAND_B_MAX_KM) return { percent: 50, point: '(b)' };
  return { percent: 75, point: '(c)' };
}

/**
 * Reimbursement when a passenger flies in a lower class than the one paid. Fractions of a minor unit are rounded
 * up, in the passenger's favour (common practice, no outside source).
 */
export function downgradeRefund(input: DowngradeInput): Refund {
  if (typeof input !== 'object' || input === null) throw new RangeError('input: expected an object');
  if (!REGIMES.includes(input.regime)) throw new RangeError(`regime: unknown regime ${JSON.stringify(input.regime)}`);
  assertMinor('ticketPriceMinor', input.ticketPriceMinor);
  assertCurrency(input.currency);
  assertDistanceKm('distanceKm', input.distanceKm);
  assertOptionalBoolean('intraCommunity', input.intraCommunity);
  if (input.regime === 'eu-261' || input.regime === 'uk-261') {
    const { percent, point } = art10Percent(input.distanceKm, input.intraCommunity === true);
    const base = input.regime === 'eu-261' ? 'Reg. (EC) 261/2004' : 'Retained Reg. 261/2004 (UK)';
    const edge = !input.intraCommunity && input.distanceKm === BAND_B_MAX_KM ? `; ${EXACTLY_3500_KM_POLICY}` : '';
    return { amountMinor: Math.ceil((input.ticketPriceMinor * percent) / 100), currency: input.currency, ruleRef: `${base} Art. 10(2)${point}: ${percent} %${edge}` };
  }
  if (input.lowerClassFareMinor === undefined) {
    throw new RangeError('lowerClassFareMinor: required for us-dot and ca-appr; the refund is the difference between the class paid and the class flown');
  }
  assertMinor('lowerClassFareMinor', input.lowerClassFareMinor);
  const amountMinor = Math.max(0, input.ticketPriceMinor - input.lowerClassFareMinor);
  const ruleRef = input.regime === 'us-dot'
    ? '14 CFR 250.6(c): seated in a section with a lower fare, an appropriate refund'
    : 'SOR/2019-150, lower class of service: refund of the price difference (section not verified)';
  return { amountMinor, currency: input.currency, ruleRef };
}

export interface OptionalFee {
  /** seat, bag, meal, wifi, lounge, priority… */
  kind: string;
  amountMinor: number;
  /** The passenger still received the service (e.g. the bag travelled with them on the alternate). */
  received: boolean;
}

export interface FeeRefund extends Refund {
  lines: { kind: string; amountMinor: number }[];
}

export const FEE_REFUND_RULES: Readonly<Record<Regime, string | null>> = {
  // §250.5(f) (paragraph from memory): optional fees for services not received refunded to passengers bumped;
  // 14 CFR 260.1(a) (89 FR 32832, 2024): fees for ancillary services paid for and not provided are refunded.
  'us-dot': '14 CFR 250.5(f), 260.1(a): optional fees for services paid for and not received refunded',
  // Reg. 261/2004 has no such rule; Art. 8 reimburses the whole ticket when the passenger chooses it.
  'eu-261': null,
  'uk-261': null,
  // Additional services paid for and not received are refunded (regulator's guide; section not verified).
  'ca-appr': 'SOR/2019-150: additional services paid for and not received refunded',
};

export function optionalFeeRefund(input: { regime: Regime; currency: string; fees: readonly OptionalFee[] }): FeeRefund {
  if (typeof input !== 'object' || input === null) throw new RangeError('input: expected an object');
  if (!REGIMES.includes(input.regime)) throw new RangeError(`regime: unknown regime ${JSON.stringify(input.regime)}`);
  assertCurrency(input.currency);
  if (!Array.isArray(input.fees)) throw new RangeError('fees: expected a list of { kind, amountMinor, received }');
  input.fees.forEach((fee, i) => {
    if (typeof fee?.kind !== 'string' || fee.kind.trim() === '') throw new RangeError(`fees[${i}].kind: expected a fee name`);
    assertMinor(`fees[${i}].amountMinor`, fee.amountMinor);
    if (typeof fee.received !== 'boolean') throw new RangeError(`fees[${i}].received: expected true or false`);
  });
  const rule = FEE_REFUND_RULES[input.regime];
  if (rule === null) {
    return { amountMinor: 0, currency: input.currency, ruleRef: 'Reg. 261/2004 sets no separate refund of optional fees (Art. 8 refunds the whole ticket when chosen)', lines: [] };
  }
  const lines = input.fees.filter((f) => !f.received && f.amountMinor > 0).map((f) => ({ kind: f.kind, amountMinor: f.amountMinor }));
  return { amountMinor: lines.reduce((s, l) => s + l.amountMinor, 0), currency: input.currency, ruleRef: rule, lines };
}
