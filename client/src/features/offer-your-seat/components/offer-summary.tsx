import type { z } from 'zod';
import type { publicOfferSchema } from '@shared/schemas/volunteers';
import { formatMoney, formatTime } from '../../../lib/format';

type PublicOffer = z.infer<typeof publicOfferSchema>;

/** The flight and what the gate offers, as one would say it out loud; once the passenger has offered, the flight alone. */
export function OfferSummary({ offer, offerSent }: { offer: PublicOffer; offerSent: boolean }) {
  const { flight, round } = offer;
  return (
    <div className="space-y-4">
      <header>
        <p className="text-lg text-ink-soft">Your flight</p>
        <h1 className="text-4xl font-bold text-harbour" data-testid="offer-flight">
          {flight.label} to {flight.destination}
        </h1>
        <p className="text-xl">Leaves at {formatTime(flight.departure, flight.timeZone)} (local time)</p>
      </header>
      {offerSent ? null : round ? (
        <div className="rounded-xl border-4 border-ink bg-signal p-5" data-testid="offer-box">
          <p className="text-2xl font-bold">Would you take a later flight?</p>
          <p className="mt-1 text-xl">The gate is looking for passengers who are willing to give up their seat on this flight.</p>
          {round.kind === 'posted' && round.offerMinor !== null ? (
            <p className="mt-2 text-xl">
              The airline offers you
              <span className="block text-6xl leading-tight font-bold tabular-nums" data-testid="offer-amount">
                {formatMoney(round.offerMinor, round.currency)}
              </span>
              for each seat you give up.
            </p>
          ) : (
            <p className="mt-2 text-xl">Tell us the least amount you would accept to give up your seat. The gate picks the lowest offers first.</p>
          )}
          {round.extras.length > 0 && <p className="mt-2 text-xl">You also get: {round.extras.join(', ').toLowerCase()}.</p>}
        </div>
      ) : (
        <div className="rounded-xl border-4 border-calm bg-calm-soft p-5" data-testid="no-round">
          <p className="text-2xl font-bold text-calm">The gate is not asking for volunteers right now.</p>
          <p className="mt-2 text-xl">There is nothing you need to do. Please board as normal.</p>
        </div>
      )}
    </div>
  );
}
