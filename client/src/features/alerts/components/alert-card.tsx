import { Link } from 'react-router-dom';
import { ALERT_KIND_LABELS, ALERT_NEXT_STEP, INFORMATIONAL_ALERT_KINDS, isPaymentAlert, type AlertView } from '@shared/schemas/alerts';
import { Button } from '../../../components/ui/button';

/** One alert: what happened, what to do next, the flight to open, and the button that takes it off the count. */
export function AlertCard({ alert, onAcknowledge, busy, linkFlight, testId = 'alert' }: { alert: AlertView; onAcknowledge: (id: number) => void; busy: boolean; linkFlight: boolean; testId?: string }) {
  const dismissable = INFORMATIONAL_ALERT_KINDS.includes(alert.kind);
  return (
    <li data-testid={testId} data-kind={alert.kind} className="rounded-md border-2 border-line bg-card p-3">
      <p className="font-bold">{ALERT_KIND_LABELS[alert.kind]} · {alert.stationIata}</p>
      <p>{alert.message}</p>
      <p className="text-sm">{ALERT_NEXT_STEP[alert.kind]}</p>
      <p className="text-sm text-ink-soft">
        Raised {new Date(alert.createdAt).toISOString().slice(0, 16).replace('T', ' ')} UTC
        {alert.acknowledgedAt ? ` · seen by ${alert.acknowledgedBy ?? 'a colleague'}` : ''}
      </p>
      <div className="mt-2 flex flex-wrap items-center gap-3">
        {linkFlight && alert.flightId !== null && !isPaymentAlert(alert.kind) && (
          <Link to={`/flights/${alert.flightId}?station=${alert.stationIata}`} className="inline-flex min-h-11 items-center rounded-md border-2 border-harbour px-4 py-2 font-bold text-harbour hover:bg-harbour-soft">
            Open {alert.flight ?? 'the flight'}
          </Link>
        )}
        {!alert.acknowledgedAt && (
          <Button type="button" variant="quiet" onClick={() => onAcknowledge(alert.id)} disabled={busy}
            aria-label={dismissable ? `Dismiss alert ${alert.id}` : `Mark alert ${alert.id} as seen`}>
            {dismissable ? 'Dismiss' : 'I am on it'}
          </Button>
        )}
      </div>
    </li>
  );
}
