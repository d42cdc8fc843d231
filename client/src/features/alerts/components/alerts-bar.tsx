import { useEffect, useRef } from 'react';
import { Link } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { alertSoundOn, playChime } from '../../../lib/alert-sound';
import { setAlertCount } from '../../../lib/document-title';
import { alertsQueryOptions, useAcknowledgeAlert } from '../api/alerts';
import { useAlertsLive } from '../hooks/use-alerts-live';
import { AlertCard } from './alert-card';

/** A few on every screen; the rest wait on the full list, one link away. */
const SHOWN = 3;

/**
 * What reaches a busy agent or supervisor on whatever screen they are on: the alerts nobody has taken on yet, newest
 * first, each with its next step and its own button; their number in the tab title, so a console behind another
 * window still shows it; a chime for a rise, if the user turned it on. Live through the station's notices. On the
 * screens that show the full list, only the title and the chime remain (`showPanel` false).
 */
export function AlertsBar({ stationId, listPath, showPanel, linkFlights }: { stationId: number | null; listPath: string; showPanel: boolean; linkFlights: boolean }) {
  const { data } = useQuery(alertsQueryOptions(stationId ?? undefined));
  useAlertsLive(stationId);
  const acknowledge = useAcknowledgeAlert();
  const unseen = (data?.alerts ?? []).filter((a) => !a.acknowledgedAt && !a.resolvedAt);
  const count = unseen.length;
  const last = useRef<number | null>(null);
  useEffect(() => {
    setAlertCount(count);
    if (last.current !== null && count > last.current && alertSoundOn()) playChime();
    last.current = count;
  }, [count]);
  useEffect(() => () => setAlertCount(0), []);
  // Read out politely when the number changes, not on every refetch, and on the screens without the panel too.
  const spoken = <p className="sr-only" aria-live="polite" data-testid="alerts-spoken">{count ? `${count} ${count === 1 ? 'alert needs' : 'alerts need'} you` : ''}</p>;
  if (!showPanel || count === 0) return spoken;
  return (
    <>
    {spoken}
    <section aria-labelledby="alerts-bar-title" data-testid="alerts-bar" className="no-print border-b-4 border-alert bg-alert-soft">
      <div className="mx-auto max-w-7xl px-4 py-3">
        <div className="flex flex-wrap items-baseline gap-x-4">
          <h2 id="alerts-bar-title" className="text-lg font-bold text-alert">
            <span aria-hidden>⚠ </span>
            {count === 1 ? '1 alert needs you' : `${count} alerts need you`}
          </h2>
          <Link to={listPath} className="inline-flex min-h-6 items-center font-bold text-harbour underline">
            See every alert
          </Link>
        </div>
        <ul className="mt-2 grid gap-2 lg:grid-cols-3">
          {unseen.slice(0, SHOWN).map((a) => (
            <AlertCard key={a.id} alert={a} onAcknowledge={(id) => acknowledge.mutate(id)} busy={acknowledge.isPending} linkFlight={linkFlights} testId="alerts-bar-item" />
          ))}
        </ul>
        {count > SHOWN && <p className="mt-2 text-sm">{count - SHOWN} more on the full list.</p>}
      </div>
    </section>
    </>
  );
}
