import { useId, useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { bookingProofSchema, type CardDetails } from '@shared/schemas/payouts';
import { useBookingLanguage, useMoney, useT } from '../../../lib/language';
import { cardLinkQueryOptions, LinkRequestError, useRevealCard } from '../api/passenger-payments';
import { cardWords } from '../model/card-words';
import { BigButton, BOX, LinkProblem, linkProblemOf, Problem } from './passenger-frame';

const groups = (number: string) => number.replace(/(\d{4})(?=\d)/g, '$1 ');

function Details({ details }: { details: CardDetails }) {
  const W = cardWords(useT());
  const money = useMoney();
  return (
    <section aria-labelledby="card-details-title" className="rounded-xl border-4 border-harbour bg-card p-5" data-testid="card-details">
      <h2 id="card-details-title" className="text-2xl font-bold">{W.detailsTitle}</h2>
      <dl className="mt-3 space-y-3">
        <div>
          <dt className="text-base text-ink-soft">{W.number}</dt>
          <dd className="whitespace-nowrap font-mono text-2xl font-bold sm:text-3xl" data-testid="card-number">{groups(details.number)}</dd>
        </div>
        <div className="flex gap-8">
          <div>
            <dt className="text-base text-ink-soft">{W.expiry}</dt>
            <dd className="font-mono text-2xl font-bold">{`${String(details.expMonth).padStart(2, '0')}/${String(details.expYear).slice(-2)}`}</dd>
          </div>
          <div>
            <dt className="text-base text-ink-soft">{W.cvc}</dt>
            <dd className="font-mono text-2xl font-bold">{details.cvc}</dd>
          </div>
        </div>
        <div>
          <dt className="text-base text-ink-soft">{W.amount}</dt>
          <dd className="text-2xl font-bold">{money(details.amountMinor, details.currency)}</dd>
        </div>
      </dl>
      <p className="mt-4 font-bold text-watch">{W.afterShown}</p>
    </section>
  );
}

/** The card-details page: the link's state, then the booking proof, then the details once. */
export function CardDetailsView({ token }: { token: string }) {
  const status = useQuery(cardLinkQueryOptions(token));
  useBookingLanguage(status.data?.language);
  const reveal = useRevealCard(token);
  const [pnr, setPnr] = useState('');
  const [lastName, setLastName] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [spent, setSpent] = useState<'used' | 'expired' | 'locked' | 'invalid' | null>(null);
  const id = useId();
  const W = cardWords(useT());
  const money = useMoney();

  if (reveal.data) return <Details details={reveal.data} />;
  const refused = spent ?? (status.error instanceof LinkRequestError ? linkProblemOf(status.error.code) : null) ?? (status.data && status.data.state !== 'ready' ? status.data.state : null);
  if (refused) return <LinkProblem {...W[refused]} />;
  if (status.error) return <Problem text={status.error.message} />;
  if (!status.data) return <p className="text-ink-soft">{W.loading}</p>;
  const link = status.data;

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = bookingProofSchema.safeParse({ pnr, lastName });
    if (!parsed.success) {
      setProblem(pnr.trim() === '' || lastName.trim() === '' ? W.fillBoth : W.pnrShape);
      return;
    }
    setProblem(null);
    reveal.mutate(parsed.data, {
      onError: (err) => {
        const code = err instanceof LinkRequestError ? err.code : undefined;
        const linkProblem = linkProblemOf(code);
        if (linkProblem) setSpent(linkProblem);
        else setProblem(code === 'booking_not_matched' ? W.notMatched : err.message);
      },
    });
  }

  return (
    <>
      <p>{W.intro(money(link.amountMinor, link.currency), link.flight)}</p>
      <p className="rounded-lg border-l-8 border-harbour bg-card px-4 py-3 font-bold">{W.onceWarning}</p>
      <form onSubmit={submit} noValidate className="space-y-4 rounded-xl border-2 border-line bg-card p-5" aria-labelledby={`${id}-title`}>
        <h2 id={`${id}-title`} className="text-2xl font-bold">{W.proofTitle}</h2>
        <p>{W.proofHint}</p>
        <div>
          <label htmlFor={`${id}-pnr`} className="mb-1 block font-bold">{W.pnr}</label>
          <input id={`${id}-pnr`} className={`${BOX} uppercase`} value={pnr} onChange={(e) => setPnr(e.target.value)} autoComplete="off" autoCapitalize="characters" spellCheck={false} maxLength={8} />
        </div>
        <div>
          <label htmlFor={`${id}-name`} className="mb-1 block font-bold">{W.lastName}</label>
          <input id={`${id}-name`} className={BOX} value={lastName} onChange={(e) => setLastName(e.target.value)} autoComplete="family-name" maxLength={60} />
        </div>
        {problem && <Problem text={problem} />}
        <BigButton type="submit" disabled={reveal.isPending}>{reveal.isPending ? W.showing : W.show}</BigButton>
      </form>
    </>
  );
}
