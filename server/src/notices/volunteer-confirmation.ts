// The e-mail a volunteer gets once they have agreed to give up their seat: what was agreed, and the new flight, in
// the booking's language.
import { translator, type Language } from '@shared/i18n';
import { joinNames } from './format';
import { assertFlightRef, assertPnr, assertStation, cleanList, designator, type FlightRef, type NoticeStation } from './flight-words';
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
  /** The booking's language; English when absent. */
  language?: Language;
}

export function volunteerConfirmation(input: VolunteerConfirmationInput): Notice {
  assertStation('station', input.station);
  assertFlightRef('flight', input.flight);
  assertPnr('pnr', input.pnr);
  const tr = translator(input.language ?? 'en');
  const zone = input.station.timeZone;
  joinNames('passengerNames', input.passengerNames);
  const names = tr.list(input.passengerNames.map((n) => n.trim()));
  const amount = tr.money('agreedTotal', input.agreedTotal);
  const departure = tr.dateTime('flight.scheduledDeparture', input.flight.scheduledDeparture, zone);
  const extras = cleanList(input.extras);
  const restrictions = cleanList(input.voucherRestrictions);
  const count = input.passengerNames.length;
  const words = (flight: FlightRef) => tr.t('notice.flightWords', { flight: designator(flight), origin: flight.origin, destination: flight.destination });

  const blocks: Block[] = [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names }) },
    {
      kind: 'paragraph',
      text: tr.t('notice.volunteer.intro', { count, flight: words(input.flight), station: input.station.name, iata: input.station.iata, at: departure }),
    },
    {
      kind: 'facts',
      rows: [
        [tr.t('notice.pnr'), input.pnr],
        [tr.t('notice.volunteer.passengers', { count }), names],
        [tr.t('notice.volunteer.agreed'), count > 1 ? tr.t('notice.volunteer.agreedTotal', { amount }) : amount],
        ...(extras.length > 0 ? [[tr.t('notice.volunteer.extras'), extras.join(', ')] as const] : []),
      ],
    },
  ];
  if (input.rebooking) {
    assertFlightRef('rebooking', input.rebooking);
    blocks.push({
      kind: 'facts',
      rows: [
        [tr.t('notice.volunteer.newFlight'), words(input.rebooking)],
        [tr.t('notice.leaves'), tr.dateTime('rebooking.departure', input.rebooking.departure, zone)],
        [tr.t('notice.arrives'), tr.dateTime('rebooking.arrival', input.rebooking.arrival, zone)],
      ],
    });
  } else {
    blocks.push({ kind: 'paragraph', text: tr.t('notice.volunteer.notBooked') });
  }
  if (restrictions.length > 0) blocks.push({ kind: 'list', title: tr.t('notice.volunteer.conditions'), items: restrictions });
  blocks.push({ kind: 'paragraph', text: tr.t('notice.volunteer.keep') });

  return renderNotice(tr.t('notice.volunteer.subject', { count, flight: designator(input.flight), pnr: input.pnr }), blocks, tr);
}
