// The e-mail a volunteer gets once they have agreed to give up their seat: what was agreed, and the new flight.
import { formatLocalDateTime, formatMoneyMinor, joinNames } from './format';
import { assertFlightRef, assertPnr, assertStation, cleanList, flightWords, type FlightRef, type NoticeStation } from './flight-words';
import { renderNotice, type Block, type Notice } from './notice';

export interface VolunteerConfirmationInput {
  station: NoticeStation;
  flight: FlightRef & { scheduledDeparture: Date };
  pnr: string;
  passengerNames: readonly string[];
  /** What was agreed for everyone named, in minor units. */
  agreedTotal: { amountMinor: number; currency: string };
  /** Given on top of the amount, e.g. "meal voucher". */
  extras?: readonly string[];
  /** The conditions of any travel credit, as the station's policy words them. */
  voucherRestrictions?: readonly string[];
  /** null when the new flight is not booked yet. */
  rebooking: (FlightRef & { departure: Date; arrival: Date }) | null;
}

export function volunteerConfirmation(input: VolunteerConfirmationInput): Notice {
  assertStation('station', input.station);
  assertFlightRef('flight', input.flight);
  assertPnr('pnr', input.pnr);
  const zone = input.station.timeZone;
  const names = joinNames('passengerNames', input.passengerNames);
  const amount = formatMoneyMinor('agreedTotal', input.agreedTotal);
  const departure = formatLocalDateTime('flight.scheduledDeparture', input.flight.scheduledDeparture, zone);
  const extras = cleanList(input.extras);
  const restrictions = cleanList(input.voucherRestrictions);
  const several = input.passengerNames.length > 1;

  const blocks: Block[] = [
    { kind: 'paragraph', text: `Dear ${names},` },
    {
      kind: 'paragraph',
      text: `Thank you for agreeing to give up your ${several ? 'seats' : 'seat'} on flight ${flightWords(input.flight)}, ` +
        `scheduled to leave ${input.station.name} (${input.station.iata}) on ${departure}. This message confirms what was agreed.`,
    },
    {
      kind: 'facts',
      rows: [
        ['Booking reference', input.pnr],
        [several ? 'Passengers' : 'Passenger', names],
        ['Agreed compensation', several ? `${amount} in total for the passengers named above` : amount],
        ...(extras.length > 0 ? [['Also provided', extras.join(', ')] as const] : []),
      ],
    },
  ];
  if (input.rebooking) {
    assertFlightRef('rebooking', input.rebooking);
    blocks.push({
      kind: 'facts',
      rows: [
        ['Your new flight', flightWords(input.rebooking)],
        ['Leaves', formatLocalDateTime('rebooking.departure', input.rebooking.departure, zone)],
        ['Arrives', formatLocalDateTime('rebooking.arrival', input.rebooking.arrival, zone)],
      ],
    });
  } else {
    blocks.push({ kind: 'paragraph', text: 'Your new flight is not booked yet. An agent will book it and you will receive a separate message with the details.' });
  }
  if (restrictions.length > 0) blocks.push({ kind: 'list', title: 'Conditions of the travel credit:', items: restrictions });
  blocks.push({ kind: 'paragraph', text: 'Please keep this message as your record of the agreement. If anything in it is not what you agreed, speak to an agent before you leave the airport.' });

  return renderNotice(`Confirmed: you gave up your ${several ? 'seats' : 'seat'} on ${input.flight.carrierCode} ${input.flight.flightNumber} (booking ${input.pnr})`, blocks);
}
