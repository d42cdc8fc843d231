// A volunteer's two e-mails: the written confirmation of what was agreed (sent when the agent accepts the offer)
// and the rebooking notice (sent when the seat on the new flight is held). Both say what is owed and how it will be
// paid; every time is in the station's zone with the zone named.
import { translator, type Language, type Translator } from '@shared/i18n';
import { joinNames } from '../../notices/format';
import { assertFlightRef, assertPnr, assertStation, cleanList, designator, type FlightRef, type NoticeStation } from '../../notices/flight-words';
import { renderNotice, type Block, type Notice } from '../../notices/notice';

export type PaymentForm = 'prepaid-card' | 'voucher';

export interface VolunteerAgreement {
  /** Agreed per passenger, in minor units; everyone named gets this amount. */
  perPassenger: { amountMinor: number; currency: string };
  extras: readonly string[];
  form: PaymentForm;
  /** Printed only when the form is a voucher: the conditions the volunteer agreed to. */
  voucherRestrictions: readonly string[];
}

export interface VolunteerNoticeInput {
  station: NoticeStation;
  flight: FlightRef & { scheduledDeparture: Date };
  pnr: string;
  passengerNames: readonly string[];
  agreement: VolunteerAgreement;
  /** The booking's language; English when absent. */
  language?: Language;
}

export interface RebookedNoticeInput extends VolunteerNoticeInput {
  newFlight: FlightRef & { departure: Date; arrival: Date };
  plannedArrivalDelayMinutes: number;
}

function checkCommon(input: VolunteerNoticeInput): Translator {
  assertStation('station', input.station);
  assertFlightRef('flight', input.flight);
  assertPnr('pnr', input.pnr);
  if (!['prepaid-card', 'voucher'].includes(input.agreement.form)) throw new RangeError(`agreement.form: expected prepaid-card or voucher, got ${JSON.stringify(input.agreement.form)}`);
  joinNames('passengerNames', input.passengerNames);
  return translator(input.language ?? 'en');
}

const namesOf = (tr: Translator, input: VolunteerNoticeInput) => tr.list(input.passengerNames.map((n) => n.trim()));
const flightWords = (tr: Translator, flight: FlightRef) => tr.t('notice.flightWords', { flight: designator(flight), origin: flight.origin, destination: flight.destination });

function amountWords(tr: Translator, input: VolunteerNoticeInput): string {
  const n = input.passengerNames.length;
  const each = tr.money('agreement.perPassenger', input.agreement.perPassenger);
  if (n === 1) return each;
  const total = tr.money('agreement total', { ...input.agreement.perPassenger, amountMinor: input.agreement.perPassenger.amountMinor * n });
  return tr.t('notice.volunteer.amountEach', { each, total });
}

/** What is owed and how it is paid: the same words in both e-mails, so they never disagree. */
function agreementBlocks(tr: Translator, input: VolunteerNoticeInput): Block[] {
  const extras = cleanList(input.agreement.extras);
  const voucher = input.agreement.form === 'voucher';
  const count = input.passengerNames.length;
  const blocks: Block[] = [{
    kind: 'facts',
    rows: [
      [tr.t('notice.pnr'), input.pnr],
      [tr.t('notice.volunteer.passengers', { count }), namesOf(tr, input)],
      [tr.t('notice.volunteer.agreed'), amountWords(tr, input)],
      ...(extras.length ? [[tr.t('notice.volunteer.extras'), tr.list(extras)] as const] : []),
      [tr.t('notice.volunteer.form'), tr.t(voucher ? 'notice.volunteer.formVoucher' : 'notice.volunteer.formCard')],
    ],
  }];
  if (voucher) {
    blocks.push({ kind: 'paragraph', text: tr.t('notice.volunteer.voucherAgreed') });
    const restrictions = cleanList(input.agreement.voucherRestrictions);
    if (restrictions.length) blocks.push({ kind: 'list', title: tr.t('notice.volunteer.voucherConditions'), items: restrictions });
  } else {
    blocks.push({ kind: 'paragraph', text: tr.t('notice.volunteer.cardOffer') });
  }
  return blocks;
}

/** Sent when the agent accepts the offer; `updated` when a common price later raised the amount. */
export function volunteerAgreementNotice(input: VolunteerNoticeInput & { updated?: boolean }): Notice {
  const tr = checkCommon(input);
  const count = input.passengerNames.length;
  const departure = tr.dateTime('flight.scheduledDeparture', input.flight.scheduledDeparture, input.station.timeZone);
  const blocks: Block[] = [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names: namesOf(tr, input) }) },
    {
      kind: 'paragraph',
      text: input.updated
        ? tr.t('notice.volunteer.updatedIntro', { flight: flightWords(tr, input.flight) })
        : tr.t('notice.volunteer.intro', { count, flight: flightWords(tr, input.flight), station: input.station.name, iata: input.station.iata, at: departure }),
    },
    ...agreementBlocks(tr, input),
    { kind: 'paragraph', text: tr.t('notice.volunteer.agentBooks') },
    { kind: 'paragraph', text: tr.t('notice.volunteer.keep') },
  ];
  const subject = input.updated
    ? tr.t('notice.volunteer.updatedSubject', { count, flight: designator(input.flight), pnr: input.pnr })
    : tr.t('notice.volunteer.subject', { count, flight: designator(input.flight), pnr: input.pnr });
  return renderNotice(subject, blocks, tr);
}

/** Sent when the seat on the new flight is held. */
export function volunteerRebookingNotice(input: RebookedNoticeInput): Notice {
  const tr = checkCommon(input);
  assertFlightRef('newFlight', input.newFlight);
  const zone = input.station.timeZone;
  const count = input.passengerNames.length;
  const late = input.plannedArrivalDelayMinutes;
  const blocks: Block[] = [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names: namesOf(tr, input) }) },
    { kind: 'paragraph', text: tr.t('notice.rebooking.intro', { flight: flightWords(tr, input.flight), reason: 'volunteered', count }) },
    {
      kind: 'facts',
      rows: [
        [tr.t('notice.rebooking.newFlight'), flightWords(tr, input.newFlight)],
        [tr.t('notice.leaves'), tr.dateTime('newFlight.departure', input.newFlight.departure, zone)],
        [tr.t('notice.arrives'), tr.dateTime('newFlight.arrival', input.newFlight.arrival, zone)],
        [tr.t('notice.rebooking.original'), tr.t('notice.rebooking.originalValue', { flight: designator(input.flight), at: tr.dateTime('flight.scheduledDeparture', input.flight.scheduledDeparture, zone) })],
      ],
    },
    { kind: 'paragraph', text: late > 0 ? tr.t('notice.rebooking.later', { duration: tr.duration(late) }) : tr.t('notice.volunteer.noLater') },
    { kind: 'paragraph', text: tr.t('notice.volunteer.owed') },
    ...agreementBlocks(tr, input),
    { kind: 'paragraph', text: tr.t('notice.rebooking.notSuit') },
  ];
  return renderNotice(tr.t('notice.rebooking.subject', { flight: designator(input.newFlight), destination: input.newFlight.destination, pnr: input.pnr }), blocks, tr);
}
