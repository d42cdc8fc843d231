// A volunteer's two e-mails: the written confirmation of what was agreed (sent when the agent accepts the offer)
// and the rebooking notice (sent when the seat on the new flight is held). Both say what is owed and how it will be
// paid; every time is in the station's zone with the zone named.
import { formatDuration, formatLocalDateTime, formatMoneyMinor, joinNames } from '../../notices/format';
import { assertFlightRef, assertPnr, assertStation, cleanList, designator, flightWords, type FlightRef, type NoticeStation } from '../../notices/flight-words';
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
}

export interface RebookedNoticeInput extends VolunteerNoticeInput {
  newFlight: FlightRef & { departure: Date; arrival: Date };
  plannedArrivalDelayMinutes: number;
}

const seatWord = (n: number) => (n > 1 ? 'seats' : 'seat');

function checkCommon(input: VolunteerNoticeInput) {
  assertStation('station', input.station);
  assertFlightRef('flight', input.flight);
  assertPnr('pnr', input.pnr);
  if (!['prepaid-card', 'voucher'].includes(input.agreement.form)) throw new RangeError(`agreement.form: expected prepaid-card or voucher, got ${JSON.stringify(input.agreement.form)}`);
}

function amountWords(input: VolunteerNoticeInput): string {
  const n = input.passengerNames.length;
  const each = formatMoneyMinor('agreement.perPassenger', input.agreement.perPassenger);
  if (n === 1) return each;
  const total = formatMoneyMinor('agreement total', { ...input.agreement.perPassenger, amountMinor: input.agreement.perPassenger.amountMinor * n });
  return `${each} per passenger, ${total} in total`;
}

/** What is owed and how it is paid: the same words in both e-mails, so they never disagree. */
function agreementBlocks(input: VolunteerNoticeInput, names: string): Block[] {
  const extras = cleanList(input.agreement.extras);
  const voucher = input.agreement.form === 'voucher';
  const blocks: Block[] = [{
    kind: 'facts',
    rows: [
      ['Booking reference', input.pnr],
      [input.passengerNames.length > 1 ? 'Passengers' : 'Passenger', names],
      ['Agreed compensation', amountWords(input)],
      ...(extras.length ? [['Also provided', extras.join(', ')] as const] : []),
      ['Form of payment', voucher ? 'Travel voucher, which you chose instead of cash' : 'Prepaid card, spendable at once like cash'],
    ],
  }];
  if (voucher) {
    blocks.push({ kind: 'paragraph', text: 'You agreed to a travel voucher after being told the amount you could have in cash instead.' });
    const restrictions = cleanList(input.agreement.voucherRestrictions);
    if (restrictions.length) blocks.push({ kind: 'list', title: 'Conditions of the travel voucher:', items: restrictions });
  } else {
    blocks.push({ kind: 'paragraph', text: 'You may be offered a travel voucher instead; you will be told its conditions first, and you receive the card unless you agree to the voucher.' });
  }
  return blocks;
}

/** Sent when the agent accepts the offer; `updated` when a common price later raised the amount. */
export function volunteerAgreementNotice(input: VolunteerNoticeInput & { updated?: boolean }): Notice {
  checkCommon(input);
  const names = joinNames('passengerNames', input.passengerNames);
  const seats = seatWord(input.passengerNames.length);
  const departure = formatLocalDateTime('flight.scheduledDeparture', input.flight.scheduledDeparture, input.station.timeZone);
  const blocks: Block[] = [
    { kind: 'paragraph', text: `Dear ${names},` },
    {
      kind: 'paragraph',
      text: input.updated
        ? `Everyone who gave up a seat on flight ${flightWords(input.flight)} is paid the same amount, and that amount has risen. This message replaces the amount in our earlier confirmation.`
        : `Thank you for agreeing to give up your ${seats} on flight ${flightWords(input.flight)}, scheduled to leave ${input.station.name} (${input.station.iata}) on ${departure}. This message confirms what was agreed.`,
    },
    ...agreementBlocks(input, names),
    { kind: 'paragraph', text: 'An agent will book your new flight; you will receive a separate message with its details.' },
    { kind: 'paragraph', text: 'Please keep this message as your record of the agreement. If anything in it is not what you agreed, speak to an agent before you leave the airport.' },
  ];
  const subject = input.updated
    ? `Updated: what you are owed for your ${seats} on ${designator(input.flight)} (booking ${input.pnr})`
    : `Confirmed: you gave up your ${seats} on ${designator(input.flight)} (booking ${input.pnr})`;
  return renderNotice(subject, blocks);
}

/** Sent when the seat on the new flight is held. */
export function volunteerRebookingNotice(input: RebookedNoticeInput): Notice {
  checkCommon(input);
  assertFlightRef('newFlight', input.newFlight);
  const zone = input.station.timeZone;
  const names = joinNames('passengerNames', input.passengerNames);
  const several = input.passengerNames.length > 1;
  const late = input.plannedArrivalDelayMinutes;
  const blocks: Block[] = [
    { kind: 'paragraph', text: `Dear ${names},` },
    {
      kind: 'paragraph',
      text: `You are no longer booked on flight ${flightWords(input.flight)}, because you agreed to give up your ${seatWord(input.passengerNames.length)}. We have booked ${several ? 'you all' : 'you'} on the flight below.`,
    },
    {
      kind: 'facts',
      rows: [
        ['New flight', flightWords(input.newFlight)],
        ['Leaves', formatLocalDateTime('newFlight.departure', input.newFlight.departure, zone)],
        ['Arrives', formatLocalDateTime('newFlight.arrival', input.newFlight.arrival, zone)],
        ['Original flight', `${designator(input.flight)}, scheduled to leave ${formatLocalDateTime('flight.scheduledDeparture', input.flight.scheduledDeparture, zone)}`],
      ],
    },
    { kind: 'paragraph', text: late > 0 ? `You are planned to arrive ${formatDuration(late)} later than on your original flight.` : 'You are planned to arrive no later than on your original flight.' },
    { kind: 'paragraph', text: 'What you are owed, and how it will be paid:' },
    ...agreementBlocks(input, names),
    { kind: 'paragraph', text: 'If this flight does not suit you, speak to an agent at the gate or the transfer desk before it leaves.' },
  ];
  return renderNotice(`Your new flight: ${designator(input.newFlight)} to ${input.newFlight.destination} (booking ${input.pnr})`, blocks);
}
