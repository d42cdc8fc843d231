// Pieces every regime's statement shares: validation, the passenger's case, priorities and the caution.
import { describeRules } from '../../denial/describe';
import { assertMoney, formatMoney } from '../money';
import type { Regime } from '../types';
import type { EnforcementBody, StatementInput, StatementSection } from './types';

export const CAUTION_HEADING = 'Caution';
export const CAUTION_TEXT =
  'This statement was computed from the rules configured in this system. The applicable regulation, the carrier\'s contract of carriage and the carrier\'s compliance staff decide what is owed.';

const REGIME_CURRENCY: Record<Regime, string> = { 'us-dot': 'USD', 'eu-261': 'EUR', 'uk-261': 'GBP', 'ca-appr': 'CAD' };

export function checkStatementInput(input: StatementInput): void {
  if (typeof input !== 'object' || input === null) throw new RangeError('input: expected an object');
  for (const field of ['carrierName', 'station'] as const) {
    if (typeof input[field] !== 'string' || input[field].trim() === '') throw new RangeError(`${field}: expected a non-empty string`);
  }
  for (const field of ['name', 'pnr'] as const) {
    if (typeof input.passenger?.[field] !== 'string' || input.passenger[field].trim() === '') {
      throw new RangeError(`passenger.${field}: expected a non-empty string`);
    }
  }
  for (const field of ['number', 'date', 'origin', 'destination'] as const) {
    if (typeof input.flight?.[field] !== 'string' || input.flight[field].trim() === '') {
      throw new RangeError(`flight.${field}: expected a non-empty string`);
    }
  }
  if (input.alternate !== null && (typeof input.alternate?.flightNumber !== 'string' || typeof input.alternate.plannedArrival !== 'string')) {
    throw new RangeError('alternate: expected { flightNumber, plannedArrival } or null');
  }
  const expected = REGIME_CURRENCY[input.regime];
  if (!expected) throw new RangeError(`regime: unknown regime ${JSON.stringify(input.regime)}`);
  assertMoney('compensation', input.compensation);
  if (input.compensation.currency !== expected) {
    throw new RangeError(`compensation.currency: ${input.regime} pays in ${expected}, got ${input.compensation.currency}`);
  }
  if (input.voucherOffer !== undefined) {
    assertMoney('voucherOffer', { amountMinor: input.voucherOffer.valueMinor, currency: input.voucherOffer.currency });
  }
}

export function money(input: StatementInput, amountMinor: number): string {
  return formatMoney(amountMinor, input.compensation.currency);
}

export function subjectLine(input: StatementInput): string {
  return `Denied boarding on ${input.carrierName} flight ${input.flight.number} of ${input.flight.date}: your rights and compensation`;
}

export function yourCaseSection(input: StatementInput): StatementSection {
  const lines = [
    `Passenger: ${input.passenger.name}, booking reference ${input.passenger.pnr}${input.passenger.ticketNumber ? `, ticket ${input.passenger.ticketNumber}` : ''}.`,
    `Flight: ${input.flight.number} on ${input.flight.date}, ${input.flight.origin} to ${input.flight.destination}${input.flight.scheduledArrival ? `, scheduled to arrive ${input.flight.scheduledArrival}` : ''}.`,
    `Issued at: ${input.station}.`,
    `Compensation calculated: ${money(input, input.compensation.amountMinor)}. ${input.compensation.explanation}`,
  ];
  return { heading: 'Your case', body: lines.join('\n') };
}

export function prioritiesSection(input: StatementInput, heading: string): StatementSection {
  const [volunteers, ...rest] = describeRules(input.priorityRules, input.regime);
  return {
    heading,
    body: [volunteers, ...rest.map((line) => (/^\d+\. /.test(line) ? `- ${line}` : line))].join('\n'),
  };
}

export function alternateSection(input: StatementInput): StatementSection {
  const body = input.alternate === null
    ? 'No alternate transportation has been arranged for you yet.'
    : `You are booked on flight ${input.alternate.flightNumber}, planned to arrive ${input.alternate.plannedArrival}${input.alternate.destination ? ` at ${input.alternate.destination}` : ''}.`;
  return { heading: 'Alternate transportation', body };
}

export function enforcementSection(heading: string, body: EnforcementBody, lead: string): StatementSection {
  const lines = [lead, `- ${body.name}`];
  if (body.address) lines.push(`- Address: ${body.address}`);
  if (body.website) lines.push(`- Website: ${body.website}`);
  if (body.email) lines.push(`- E-mail: ${body.email}`);
  if (body.phone) lines.push(`- Telephone: ${body.phone}`);
  return { heading, body: lines.join('\n') };
}

export function cautionSection(): StatementSection {
  return { heading: CAUTION_HEADING, body: CAUTION_TEXT };
}

export function compensationNotes(input: StatementInput): string[] {
  return [...input.compensation.notes];
}
