import type { z } from 'zod';
import type { passengerStatusSchema } from '@shared/schemas/volunteers';
import { useFormats, useMoney, useT } from '../../../lib/language';

type Status = z.infer<typeof passengerStatusSchema>;

/** Where the passenger's offer stands; the page asks again every few seconds until the gate has decided. */
export function Outcome({ status, timeZone }: { status: Status; timeZone: string }) {
  const t = useT();
  const f = useFormats();
  const money = useMoney();
  if (status.status === 'accepted') {
    return (
      <section role="status" className="rounded-xl border-4 border-calm bg-calm-soft p-5" data-testid="outcome" data-status="accepted">
        <h2 className="text-3xl font-bold text-calm"><span aria-hidden>✓ </span>{t('passenger.outcome.accepted')}</h2>
        {status.agreedMinor !== null && status.currency && (
          <p className="mt-2 text-2xl">{t('passenger.outcome.receive', { amount: money(status.agreedMinor, status.currency) })}</p>
        )}
        {status.rebooking ? (
          <div className="mt-4 rounded-lg border-2 border-calm bg-card p-4" data-testid="new-flight">
            <p className="text-xl text-ink-soft">{t('passenger.outcome.newFlight')}</p>
            <p className="text-4xl font-bold">{status.rebooking.flight}</p>
            <p className="text-2xl">{t('passenger.leavesAt', { time: f.time(status.rebooking.departure, timeZone) })}</p>
            <p className="mt-1 text-xl">
              {status.rebooking.plannedArrivalDelayMinutes > 0
                ? t('passenger.outcome.later', { duration: f.duration(status.rebooking.plannedArrivalDelayMinutes) })
                : t('passenger.outcome.onTime')}
            </p>
          </div>
        ) : (
          <p className="mt-3 text-xl font-bold">{t('passenger.outcome.choosing')}</p>
        )}
        <p className="mt-3 text-xl">{status.message}</p>
      </section>
    );
  }
  if (status.status === 'offered') {
    return (
      <section role="status" className="rounded-xl border-4 border-watch bg-watch-soft p-5" data-testid="outcome" data-status="offered">
        <h2 className="text-3xl font-bold"><span aria-hidden>◆ </span>{t('passenger.outcome.sent')}</h2>
        <p className="mt-2 text-xl">{status.message}</p>
        <p className="mt-2 text-lg text-ink-soft">{t('passenger.outcome.updates')}</p>
      </section>
    );
  }
  return (
    <section role="status" className="rounded-xl border-4 border-line bg-card p-5" data-testid="outcome" data-status={status.status}>
      <h2 className="text-3xl font-bold">{status.status === 'declined' ? t('passenger.outcome.thanks') : t('passenger.outcome.yourOffer')}</h2>
      <p className="mt-2 text-xl">{status.message}</p>
    </section>
  );
}
