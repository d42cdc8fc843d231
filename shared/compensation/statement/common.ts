// Pieces every regime's statement shares: the input checks, the passenger's case, priorities, the optional
// choice and care, the accessible alternative and the caution, all in the passenger's language.
import { describeRules } from '../../denial/describe';
import { translator, type Translator } from '../../i18n/translate';
import { isLanguage } from '../../i18n/languages';
import { CARE_KINDS } from '../care-rules';
import { assertMoney } from '../money';
import type { Regime } from '../types';
import type { EnforcementBody, StatementInput, StatementSection } from './types';

export const CAUTION_HEADING = translator('en').t('statement.caution.heading');
export const CAUTION_TEXT = translator('en').t('statement.caution.body');

const REGIME_CURRENCY: Record<Regime, string> = { 'us-dot': 'USD', 'eu-261': 'EUR', 'uk-261': 'GBP', 'ca-appr': 'CAD' };

const blank = (value: unknown) => typeof value !== 'string' || value.trim() === '';

export function checkStatementInput(input: StatementInput): void {
  if (typeof input !== 'object' || input === null) throw new RangeError('input: expected an object');
  for (const field of ['carrierName', 'station'] as const) {
    if (blank(input[field])) throw new RangeError(`${field}: expected a non-empty string`);
  }
  for (const field of ['name', 'pnr'] as const) {
    if (blank(input.passenger?.[field])) throw new RangeError(`passenger.${field}: expected a non-empty string`);
  }
  for (const field of ['number', 'date', 'origin', 'destination'] as const) {
    if (blank(input.flight?.[field])) throw new RangeError(`flight.${field}: expected a non-empty string`);
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
  if (input.language !== undefined && !isLanguage(input.language)) {
    throw new RangeError(`language: expected one of en, fr, es, de, it, got ${JSON.stringify(input.language)}`);
  }
  checkRegimeFields(input);
  checkChoiceAndCare(input);
}

/** What each rule's statement cannot go out without, named by field. */
function checkRegimeFields(input: StatementInput): void {
  if (input.regime === 'us-dot' && (!Array.isArray(input.priorityRules) || input.priorityRules.length === 0)) {
    throw new RangeError('priorityRules: 14 CFR 250.9(b) requires the carrier\'s boarding priority rules in the statement');
  }
  const body = input.enforcementBody;
  if (body === undefined) return;
  if (blank(body.name)) throw new RangeError('enforcementBody.name: expected the enforcement body\'s name');
  if ((input.regime === 'eu-261' || input.regime === 'uk-261') && [body.website, body.email, body.phone, body.address].every(blank)) {
    throw new RangeError('enforcementBody.website: Art. 14(2) needs the enforcement body\'s contact details (website, e-mail, telephone or address)');
  }
}

function checkChoiceAndCare(input: StatementInput): void {
  if (input.choice !== undefined && input.choice !== null) {
    if (blank(input.choice.kind)) throw new RangeError('choice.kind: expected the remedy the passenger chose');
    if (blank(input.choice.detail)) throw new RangeError('choice.detail: expected what the choice means for the passenger');
  }
  (input.care ?? []).forEach((item, index) => {
    if (!(CARE_KINDS as readonly string[]).includes(item.kind)) throw new RangeError(`care[${index}].kind: expected one of ${CARE_KINDS.join(', ')}`);
    if (blank(item.description)) throw new RangeError(`care[${index}].description: expected what was given`);
    if (item.amountMinor !== undefined || item.currency !== undefined) {
      assertMoney(`care[${index}]`, { amountMinor: item.amountMinor, currency: item.currency });
    }
  });
}

export function translatorFor(input: StatementInput): Translator {
  return translator(input.language ?? 'en');
}

export function money(tr: Translator, input: StatementInput, amountMinor: number): string {
  return tr.money('compensation', { amountMinor, currency: input.compensation.currency });
}

export function subjectLine(tr: Translator, input: StatementInput): string {
  return tr.t('statement.subject', { carrier: input.carrierName, flight: input.flight.number, date: input.flight.date });
}

export function yourCaseSection(tr: Translator, input: StatementInput): StatementSection {
  const { passenger, flight } = input;
  const lines = [
    tr.t('statement.case.passenger', { name: passenger.name, pnr: passenger.pnr }),
    ...(passenger.ticketNumber ? [tr.t('statement.case.ticket', { ticket: passenger.ticketNumber })] : []),
    tr.t('statement.case.flight', { flight: flight.number, date: flight.date, origin: flight.origin, destination: flight.destination }),
    ...(flight.scheduledArrival ? [tr.t('statement.case.scheduledArrival', { at: flight.scheduledArrival })] : []),
    tr.t('statement.case.issuedAt', { station: input.station }),
    // The rule engine explains its amount in English; other languages show the amount alone.
    `${tr.t('statement.case.compensation', { amount: money(tr, input, input.compensation.amountMinor) })}${tr.language === 'en' && input.compensation.explanation ? ` ${input.compensation.explanation}` : ''}`,
  ];
  return { id: 'case', heading: tr.t('statement.case.heading'), body: lines.join('\n') };
}

export function prioritiesSection(tr: Translator, input: StatementInput): StatementSection {
  const [volunteers, ...rest] = describeRules(input.priorityRules, input.regime, tr.language);
  return {
    id: 'priorities',
    heading: tr.t('statement.priorities.heading'),
    body: [volunteers, ...rest.map((line) => (/^\d+\. /.test(line) ? `- ${line}` : line))].join('\n'),
  };
}

export function alternateSection(tr: Translator, input: StatementInput): StatementSection {
  const alt = input.alternate;
  const body = alt === null
    ? tr.t('statement.alternate.none')
    : alt.destination
      ? tr.t('statement.alternate.bookedTo', { flight: alt.flightNumber, at: alt.plannedArrival, destination: alt.destination })
      : tr.t('statement.alternate.booked', { flight: alt.flightNumber, at: alt.plannedArrival });
  return { id: 'alternate', heading: tr.t('statement.alternate.heading'), body };
}

export function enforcementSection(tr: Translator, heading: string, body: EnforcementBody, lead: string): StatementSection {
  const lines = [lead, `- ${body.name}`];
  if (body.address) lines.push(`- ${tr.t('statement.contact.address', { value: body.address })}`);
  if (body.website) lines.push(`- ${tr.t('statement.contact.website', { value: body.website })}`);
  if (body.email) lines.push(`- ${tr.t('statement.contact.email', { value: body.email })}`);
  if (body.phone) lines.push(`- ${tr.t('statement.contact.phone', { value: body.phone })}`);
  return { id: 'enforcement', heading, body: lines.join('\n') };
}

/** ICU select keys cannot hold hyphens: the remedy words as the rules modules spell them, mapped. */
const CHOICE_SELECTOR: Record<string, string> = { refund: 'refund', 'refund-and-return': 'refundAndReturn', 'reroute-earliest': 'rerouteEarliest', 'reroute-later': 'rerouteLater', rebook: 'rebook' };

const CARE_SELECTOR: Record<string, string> = { meal: 'meal', refreshment: 'refreshment', hotel: 'hotel', transport: 'transport', communication: 'communication' };

/** "Your choice" and "Care given", when the desk recorded them. */
export function choiceAndCareSections(tr: Translator, input: StatementInput): StatementSection[] {
  const sections: StatementSection[] = [];
  if (input.choice) {
    const kind = CHOICE_SELECTOR[input.choice.kind] ?? 'other';
    sections.push({ id: 'choice', heading: tr.t('statement.choice.heading'), body: tr.t('statement.choice.line', { kind, detail: input.choice.detail }) });
  }
  if (input.care && input.care.length > 0) {
    // The kind is named in the passenger's language; the description stays in the agent's own words, as recorded.
    const items = input.care.map((item) => {
      const kind = CARE_SELECTOR[item.kind] ?? 'other';
      return `- ${item.amountMinor !== undefined && item.currency
        ? tr.t('statement.care.itemAmount', { kind, description: item.description, amount: tr.money('care', { amountMinor: item.amountMinor, currency: item.currency }) })
        : tr.t('statement.care.item', { kind, description: item.description })}`;
    });
    sections.push({ id: 'care-given', heading: tr.t('statement.care.heading'), body: [tr.t('statement.care.lead'), ...items].join('\n') });
  }
  return sections;
}

/** Closing sections of every statement: the accessible alternative (Art. 14(3) for the EU and UK) and the caution. */
export function closingSections(tr: Translator): StatementSection[] {
  return [
    { id: 'accessible', heading: tr.t('statement.accessible.heading'), body: tr.t('statement.accessible.body') },
    { id: 'caution', heading: tr.t('statement.caution.heading'), body: tr.t('statement.caution.body') },
  ];
}

export function compensationNotes(tr: Translator, input: StatementInput): string[] {
  // Notes come from the rule engine in English.
  return tr.language === 'en' ? [...input.compensation.notes] : [];
}
