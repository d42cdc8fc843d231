// 14 CFR Part 250 amounts for an involuntary denial from an oversold flight.
import { assertMinorAmount, assertMoney, formatMoney, type Money } from './money';
import type { CompensationInput, CompensationResult } from './types';
import { isZeroFareTicket } from './tickets';
import { findExemption } from './exemptions';
import { formatMinutes, rowInForce } from './validation';
import {
  US_DBC_CAPS,
  US_DELAY_BANDS,
  US_MIN_SEATS_IN_SCOPE,
  US_WEIGHT_BALANCE_MAX_SEATS,
} from './us-dot-rules';

const CURRENCY = 'USD';

export function usDotCompensation(input: CompensationInput, deniedOn: string): CompensationResult {
  const row = rowInForce(US_DBC_CAPS, deniedOn, 'us-dot');
  const rulesInForce = { effectiveFrom: row.effectiveFrom, source: row.source };
  const fare = validatedFare(input);
  const seats = validatedSeats(input.aircraftSeats);
  const notes = commonNotes(input);
  const reviewFlags: string[] = [];
  const base = { currency: CURRENCY, notes, reviewFlags, rulesInForce };
  const delay = input.plannedArrivalDelayMinutes;
  const bands = input.international ? US_DELAY_BANDS.international : US_DELAY_BANDS.domestic;
  const scope = input.international ? 'foreign air transportation from a US airport' : 'domestic';
  // Every given input is checked before scope is decided: a bad value is an error on any aircraft.
  if (input.lowestCashFareSameClass !== undefined) validatedLowestCashFare(input.lowestCashFareSameClass);
  if (input.exemption !== undefined) checkExemptionConsistency(input.exemption, seats, delay, bands.noneUpTo);

  if (seats !== undefined && seats < US_MIN_SEATS_IN_SCOPE) {
    return {
      ...base,
      amountMinor: 0,
      band: 'out-of-scope',
      ruleRef: '14 CFR 250.2',
      explanation: `Aircraft of ${seats} seats: Part 250 covers only aircraft of ${US_MIN_SEATS_IN_SCOPE} seats or more, so no denied boarding compensation is set by it.`,
    };
  }
  if (seats === undefined) {
    reviewFlags.push(`Aircraft seat count not given: assumed ${US_MIN_SEATS_IN_SCOPE} seats or more (14 CFR 250.2).`);
  }

  if (input.exemption !== undefined) {
    const rule = findExemption('us-dot', input.exemption);
    return { ...base, amountMinor: 0, band: 'exempt', ruleRef: rule.ruleRef, explanation: `Not eligible: ${rule.summary}.` };
  }

  if (delay !== null && delay <= bands.noneUpTo) {
    return {
      ...base,
      amountMinor: 0,
      band: 'us-none-within-1h',
      ruleRef: `${bands.ruleRef}(1); 14 CFR 250.6(d)`,
      explanation: `The alternate is planned to arrive ${formatMinutes(delay)} after the original flight, not later than 1 h: no compensation is due.`,
    };
  }

  const baseFare = fareForCompensation(input, fare);
  const fourHundred = delay === null || delay >= bands.fourHundredFrom;
  const percent = fourHundred ? 400 : 200;
  const capMinor = fourHundred ? row.domestic400CapMinor : row.domestic200CapMinor;
  const uncapped = baseFare.amountMinor * (percent / 100);
  const amountMinor = Math.min(uncapped, capMinor);
  const timing = delay === null
    ? 'No alternate transportation was offered'
    : `The alternate is planned to arrive ${formatMinutes(delay)} after the original flight (${scope}: ${fourHundred ? `${bands.fourHundredFrom / 60} h or more` : `more than 1 h and less than ${bands.fourHundredFrom / 60} h`})`;
  const capText = amountMinor < uncapped ? `, capped at ${formatMoney(capMinor, CURRENCY)}` : ` (cap ${formatMoney(capMinor, CURRENCY)})`;
  return {
    ...base,
    amountMinor,
    band: fourHundred ? 'us-400pct' : 'us-200pct',
    ruleRef: `${bands.ruleRef}(${fourHundred ? 3 : 2})`,
    explanation: `${timing}: ${percent}% of the one-way fare ${formatMoney(baseFare.amountMinor, CURRENCY)}${baseFare.zeroFare ? ' (lowest cash fare in the same class, zero-fare ticket)' : ''} = ${formatMoney(uncapped, CURRENCY)}${capText}. Caps in force from ${row.effectiveFrom}: ${row.source}.`,
  };
}

