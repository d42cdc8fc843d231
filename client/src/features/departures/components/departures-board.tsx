import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import type { DepartureRow } from '@shared/schemas/flights';
import { formatTime } from '../../../lib/format';
import { useNow } from '../../../lib/use-now';
import { departuresQueryOptions } from '../api/departures';
import { useStationLive } from '../api/use-station-live';
import { LiveStatus } from './live-status';
import { RiskBadge } from './risk-badge';

type SortKey = 'scheduledDeparture' | 'pOversale' | 'bookings';

const STATE_WORDS: Record<DepartureRow['state'], string> = {
  scheduled: 'Scheduled',
  'check-in-open': 'Check-in open',
  boarding: 'Boarding',
  closed: 'Closed',
  departed: 'Departed',
  cancelled: 'Cancelled',
};

export function DeparturesBoard({ stationId, timeZone }: { stationId: number; timeZone: string }) {
  const { data, isPending, error, dataUpdatedAt } = useQuery(departuresQueryOptions(stationId));
  const joined = useStationLive(stationId);
  const [sort, setSort] = useState<SortKey>('scheduledDeparture');
  const now = useNow();

  const rows = useMemo(() => {
    const list = [...(data?.flights ?? [])];
    // Next departures first: flights already gone drop to the end unless sorting by something else.
    if (sort === 'scheduledDeparture') {
      return list.sort((a, b) => {
        const ga = new Date(a.scheduledDeparture).getTime() < now - 10 * 60_000 ? 1 : 0;
        const gb = new Date(b.scheduledDeparture).getTime() < now - 10 * 60_000 ? 1 : 0;
        return ga - gb || a.scheduledDeparture.localeCompare(b.scheduledDeparture);
      });
    }
    return list.sort((a, b) => Number(b[sort] ?? -1) - Number(a[sort] ?? -1));
  }, [data, sort, now]);

  const live = (
    <div className="mb-3 flex justify-end">
      <LiveStatus joined={joined} updatedAt={dataUpdatedAt} timeZone={timeZone} />
    </div>
  );
  if (isPending) return <p className="text-ink-soft">Loading departures…</p>;
  if (error) return <p role="alert" className="text-alert">{error.message}</p>;
  if (!rows.length) {
    return (
      <>
        {live}
        <p>No departures in the next day at this station.</p>
      </>
    );
  }

  const header = (key: SortKey | null, label: string) => (
    <th scope="col" className="px-3 py-2 text-left" aria-sort={key && sort === key ? 'descending' : undefined}>
      {key ? (
        <button type="button" className="font-bold underline-offset-2 hover:underline" onClick={() => setSort(key)}>
          {label}
          {sort === key ? ' ▾' : ''}
        </button>
      ) : (
        label
      )}
    </th>
  );

  return (
    <>
      {live}
      <div className="overflow-x-auto rounded-lg border-2 border-line bg-card">
        <table className="w-full text-base">
          <caption className="sr-only">Departures, sortable by departure time, oversale odds and bookings</caption>
          <thead className="bg-harbour-soft">
            <tr>
              {header(null, 'Flight')}
              {header('scheduledDeparture', 'Departs')}
              {header(null, 'To')}
              {header(null, 'Gate')}
              {header(null, 'State')}
              {header(null, 'Seats')}
              {header('bookings', 'Booked')}
              {header(null, 'Checked in')}
              {header(null, 'Boarded')}
              {header('pOversale', 'Oversale odds')}
              {header(null, 'Expected denials')}
            </tr>
          </thead>
          <tbody>
            {rows.map((f) => (
              <tr key={f.id} className={`border-t border-line ${f.state === 'departed' ? 'text-ink-soft' : ''}`}>
                <td className="px-3 py-2 font-bold">
                  <Link className="text-harbour underline" to={`/flights/${f.id}`}>
                    {f.carrierCode} {f.flightNumber}
                  </Link>
                </td>
                <td className="px-3 py-2 tabular-nums">{formatTime(f.scheduledDeparture, timeZone)}</td>
                <td className="px-3 py-2">{f.destination}</td>
                <td className="px-3 py-2">{f.gate ?? '—'}</td>
                <td className="px-3 py-2">{STATE_WORDS[f.state]}</td>
                <td className="px-3 py-2 tabular-nums">{f.seats}</td>
                <td className={`px-3 py-2 tabular-nums ${f.bookings > f.seats ? 'font-bold' : ''}`}>
                  {f.bookings}
                  {f.bookings > f.seats && <span className="sr-only"> (more bookings than seats)</span>}
                </td>
                <td className="px-3 py-2 tabular-nums" data-testid={`checked-in-${f.id}`}>{f.checkedIn}</td>
                <td className="px-3 py-2 tabular-nums">{f.boarded}</td>
                <td className="px-3 py-2">{f.state === 'departed' ? '—' : <RiskBadge p={f.pOversale} />}</td>
                <td className="px-3 py-2 tabular-nums">{f.expectedDenied === null || f.state === 'departed' ? '—' : f.expectedDenied.toFixed(1)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
