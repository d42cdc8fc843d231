import { useId, useState, type FormEvent } from 'react';
import { identifyBodySchema } from '@shared/schemas/volunteers';
import { OfferRequestError, useIdentify } from '../api/public-offer';
import type { Identified } from '../model/passenger-session';
import { useT } from '../../../lib/language';
import { BigButton } from './big-button';

/** The passenger proves their booking with its reference and a last name; either wrong gets the same answer. */
export function IdentifyForm({ token, onIdentified, onLinkInvalid, notice }: { token: string; onIdentified: (who: Identified) => void; onLinkInvalid: () => void; notice?: string }) {
  const [pnr, setPnr] = useState('');
  const [lastName, setLastName] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const identify = useIdentify(token);
  const id = useId();
  const t = useT();

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = identifyBodySchema.safeParse({ pnr, lastName });
    if (!parsed.success) {
      setProblem(pnr.trim() === '' || lastName.trim() === '' ? t('passenger.identify.fillBoth') : t('passenger.identify.format'));
      return;
    }
    setProblem(null);
    identify.mutate(parsed.data, {
      onSuccess: onIdentified,
      onError: (err) => {
        if (err instanceof OfferRequestError && err.linkInvalid) onLinkInvalid();
        else setProblem(err.message);
      },
    });
  }

  const box = 'w-full rounded-xl border-4 border-line bg-card px-4 py-3 text-2xl focus:border-harbour';
  return (
    <form onSubmit={submit} noValidate className="space-y-4 rounded-xl border-2 border-line bg-card p-5" aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} className="text-2xl font-bold">{t('passenger.identify.title')}</h2>
      {notice && <p className="text-xl font-bold text-watch">{notice}</p>}
      <p className="text-xl">{t('passenger.identify.where')}</p>
      <div>
        <label htmlFor={`${id}-pnr`} className="mb-1 block text-xl font-bold">{t('passenger.identify.pnr')}</label>
        <input id={`${id}-pnr`} className={`${box} uppercase`} value={pnr} onChange={(e) => setPnr(e.target.value)} autoComplete="off" autoCapitalize="characters" spellCheck={false} maxLength={8} />
      </div>
      <div>
        <label htmlFor={`${id}-name`} className="mb-1 block text-xl font-bold">{t('passenger.identify.lastName')}</label>
        <input id={`${id}-name`} className={box} value={lastName} onChange={(e) => setLastName(e.target.value)} autoComplete="family-name" maxLength={60} />
      </div>
      {problem && (
        <p role="alert" className="rounded-lg border-l-8 border-alert bg-alert-soft px-4 py-3 text-xl font-bold text-alert">
          {problem}
        </p>
      )}
      <BigButton type="submit" disabled={identify.isPending}>{identify.isPending ? t('passenger.identify.checking') : t('passenger.identify.continue')}</BigButton>
    </form>
  );
}
