import { useId, useState, type FormEvent } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { publicOfferSchema } from '@shared/schemas/volunteers';
import { offerKeys, OfferRequestError, usePlaceBid } from '../api/public-offer';
import { readAmount } from '../model/amount';
import type { Identified } from '../model/passenger-session';
import { useFormats, useMoney, useT } from '../../../lib/language';
import { BigButton } from './big-button';

type OpenRound = NonNullable<z.infer<typeof publicOfferSchema>['round']>;

/** The one decision: take the posted amount, or name the least one would accept. */
export function MakeOffer({ token, round, who, onSessionLost, onLinkInvalid }: { token: string; round: OpenRound; who: Identified; onSessionLost: () => void; onLinkInvalid: () => void }) {
  const qc = useQueryClient();
  const bid = usePlaceBid(token);
  const [ask, setAsk] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const id = useId();
  const t = useT();
  const f = useFormats();
  const money = useMoney();
  const seats = who.names.length;

  function send(body: { askMinor?: number; acceptPosted?: true }) {
    setProblem(null);
    bid.mutate(
      { passengerToken: who.passengerToken, ...body },
      {
        onSuccess: () => qc.invalidateQueries({ queryKey: offerKeys.status(token, who.passengerToken) }),
        onError: (err) => {
          if (err instanceof OfferRequestError && err.linkInvalid) return onLinkInvalid();
          if (err instanceof OfferRequestError && err.status === 401) return onSessionLost();
          setProblem(err.message);
          // The round may have closed or changed while the passenger read it.
          void qc.invalidateQueries({ queryKey: offerKeys.offer(token) });
        },
      },
    );
  }
  function submitAsk(e: FormEvent) {
    e.preventDefault();
    const r = readAmount(ask, round.currency);
    if (!r.ok) return setProblem(r.reason);
    send({ askMinor: r.minor });
  }

  return (
    <section className="space-y-4 rounded-xl border-2 border-line bg-card p-5" aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} className="text-2xl font-bold">{t('passenger.offer.hello', { name: who.names[0] })}</h2>
      <p className="text-xl">{t('passenger.offer.giveUp', { count: seats, names: f.list(who.names) })}</p>
      {round.kind === 'posted' && round.offerMinor !== null ? (
        <BigButton disabled={bid.isPending} onClick={() => send({ acceptPosted: true })}>
          {bid.isPending ? t('passenger.offer.sending') : t('passenger.offer.accept', { amount: money(round.offerMinor, round.currency) })}
        </BigButton>
      ) : (
        <form onSubmit={submitAsk} noValidate className="space-y-3">
          <label htmlFor={`${id}-ask`} className="block text-xl font-bold">
            {t('passenger.offer.least', { currency: round.currency, count: seats })}
          </label>
          <input
            id={`${id}-ask`} value={ask} onChange={(e) => setAsk(e.target.value)} inputMode="decimal" autoComplete="off" placeholder={t('passenger.offer.example', { amount: '450' })}
            className="w-full rounded-xl border-4 border-line bg-card px-4 py-3 text-3xl tabular-nums focus:border-harbour"
          />
          <BigButton type="submit" disabled={bid.isPending}>{bid.isPending ? t('passenger.offer.sending') : t('passenger.offer.send')}</BigButton>
        </form>
      )}
      {problem && (
        <p role="alert" className="rounded-lg border-l-8 border-alert bg-alert-soft px-4 py-3 text-xl font-bold text-alert">
          {problem}
        </p>
      )}
      <p className="text-lg text-ink-soft">{t('passenger.offer.noNeed')}</p>
    </section>
  );
}
