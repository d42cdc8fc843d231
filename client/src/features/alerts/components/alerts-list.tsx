import { useEffect, useRef, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { ALERT_KIND_LABELS } from '@shared/schemas/alerts';
import { Button } from '../../../components/ui/button';
import { alertSoundOn, playChime, setAlertSound } from '../../../lib/alert-sound';
import { setAlertCount } from '../../../lib/document-title';
import { alertsQueryOptions, useAcknowledgeAlert } from '../api/alerts';

/**
 * What the station and finance must act on: payments voided, canceled by the provider or refused, whose passengers
 * are owed again. An alert stays listed until the passenger is paid; acknowledging only says someone is on it.
 */
export function AlertsList({ stationId, hint }: { stationId?: number; hint: string }) {
  const { data, error } = useQuery(alertsQueryOptions(stationId));
  const acknowledge = useAcknowledgeAlert();
  const alerts = data?.alerts ?? [];
  const unseen = alerts.filter((a) => !a.acknowledgedAt).length;
  const [sound, setSound] = useState(alertSoundOn);
  const lastUnseen = useRef<number | null>(null);
  // The tab title carries the count, so an agent with the console behind another window still sees it; the chime
  // sounds only for a rise, and only if the user turned it on.
  useEffect(() => {
    setAlertCount(unseen);
    if (sound && lastUnseen.current !== null && unseen > lastUnseen.current) playChime();
    lastUnseen.current = unseen;
  }, [unseen, sound]);
  useEffect(() => () => setAlertCount(0), []);
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
          {alerts.length === 1 ? '1 payment needs attention' : `${alerts.length} payments need attention`}
        </h2>
        <p className="mb-2">{hint}</p>
        <ul className="space-y-2">
          {alerts.map((a) => (
            <li key={a.id} data-testid="alert" data-kind={a.kind} className="rounded-md border-2 border-line bg-card p-3">
              <p className="font-bold">{ALERT_KIND_LABELS[a.kind]} · {a.stationIata}</p>
              <p>{a.message}</p>
              <p className="text-sm text-ink-soft">
                Raised {new Date(a.createdAt).toISOString().slice(0, 16).replace('T', ' ')} UTC
                {a.acknowledgedAt ? ` · seen by ${a.acknowledgedBy ?? 'a colleague'}` : ''}
              </p>
              {!a.acknowledgedAt && (
                <Button type="button" variant="quiet" onClick={() => acknowledge.mutate(a.id)} disabled={acknowledge.isPending} aria-label={`Mark alert ${a.id} as seen`}>
                  I am on it
                </Button>
              )}
            </li>
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
