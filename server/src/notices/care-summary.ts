// The e-mail a volunteer gets with what they chose (refund or re-routing) and the care they were given while they
// waited, in the booking's language. A denied passenger gets the written statement instead, which carries the same.
import { translator, type Language } from '@shared/i18n';
import { CARE_KINDS } from '@shared/compensation';
import type { ChoiceAndCare } from '../modules/care/for-statement';
import { assertFlightRef, assertPnr, assertStation, designator, type FlightRef, type NoticeStation } from './flight-words';
import { renderNotice, type Block, type Notice } from './notice';

export interface CareSummaryInput {
  station: NoticeStation;
  flight: FlightRef;
  pnr: string;
  passengerName: string;
  choice: ChoiceAndCare['choice'];
  care: ChoiceAndCare['care'];
  /** The booking's language; English when absent. */
  language?: Language;
}

/** ICU select keys cannot hold hyphens. */
const CHOICE_SELECTOR: Record<string, string> = { refund: 'refund', 'refund-and-return': 'refundAndReturn', 'reroute-earliest': 'rerouteEarliest', 'reroute-later': 'rerouteLater' };

export function careSummaryNotice(input: CareSummaryInput): Notice {
  assertStation('station', input.station);
  assertFlightRef('flight', input.flight);
  assertPnr('pnr', input.pnr);
  if (input.passengerName.trim() === '') throw new RangeError('passengerName: must not be blank');
  if (!input.choice && input.care.length === 0) throw new RangeError('care: a summary needs the passenger’s choice or some care given');
  input.care.forEach((item, i) => {
    if (!(CARE_KINDS as readonly string[]).includes(item.kind)) throw new RangeError(`care[${i}].kind: expected one of ${CARE_KINDS.join(', ')}`);
    if (item.description.trim() === '') throw new RangeError(`care[${i}].description: must not be blank`);
  });
  const tr = translator(input.language ?? 'en');
  const flight = tr.t('notice.flightWords', { flight: designator(input.flight), origin: input.flight.origin, destination: input.flight.destination });
  const blocks: Block[] = [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names: input.passengerName.trim() }) },
    { kind: 'paragraph', text: tr.t('notice.care.intro', { flight }) },
    { kind: 'facts', rows: [[tr.t('notice.pnr'), input.pnr]] },
  ];
  if (input.choice) {
    blocks.push({ kind: 'list', title: tr.t('statement.choice.heading'), items: [tr.t('statement.choice.line', { kind: CHOICE_SELECTOR[input.choice.kind] ?? 'other', detail: input.choice.detail })] });
  }
  if (input.care.length) {
    blocks.push({
      kind: 'list', title: tr.t('statement.care.lead'),
      items: input.care.map((item) => (item.amountMinor !== undefined && item.currency
        ? tr.t('statement.care.itemAmount', { kind: item.kind, description: item.description, amount: tr.money(`care.amountMinor`, { amountMinor: item.amountMinor, currency: item.currency }) })
        : tr.t('statement.care.item', { kind: item.kind, description: item.description }))),
    });
  }
  blocks.push({ kind: 'paragraph', text: tr.t('notice.care.keep') });
  return renderNotice(tr.t('notice.care.subject', { flight: designator(input.flight), pnr: input.pnr }), blocks, tr);
}
