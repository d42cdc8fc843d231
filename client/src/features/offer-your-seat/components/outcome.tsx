import type { z } from 'zod';
import type { passengerStatusSchema } from '@shared/schemas/volunteers';
import { formatMoney, formatTime } from '../../../lib/format';
import { laterWords } from '../model/words';

type Status = z.infer<typeof passengerStatusSchema>;

/** Where the passenger's offer stands; the page asks again every few seconds until the gate has decided. */
export function Outcome({ status, timeZone }: { status: Status; timeZone: string }) {
  if (status.status === 'accepted') {
    return (
      <section role="status" className="rounded-xl border-4 border-calm bg-calm-soft p-5" data-testid="outcome" data-status="accepted">
        <h2 className="text-3xl font-bold text-calm"><span aria-hidden>✓ </span>Your offer was accepted</h2>
        {status.agreedMinor !== null && status.currency && (
          <p className="mt-2 text-2xl">
            You receive <strong>{formatMoney(status.agreedMinor, status.currency)}</strong> for each seat.
          </p>
        )}
        {status.rebooking ? (
          <div className="mt-4 rounded-lg border-2 border-calm bg-card p-4" data-testid="new-flight">
            <p className="text-xl text-ink-soft">Your new flight</p>
            <p className="text-4xl font-bold">{status.rebooking.flight}</p>
            <p className="text-2xl">Leaves at {formatTime(status.rebooking.departure, timeZone)} (local time)</p>
            <p className="mt-1 text-xl">
              {status.rebooking.plannedArrivalDelayMinutes > 0
                ? `Planned to arrive ${laterWords(status.rebooking.plannedArrivalDelayMinutes)} later than your original flight.`
                : 'Planned to arrive on time.'}
            </p>
          </div>
        ) : (
          <p className="mt-3 text-xl font-bold">The gate agent is choosing your new flight. It will appear here.</p>
        )}
        <p className="mt-3 text-xl">{status.message}</p>
      </section>
    );
  }
  if (status.status === 'offered') {
    return (
      <section role="status" className="rounded-xl border-4 border-watch bg-watch-soft p-5" data-testid="outcome" data-status="offered">
        <h2 className="text-3xl font-bold"><span aria-hidden>◆ </span>Offer sent</h2>
        <p className="mt-2 text-xl">{status.message}</p>
        <p className="mt-2 text-lg text-ink-soft">This page updates by itself.</p>
      </section>
    );
  }
  return (
    <section role="status" className="rounded-xl border-4 border-line bg-card p-5" data-testid="outcome" data-status={status.status}>
      <h2 className="text-3xl font-bold">{status.status === 'declined' ? 'Thank you' : 'Your offer'}</h2>
      <p className="mt-2 text-xl">{status.message}</p>
    </section>
  );
}
