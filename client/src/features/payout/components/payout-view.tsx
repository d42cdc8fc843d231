import { useId, useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { payoutDetailsBodySchema } from '@shared/schemas/payouts';
import { useBookingLanguage, useMoney, useT } from '../../../lib/language';
import { LinkRequestError, payoutLinkQueryOptions, useGiveAccount } from '../api/passenger-payments';
import { payoutWords } from '../model/payout-words';
import { BigButton, BOX, LinkProblem, linkProblemOf, Problem } from './passenger-frame';

type Field = 'pnr' | 'lastName' | 'holderName' | 'routingNumber' | 'accountNumber' | 'accountNumberAgain';
const FIELDS: Field[] = ['pnr', 'lastName', 'holderName', 'routingNumber', 'accountNumber', 'accountNumberAgain'];
const INPUT_MODE: Partial<Record<Field, 'numeric'>> = { routingNumber: 'numeric', accountNumber: 'numeric', accountNumberAgain: 'numeric' };

/** The bank-transfer page: the link's state, then the booking proof and the passenger's own account, once. */
export function PayoutView({ token }: { token: string }) {
  const status = useQuery(payoutLinkQueryOptions(token));
  useBookingLanguage(status.data?.language);
  const give = useGiveAccount(token);
  const [values, setValues] = useState<Record<Field, string>>({ pnr: '', lastName: '', holderName: '', routingNumber: '', accountNumber: '', accountNumberAgain: '' });
  const [accountType, setAccountType] = useState<'checking' | 'savings'>('checking');
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [spent, setSpent] = useState<'used' | 'expired' | 'locked' | 'invalid' | null>(null);
  const id = useId();
  const W = payoutWords(useT());
  const money = useMoney();

  if (give.data) {
    return (
      <section className="rounded-xl border-4 border-harbour bg-card p-5" data-testid="payout-done">
        <h1 className="text-3xl font-bold">{W.doneTitle}</h1>
        <p className="mt-3">{W.done(give.data.accountEnding)}</p>
      </section>
    );
  }
  const link = status.data;
  if (link && link.state === 'used' && link.payout && link.payout.state !== 'awaiting-details') {
    return <LinkProblem title={W.used.title} text={W.already(link.payout.accountEnding)} />;
  }
  const refused = spent ?? (status.error instanceof LinkRequestError ? linkProblemOf(status.error.code) : null) ?? (link && link.state !== 'ready' ? link.state : null);
  if (refused) return <LinkProblem {...W[refused]} />;
  if (status.error) return <Problem text={status.error.message} />;
  if (!link) return <p className="text-ink-soft">{W.loading}</p>;

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = payoutDetailsBodySchema.safeParse({ ...values, accountType });
    if (!parsed.success) {
      const found: Partial<Record<Field, string>> = {};
      for (const issue of parsed.error.issues) found[issue.path[0] as Field] ??= issue.message;
      setErrors(found);
      setProblem(W.fixBelow);
      return;
    }
    setErrors({});
    setProblem(null);
    give.mutate({ ...values, accountType }, {
      onError: (err) => {
        const code = err instanceof LinkRequestError ? err.code : undefined;
        const linkProblem = linkProblemOf(code);
        if (linkProblem) return setSpent(linkProblem);
        if (err instanceof LinkRequestError && err.fields.length) setErrors(Object.fromEntries(err.fields.map((f) => [f.field, f.rule])));
        setProblem(code === 'booking_not_matched' ? W.notMatched : err.message);
      },
    });
  }

  const field = (name: Field, extra: React.InputHTMLAttributes<HTMLInputElement> = {}) => (
    <div key={name}>
      <label htmlFor={`${id}-${name}`} className="mb-1 block font-bold">{W[name]}</label>
      <input
        id={`${id}-${name}`}
        className={errors[name] ? BOX.replace('border-line', 'border-alert') : BOX}
        value={values[name]}
        onChange={(e) => setValues((v) => ({ ...v, [name]: e.target.value }))}
        aria-invalid={errors[name] ? true : undefined}
        aria-describedby={errors[name] ? `${id}-${name}-error` : undefined}
        inputMode={INPUT_MODE[name]}
        autoComplete="off"
        spellCheck={false}
        {...extra}
      />
      {errors[name] && <p id={`${id}-${name}-error`} className="mt-1 font-bold text-alert">{errors[name]}</p>}
    </div>
  );

  return (
    <>
      <p>{W.intro(money(link.amountMinor, link.currency), link.flight)}</p>
      <p className="rounded-lg border-l-8 border-harbour bg-card px-4 py-3 font-bold">{W.privacy}</p>
      <form onSubmit={submit} noValidate className="space-y-4 rounded-xl border-2 border-line bg-card p-5" aria-labelledby={`${id}-title`}>
        <h2 id={`${id}-title`} className="text-2xl font-bold">{W.proofTitle}</h2>
        <p>{W.proofHint}</p>
        {field('pnr', { maxLength: 8, autoCapitalize: 'characters', style: { textTransform: 'uppercase' } })}
        {field('lastName', { maxLength: 60, autoComplete: 'family-name' })}
        <h2 className="pt-2 text-2xl font-bold">{W.accountTitle}</h2>
        {FIELDS.slice(2).map((name) => field(name, name === 'holderName' ? { maxLength: 80, autoComplete: 'name' } : { maxLength: 20 }))}
        <fieldset>
          <legend className="mb-1 font-bold">{W.accountType}</legend>
          <div className="flex gap-6">
            {(['checking', 'savings'] as const).map((t) => (
              <label key={t} className="flex items-center gap-2">
                <input type="radio" name={`${id}-type`} className="h-6 w-6" checked={accountType === t} onChange={() => setAccountType(t)} />
                {W[t]}
              </label>
            ))}
          </div>
        </fieldset>
        {problem && <Problem text={problem} />}
        <BigButton type="submit" disabled={give.isPending}>{give.isPending ? W.sending : W.send}</BigButton>
      </form>
    </>
  );
}
