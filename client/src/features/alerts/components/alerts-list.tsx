import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { alertSoundOn, setAlertSound } from '../../../lib/alert-sound';
import { alertsQueryOptions, useAcknowledgeAlert } from '../api/alerts';
import { AlertCard } from './alert-card';

/**
 * Everything the station or finance must act on, in full: payments lost or near their deadline, passengers who
 * volunteered from their phones, amounts and denial proposals waiting for a supervisor, decisions made. A payment
 * alert stays listed until the passenger is paid, waiting work until it is decided; "I am on it" only says someone
 * is on it. The tab title's count and the chime belong to the alerts bar, which every screen shows.
 */
export function AlertsList({ stationId, hint, linkFlights = true }: { stationId?: number; hint: string; linkFlights?: boolean }) {
  const { data, error } = useQuery(alertsQueryOptions(stationId));
  const acknowledge = useAcknowledgeAlert();
  const alerts = data?.alerts ?? [];
  const [sound, setSound] = useState(alertSoundOn);
  const soundToggle = (
    <label className="inline-flex min-h-6 items-center gap-2 text-sm">
      <input type="checkbox" className="h-5 w-5" checked={sound} onChange={(e) => { setSound(e.target.checked); setAlertSound(e.target.checked); }} />
      Sound when a new alert arrives
    </label>
  );
  // The sound toggle keeps its place whatever the list shows, so a list that fills or empties under a keyboard
  // user's focus never takes the toggle (and the focus) away.
  let list;
  if (error) list = <p role="alert" className="font-bold text-alert">The alerts could not be loaded: {error.message}</p>;
  else if (!data) list = <p className="text-ink-soft">Checking for alerts…</p>;
  else if (!alerts.length) list = <p className="text-ink-soft" data-testid="alerts-none">No alerts need attention.</p>;
  else {
    list = (
      <section aria-labelledby="alerts-title" data-testid="alerts" className="rounded-lg border-2 border-alert bg-alert-soft p-4">
        <h2 id="alerts-title" className="text-xl font-bold text-alert">
          <span aria-hidden>⚠ </span>
          {alerts.length === 1 ? '1 alert needs attention' : `${alerts.length} alerts need attention`}
        </h2>
        <p className="mb-2">{hint}</p>
        <ul className="space-y-2">
          {alerts.map((a) => (
            <AlertCard key={a.id} alert={a} onAcknowledge={(id) => acknowledge.mutate(id)} busy={acknowledge.isPending} linkFlight={linkFlights} />
          ))}
        </ul>
      </section>
    );
  }
  return (
    <div className="mb-4 flex flex-wrap items-start justify-between gap-x-4 gap-y-2">
      <div className="min-w-0 flex-1">{list}</div>
      <p>{soundToggle}</p>
    </div>
  );
}
