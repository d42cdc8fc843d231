import type { z } from 'zod';
import type { publicOfferSchema } from '@shared/schemas/volunteers';
import { useFormats, useMoney, useT } from '../../../lib/language';

type PublicOffer = z.infer<typeof publicOfferSchema>;

/** The flight and what the gate offers, as one would say it out loud; once the passenger has offered, the flight alone. */
export function OfferSummary({ offer, offerSent }: { offer: PublicOffer; offerSent: boolean }) {
  const { flight, round } = offer;
  const t = useT();
  const f = useFormats();
  const money = useMoney();
  return (
    <div className="space-y-4">
      <header>
        <p className="text-lg text-ink-soft">{t('passenger.yourFlight')}</p>
        <h1 className="text-4xl font-bold text-harbour" data-testid="offer-flight">
          {t('passenger.flightTo', { flight: flight.label, destination: flight.destination })}
        </h1>
        <p className="text-xl">{t('passenger.leavesAt', { time: f.time(flight.departure, flight.timeZone) })}</p>
      </header>
      {offerSent ? null : round ? (
        <div className="rounded-xl border-4 border-ink bg-signal p-5" data-testid="offer-box">
          <p className="text-2xl font-bold">{t('passenger.wouldYou')}</p>
          <p className="mt-1 text-xl">{t('passenger.looking')}</p>
          {round.kind === 'posted' && round.offerMinor !== null ? (
            <p className="mt-2 text-xl">
              {t('passenger.airlineOffers')}
              <span className="block text-5xl leading-tight font-bold tabular-nums break-words sm:text-6xl" data-testid="offer-amount">
                {money(round.offerMinor, round.currency)}
              </span>
              {t('passenger.perSeat')}
            </p>
          ) : (
            <p className="mt-2 text-xl">{t('passenger.sealed')}</p>
          )}
          {round.extras.length > 0 && <p className="mt-2 text-xl">{t('passenger.alsoGet', { extras: round.extras.join(', ').toLowerCase() })}</p>}
        </div>
      ) : (
        <div className="rounded-xl border-4 border-calm bg-calm-soft p-5" data-testid="no-round">
          <p className="text-2xl font-bold text-calm">{t('passenger.noRound')}</p>
          <p className="mt-2 text-xl">{t('passenger.boardAsNormal')}</p>
        </div>
      )}
    </div>
  );
}
