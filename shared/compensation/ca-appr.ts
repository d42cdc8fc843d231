// Canada's Air Passenger Protection Regulations (SOR/2019-150): denied boarding within the carrier's control.
import { formatMoney } from './money';
import type { CompensationInput, CompensationResult } from './types';
import { findExemption } from './exemptions';
import { assertWholeMinutes, formatMinutes, parseIsoDate, parseIsoDateTime, rowInForce } from './validation';

export type ApprBand = 'ca-under-6h' | 'ca-6h-to-9h' | 'ca-9h-or-more';

export interface ApprAmountRow {
  effectiveFrom: string;
  currency: string;
  under6hMinor: number;
  from6hUnder9hMinor: number;
  atLeast9hMinor: number;
  source: string;
}

export const APPR_DENIED_BOARDING_AMOUNTS: readonly ApprAmountRow[] = [
  {
    effectiveFrom: '2019-07-15',
    currency: 'CAD',
    under6hMinor: 90_000,
    from6hUnder9hMinor: 180_000,
    atLeast9hMinor: 240_000,
    // In-force date from memory; people read the citation only, provenance stays in this comment.
    source: 'SOR/2019-150 s. 20(1); denied boarding provisions in force 15 Jul 2019',
  },
];

export const APPR_PAYMENT_HOURS = 48;
const SIX_HOURS = 360;
const NINE_HOURS = 540;

const BAND_ORDER: readonly ApprBand[] = ['ca-under-6h', 'ca-6h-to-9h', 'ca-9h-or-more'];
const BAND_WORDS: Record<ApprBand, string> = {
  'ca-under-6h': 'arrival delay of less than 6 h',
  'ca-6h-to-9h': 'arrival delay of 6 h or more but less than 9 h',
  'ca-9h-or-more': 'arrival delay of 9 h or more',
};

export function apprBandFor(arrivalDelayMinutes: number): ApprBand {
  assertWholeMinutes('arrivalDelayMinutes', arrivalDelayMinutes);
  if (arrivalDelayMinutes < SIX_HOURS) return 'ca-under-6h';
  return arrivalDelayMinutes < NINE_HOURS ? 'ca-6h-to-9h' : 'ca-9h-or-more';
}

export function apprAmountMinor(row: ApprAmountRow, band: ApprBand): number {
  if (band === 'ca-under-6h') return row.under6hMinor;
  return band === 'ca-6h-to-9h' ? row.from6hUnder9hMinor : row.atLeast9hMinor;
}

export function apprCompensation(input: CompensationInput, deniedOn: string): CompensationResult {
  const row = rowInForce(APPR_DENIED_BOARDING_AMOUNTS, deniedOn, 'ca-appr');
  const rulesInForce = { effectiveFrom: row.effectiveFrom, source: row.source };
  // Section numbers of both notes from memory (kept here, not in the text people read).
  const notes = [
    `Pay when the passenger is told of the denial, or within ${APPR_PAYMENT_HOURS} h; if paid later, give written confirmation of the amount (SOR/2019-150 s. 20).`,
    'If the actual arrival delay falls in a higher band, top up the difference (SOR/2019-150 s. 20).',
  ];
  const reviewFlags: string[] = [];
  if (input.exemption !== undefined) {
    const rule = findExemption('ca-appr', input.exemption);
    return { amountMinor: 0, currency: row.currency, band: 'exempt', ruleRef: rule.ruleRef, explanation: `Not eligible: ${rule.summary}.`, notes, reviewFlags, rulesInForce };
  }
  const delay = input.plannedArrivalDelayMinutes;
  const band = delay === null ? 'ca-9h-or-more' : apprBandFor(delay);
  if (delay === null) {
    reviewFlags.push('No alternate offered: the highest band is assumed; check whether the passenger chose a refund instead.');
  }
  const amountMinor = apprAmountMinor(row, band);
  const timing = delay === null ? 'No alternate transportation was offered' : `Planned arrival ${formatMinutes(delay)} after the original`;
  return {
    amountMinor,
    currency: row.currency,
    band,
    ruleRef: 'SOR/2019-150 s. 20(1)',
    explanation: `${timing}: ${formatMoney(amountMinor, row.currency)} for an ${BAND_WORDS[band]} at the destination on the ticket.`,
    notes,
    reviewFlags,
    rulesInForce,
  };
}

/** The latest moment to pay: 48 h after the denial. Returns an ISO 8601 UTC date-time. */
export function apprPaymentDeadline(deniedAt: string): string {
  const epochMs = parseIsoDateTime('deniedAt', deniedAt);
  return new Date(epochMs + APPR_PAYMENT_HOURS * 3_600_000).toISOString();
}

export interface ApprTopUp {
  paidBand: ApprBand;
  actualBand: ApprBand;
  paidMinor: number;
  dueMinor: number;
  topUpMinor: number;
  currency: string;
  explanation: string;
}

/**
 * The difference owed once the actual arrival delay is known. Never negative: a passenger who arrives
 * earlier than planned keeps what was paid.
 */
export function apprTopUp(paidBand: ApprBand, actualDelayMinutes: number, deniedOn?: string): ApprTopUp {
  if (!BAND_ORDER.includes(paidBand)) {
    throw new RangeError(`paidBand: expected one of ${BAND_ORDER.join(', ')}, got ${JSON.stringify(paidBand)}`);
  }
  assertWholeMinutes('actualDelayMinutes', actualDelayMinutes);
  const row = deniedOn === undefined
    ? APPR_DENIED_BOARDING_AMOUNTS[APPR_DENIED_BOARDING_AMOUNTS.length - 1]
    : rowInForce(APPR_DENIED_BOARDING_AMOUNTS, parseIsoDate('deniedOn', deniedOn), 'ca-appr');
  const actualBand = apprBandFor(actualDelayMinutes);
  const paidMinor = apprAmountMinor(row, paidBand);
  const actualMinor = apprAmountMinor(row, actualBand);
  const higher = BAND_ORDER.indexOf(actualBand) > BAND_ORDER.indexOf(paidBand);
  const dueMinor = higher ? actualMinor : paidMinor;
  const topUpMinor = dueMinor - paidMinor;
  const explanation = higher
    ? `Actual arrival delay ${formatMinutes(actualDelayMinutes)} is an ${BAND_WORDS[actualBand]}: ${formatMoney(actualMinor, row.currency)} is due, top up ${formatMoney(topUpMinor, row.currency)}.`
    : `Actual arrival delay ${formatMinutes(actualDelayMinutes)} does not reach a higher band: nothing more is due.`;
  return { paidBand, actualBand, paidMinor, dueMinor, topUpMinor, currency: row.currency, explanation };
}
