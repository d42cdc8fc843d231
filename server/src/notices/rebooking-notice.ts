// The e-mail that tells passengers which flight they are now booked on, and how much later they arrive, in the
// booking's language.
import { translator, type Language, type Translator } from '@shared/i18n';
import { joinNames, assertInstant } from './format';
import { assertFlightRef, assertPnr, assertStation, designator, type FlightRef, type NoticeStation } from './flight-words';
import { renderNotice, type Block, type Notice } from './notice';

export type RebookingReason = 'volunteered' | 'denied-boarding';

export interface RebookingNoticeInput {
  station: NoticeStation;
  pnr: string;
  passengerNames: readonly string[];
  reason: RebookingReason;
  originalFlight: FlightRef & { scheduledDeparture: Date; scheduledArrival: Date };
  newFlight: FlightRef & { departure: Date; arrival: Date };
  /** The booking's language; English when absent. */
  language?: Language;
}

const REASONS: readonly RebookingReason[] = ['volunteered', 'denied-boarding'];

export function rebookingNotice(input: RebookingNoticeInput): Notice {
  assertStation('station', input.station);
  assertPnr('pnr', input.pnr);
  assertFlightRef('originalFlight', input.originalFlight);
  assertFlightRef('newFlight', input.newFlight);
  assertInstant('originalFlight.scheduledArrival', input.originalFlight.scheduledArrival);
  assertInstant('newFlight.arrival', input.newFlight.arrival);
  if (!REASONS.includes(input.reason)) throw new RangeError(`reason: expected volunteered or denied-boarding, got ${JSON.stringify(input.reason)}`);
  const tr = translator(input.language ?? 'en');
  const zone = input.station.timeZone;
  joinNames('passengerNames', input.passengerNames);
  const names = tr.list(input.passengerNames.map((n) => n.trim()));
  const count = input.passengerNames.length;
  const lateMinutes = (input.newFlight.arrival.getTime() - input.originalFlight.scheduledArrival.getTime()) / 60_000;
  const words = (flight: FlightRef) => tr.t('notice.flightWords', { flight: designator(flight), origin: flight.origin, destination: flight.destination });

  const blocks: Block[] = [
    { kind: 'paragraph', text: tr.t('notice.greeting', { names }) },
    { kind: 'paragraph', text: tr.t('notice.rebooking.intro', { flight: words(input.originalFlight), reason: input.reason === 'volunteered' ? 'volunteered' : 'denied', count }) },
    {
      kind: 'facts',
      rows: [
        [tr.t('notice.pnr'), input.pnr],
        [tr.t('notice.rebooking.newFlight'), words(input.newFlight)],
        [tr.t('notice.leaves'), tr.dateTime('newFlight.departure', input.newFlight.departure, zone)],
        [tr.t('notice.arrives'), tr.dateTime('newFlight.arrival', input.newFlight.arrival, zone)],
        [tr.t('notice.rebooking.original'), tr.t('notice.rebooking.originalValue', {
          flight: designator(input.originalFlight), at: tr.dateTime('originalFlight.scheduledDeparture', input.originalFlight.scheduledDeparture, zone),
        })],
      ],
    },
    { kind: 'paragraph', text: arrivalWords(tr, lateMinutes) },
  ];
  if (input.reason === 'denied-boarding') blocks.push({ kind: 'paragraph', text: tr.t('notice.rebooking.statement') });
  blocks.push({ kind: 'paragraph', text: tr.t('notice.rebooking.notSuit') });

  const subject = tr.t('notice.rebooking.subject', { flight: designator(input.newFlight), destination: input.newFlight.destination, pnr: input.pnr });
  return renderNotice(subject, blocks, tr);
}

function arrivalWords(tr: Translator, lateMinutes: number): string {
  if (Math.round(lateMinutes) === 0) return tr.t('notice.rebooking.same');
  return tr.t(lateMinutes > 0 ? 'notice.rebooking.later' : 'notice.rebooking.earlier', { duration: tr.duration(lateMinutes) });
}
