// The passenger list's columns: what each shows, how it sorts, and how the filters apply to it.
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  globalFilteringFeature,
  rowSortingFeature,
  sortFn_text,
  tableFeatures,
} from '@tanstack/react-table';
import type { DeskPassenger } from '@shared/schemas/flight-desk';
import { formatMoney, formatPercent, formatTime } from '../../../lib/format';
import { matchesCabin, matchesConnection, matchesSsr, matchesStatus } from '../model/passenger-filters';
import { connectionMinutes } from '../model/time';
import { PASSENGER_STATUS, ssrWords, type PassengerStatus } from '../model/words';

export const passengerTableFeatures = tableFeatures({
  columnFilteringFeature,
  globalFilteringFeature,
  rowSortingFeature,
  filteredRowModel: createFilteredRowModel(),
  sortedRowModel: createSortedRowModel(),
  sortFns: { text: sortFn_text },
});

const helper = createColumnHelper<typeof passengerTableFeatures, DeskPassenger>();

/** Order of statuses when sorting: those still to come to the gate first. */
const STATUS_RANK: Record<PassengerStatus, number> = { booked: 0, 'checked-in': 1, boarded: 2, offloaded: 3, cancelled: 4 };

/** Under this many minutes between the inbound landing and our departure, a connection is tight. */
const TIGHT_CONNECTION_MIN = 45;

export function passengerColumns({ timeZone, departureIso }: { timeZone: string; departureIso: string }) {
  return helper.columns([
    helper.accessor((p) => `${p.lastName} ${p.firstName}`, {
      id: 'name',
      header: 'Name',
      sortFn: 'text',
      enableColumnFilter: false,
      cell: ({ row: { original: p } }) => (
        <>
          <span className="font-bold">
            {p.lastName.toUpperCase()}, {p.firstName}
          </span>
          {(p.isChild || p.frequentFlyerTier) && (
            <span className="block text-sm text-ink-soft">
              {[p.isChild ? 'Child' : null, p.frequentFlyerTier ? `Frequent flyer: ${p.frequentFlyerTier}` : null].filter(Boolean).join(' · ')}
            </span>
          )}
        </>
      ),
    }),
    helper.accessor('pnr', {
      header: 'PNR',
      sortFn: 'text',
      enableColumnFilter: false,
      cell: ({ row: { original: p } }) => (
        <>
          <span className="font-mono text-lg font-bold tracking-wider">{p.pnr}</span>
          <span className="block text-sm text-ink-soft">{p.partySize > 1 ? `party of ${p.partySize}` : 'alone'}</span>
          {p.onward && p.onward.length > 0 && (
            <span className="block text-sm" aria-label={`Journey continues on ${p.onward.join(', ')}`}>
              then {p.onward.join(' · ')}
            </span>
          )}
        </>
      ),
    }),
    helper.accessor('cabin', {
      header: 'Cabin',
      filterFn: (row, _id, value: string) => matchesCabin(row.original, value),
      cell: (info) => <span className="text-lg font-bold">{info.getValue()}</span>,
    }),
    helper.accessor((p) => p.seat ?? '', {
      id: 'seat',
      header: 'Seat',
      sortFn: 'text',
      enableColumnFilter: false,
      cell: ({ row: { original: p } }) => (p.seat ? <span className="font-mono text-lg font-bold">{p.seat}</span> : <span className="text-sm text-ink-soft">none yet</span>),
    }),
    helper.accessor('fareMinor', {
      header: 'Fare',
      enableColumnFilter: false,
      cell: ({ row: { original: p } }) => (
        <>
          <span className="tabular-nums">{formatMoney(p.fareMinor, p.fareCurrency)}</span>
          <span className="block text-sm text-ink-soft">{p.fareType}</span>
        </>
      ),
    }),
    helper.accessor((p) => STATUS_RANK[p.status], {
      id: 'status',
      header: 'Status',
      filterFn: (row, _id, value) => matchesStatus(row.original, value),
      cell: ({ row: { original: p } }) => {
        const s = PASSENGER_STATUS[p.status];
        const at = p.boardedAt ?? p.checkedInAt;
        return (
          <span className={`font-bold ${s.cls}`}>
            <span aria-hidden>{s.icon} </span>
            {s.word}
            {at && (p.status === 'checked-in' || p.status === 'boarded') && <span className="block text-sm font-normal text-ink-soft">at {formatTime(at, timeZone)}</span>}
          </span>
        );
      },
    }),
    helper.accessor((p) => p.ssrCodes.join(' '), {
      id: 'ssr',
      header: 'SSR',
      sortFn: 'text',
      filterFn: (row, _id, value: string) => matchesSsr(row.original, value),
      cell: ({ row: { original: p } }) =>
        p.ssrCodes.length === 0 ? (
          <span className="text-ink-soft">—</span>
        ) : (
          <span className="flex flex-wrap gap-1">
            {p.ssrCodes.map((code) => (
              <abbr key={code} title={ssrWords(code)} className="rounded border-2 border-harbour px-1.5 font-mono font-bold text-harbour no-underline">
                {code}
              </abbr>
            ))}
          </span>
        ),
    }),
    helper.accessor((p) => (p.inboundEstimatedArrival ? new Date(p.inboundEstimatedArrival).getTime() : undefined), {
      id: 'connection',
      header: 'Connection',
      sortUndefined: 'last',
      filterFn: (row, _id, value) => matchesConnection(row.original, value),
      cell: ({ row: { original: p } }) => <Connection p={p} timeZone={timeZone} departureIso={departureIso} />,
    }),
    helper.accessor('showProbability', {
      header: 'Show odds',
      enableColumnFilter: false,
      cell: ({ row: { original: p } }) => (
        <>
          <span className="text-lg font-bold tabular-nums">{formatPercent(p.showProbability)}</span>
          <span className="block max-w-72 text-sm text-ink-soft">{p.why}</span>
        </>
      ),
    }),
  ]);
}

function Connection({ p, timeZone, departureIso }: { p: DeskPassenger; timeZone: string; departureIso: string }) {
  if (!p.inboundFlight) return <span className="text-ink-soft">Local</span>;
  if (!p.inboundEstimatedArrival) return <span className="font-bold">{p.inboundFlight}</span>;
  const spare = connectionMinutes(p.inboundEstimatedArrival, departureIso);
  const tight = spare < TIGHT_CONNECTION_MIN;
  return (
    <span>
      <span className="font-bold">{p.inboundFlight}</span> lands {formatTime(p.inboundEstimatedArrival, timeZone)}
      <span className={`block text-sm ${tight ? 'font-bold text-alert' : 'text-ink-soft'}`}>
        {tight && <span aria-hidden>▲ </span>}
        {spare < 0 ? `lands ${-spare} min after departure` : `${spare} min to connect`}
      </span>
    </span>
  );
}