function validatedFare(input: CompensationInput): Money {
  if (input.oneWayFare === undefined) {
    throw new RangeError('oneWayFare: required for an involuntary us-dot denial (one-way fare including mandatory taxes and fees, 14 CFR 250.5(d))');
  }
  assertMoney('oneWayFare', input.oneWayFare);
  if (input.oneWayFare.currency !== CURRENCY) {
    throw new RangeError(`oneWayFare.currency: Part 250 caps are in USD; convert the fare to USD first (got ${input.oneWayFare.currency})`);
  }
  return input.oneWayFare;
}

function validatedSeats(seats: unknown): number | undefined {
  if (seats === undefined) return undefined;
  if (typeof seats !== 'number' || !Number.isSafeInteger(seats) || seats < 1) {
    throw new RangeError(`aircraftSeats: expected a whole number of seats, 1 or more, got ${JSON.stringify(seats)}`);
  }
  return seats;
}

function validatedLowestCashFare(lowest: unknown): Money {
  assertMoney('lowestCashFareSameClass', lowest);
  if (lowest.currency !== CURRENCY) {
    throw new RangeError(`lowestCashFareSameClass.currency: expected USD, got ${lowest.currency}`);
  }
  if (lowest.amountMinor <= 0) throw new RangeError('lowestCashFareSameClass.amountMinor: a cash fare is more than 0');
  return lowest;
}

/**
 * A ticket bought with miles, or given free, is a zero-fare ticket even when taxes were paid in cash: its fare is the
 * lowest cash fare in the same class on that flight (14 CFR 250.1 "zero fare ticket"; 250.5(d)).
 */
function fareForCompensation(input: CompensationInput, fare: Money): { amountMinor: number; zeroFare: boolean } {
  if (!isZeroFareTicket(input.ticket, fare.amountMinor)) return { amountMinor: fare.amountMinor, zeroFare: false };
  if (input.lowestCashFareSameClass === undefined) {
    throw new RangeError('lowestCashFareSameClass: required for a zero-fare ticket (miles, free or a fare of 0), 14 CFR 250.5(d)');
  }
  return { amountMinor: validatedLowestCashFare(input.lowestCashFareSameClass).amountMinor, zeroFare: true };
}

function checkExemptionConsistency(code: string, seats: number | undefined, delay: number | null, noneUpTo: number): void {
  if (code === 'us-weight-balance' && (seats === undefined || seats > US_WEIGHT_BALANCE_MAX_SEATS)) {
    throw new RangeError(`exemption: the weight/balance exception needs aircraftSeats of ${US_WEIGHT_BALANCE_MAX_SEATS} or fewer (14 CFR 250.6(b))`);
  }
  if (code === 'us-alternate-within-1h' && (delay === null || delay > noneUpTo)) {
    throw new RangeError('exemption: us-alternate-within-1h contradicts plannedArrivalDelayMinutes (must be 60 or less, 14 CFR 250.6(d))');
  }
}

function commonNotes(input: CompensationInput): string[] {
  const notes = ['The carrier may pay more than this minimum (14 CFR 250.5(g)).'];
  if (input.unusedOptionalFeesMinor !== undefined) {
    assertMinorAmount('unusedOptionalFeesMinor', input.unusedOptionalFeesMinor);
    if (input.unusedOptionalFeesMinor > 0) {
      notes.push(`Refund ${formatMoney(input.unusedOptionalFeesMinor, CURRENCY)} of optional fees for services not received, in addition to compensation (14 CFR 250.5(f)).`);
    }
  }
  return notes;
}
