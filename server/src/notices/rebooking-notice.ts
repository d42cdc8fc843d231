// The e-mail that tells passengers which flight they are now booked on, and how much later they arrive.
import { formatDuration, formatLocalDateTime, joinNames, assertInstant } from './format';
import { assertFlightRef, assertPnr, assertStation, designator, flightWords, type FlightRef, type NoticeStation } from './flight-words';
import { renderNotice, type Block, type Notice } from './notice';

export type RebookingReason = 'volunteered' | 'denied-boarding';

export interface RebookingNoticeInput {
  station: NoticeStation;
  pnr: string;
  passengerNames: readonly string[];
  reason: RebookingReason;
  originalFlight: FlightRef & { scheduledDeparture: Date; scheduledArrival: Date };
  newFlight: FlightRef & { departure: Date; arrival: Date };
}

const REASON_WORDS: Record<RebookingReason, (several: boolean) => string> = {
  volunteered: (several) => `you agreed to give up your ${several ? 'seats' : 'seat'}`,
  'denied-boarding': () => 'more passengers held confirmed bookings than the aircraft had seats, and you could not be carried on it',
};

export function rebookingNotice(input: RebookingNoticeInput): Notice {
  assertStation('station', input.station);
  assertPnr('pnr', input.pnr);
  assertFlightRef('originalFlight', input.originalFlight);
  assertFlightRef('newFlight', input.newFlight);
  assertInstant('originalFlight.scheduledArrival', input.originalFlight.scheduledArrival);
  assertInstant('newFlight.arrival', input.newFlight.arrival);
  if (!(input.reason in REASON_WORDS)) throw new RangeError(`reason: expected volunteered or denied-boarding, got ${JSON.stringify(input.reason)}`);
  const zone = input.station.timeZone;
  const names = joinNames('passengerNames', input.passengerNames);
  const several = input.passengerNames.length > 1;
  const lateMinutes = (input.newFlight.arrival.getTime() - input.originalFlight.scheduledArrival.getTime()) / 60_000;

  const blocks: Block[] = [
    { kind: 'paragraph', text: `Dear ${names},` },
    {
      kind: 'paragraph',
      text: `You are no longer booked on flight ${flightWords(input.originalFlight)}, because ${REASON_WORDS[input.reason](several)}. ` +
        `We have booked ${several ? 'you all' : 'you'} on the flight below.`,
    },
    {
      kind: 'facts',
      rows: [
        ['Booking reference', input.pnr],
        ['New flight', flightWords(input.newFlight)],
        ['Leaves', formatLocalDateTime('newFlight.departure', input.newFlight.departure, zone)],
        ['Arrives', formatLocalDateTime('newFlight.arrival', input.newFlight.arrival, zone)],
        ['Original flight', `${designator(input.originalFlight)}, scheduled to leave ${formatLocalDateTime('originalFlight.scheduledDeparture', input.originalFlight.scheduledDeparture, zone)}`],
      ],
    },
    { kind: 'paragraph', text: arrivalWords(lateMinutes) },
  ];
  if (input.reason === 'denied-boarding') {
    blocks.push({ kind: 'paragraph', text: 'You will also receive a written statement of your rights and of any compensation due.' });
  }
  blocks.push({ kind: 'paragraph', text: 'If this flight does not suit you, speak to an agent at the gate or the transfer desk before it leaves.' });

  return renderNotice(`Your new flight: ${designator(input.newFlight)} to ${input.newFlight.destination} (booking ${input.pnr})`, blocks);
}

function arrivalWords(lateMinutes: number): string {
  if (Math.round(lateMinutes) === 0) return 'You are planned to arrive at the same time as on your original flight.';
  const when = lateMinutes > 0 ? 'later' : 'earlier';
  return `You are planned to arrive ${formatDuration(lateMinutes)} ${when} than on your original flight.`;
}
