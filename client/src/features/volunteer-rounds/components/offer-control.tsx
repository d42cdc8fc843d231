import { useId, useState, type FormEvent } from 'react';
import type { Round, VolunteerPolicy } from '@shared/schemas/volunteers';
import { Button } from '../../../components/ui/button';
import { formatMoney, formatTime } from '../../../lib/format';
import { useRaiseOffer } from '../api/rounds';
import { parseMoney } from '../model/money';
import { limitForRole } from '@shared/schemas/approvals';
import { limitWords, needsSupervisor, nextLadderStep } from '../model/round-words';
import { Problem } from './problem';
import type { FieldProblem } from '../../../components/ui/form-problems';

const PRICING_WORDS: Record<VolunteerPolicy['sealedBidPricing'], string> = {
  'own-ask': 'Each accepted volunteer is paid their own ask.',
  'common-price': 'Every accepted volunteer is paid the highest ask you accept.',
};

/** The current offer in large type, the next ladder step as one button, and a custom amount. */
export function OfferControl({ round, policy, role, flightId, timeZone }: { round: Round; policy: VolunteerPolicy; role: string | undefined; flightId: number; timeZone: string }) {
  const raise = useRaiseOffer(flightId);
  const [custom, setCustom] = useState('');
  const [customError, setCustomError] = useState<string | null>(null);
  const [refused, setRefused] = useState<FieldProblem[] | null>(null);
  const customId = useId();
  const money = (m: number) => formatMoney(m, round.currency);

  if (round.kind === 'sealed') {
    return (
      <div className="rounded-lg border-2 border-line p-4">
        <p className="text-2xl font-bold">Sealed bids</p>
        <p className="text-lg">Volunteers name the least they would accept. Accept the lowest asks first: they are listed lowest first.</p>
        <p className="mt-1 text-ink-soft">{PRICING_WORDS[policy.sealedBidPricing]} {limitWords(limitForRole(role, policy), money)}</p>
        <Extras extras={round.extras} />
      </div>
    );
  }

  const next = nextLadderStep(policy.ladderMinor, round.offerMinor);
  const pending = round.pendingApproval;
  const send = (offerMinor: number) => raise.mutate({ roundId: round.id, offerMinor });
  function submitCustom(e: FormEvent) {
    e.preventDefault();
    const parsed = parseMoney(custom, round.currency);
    const rule = !parsed.ok ? parsed.rule : parsed.minor <= (round.offerMinor ?? 0) ? `must be above the current offer of ${money(round.offerMinor ?? 0)}` : null;
    if (rule || !parsed.ok) {
      setCustomError(`amount ${rule}`);
      return setRefused([{ field: 'offerMinor', rule: rule ?? '' }]);
    }
    setCustomError(null);
    setRefused(null);
    raise.mutate({ roundId: round.id, offerMinor: parsed.minor }, { onSuccess: () => setCustom('') });
  }

  return (
    <div className="rounded-lg border-2 border-line p-4">
      <p className="text-ink-soft">Current offer, per seat</p>
      <p className="text-5xl font-bold tabular-nums" data-testid="current-offer">
        {round.offerMinor === null ? '—' : money(round.offerMinor)}
      </p>
      <Extras extras={round.extras} />
      {pending && (
        <p role="status" className="mt-3 rounded-md border-l-4 border-watch bg-watch-soft px-3 py-2 text-lg font-bold" data-testid="pending-approval">
          <span aria-hidden>◆ </span>Awaiting approval: a supervisor must approve {money(pending.offerMinor)} (asked by {pending.requestedBy} at {formatTime(pending.requestedAt, timeZone)}).{' '}
          {round.offerMinor === null ? 'No one can be accepted until an offer stands.' : `The offer stays at ${money(round.offerMinor)} until then.`}
        </p>
      )}
      <div className="mt-4 flex flex-wrap items-end gap-3">
        {next !== null ? (
          <Button className="text-lg" disabled={raise.isPending || Boolean(pending && needsSupervisor(next, policy, role))} onClick={() => send(next)}>
            Raise to {money(next)}
            {needsSupervisor(next, policy, role) ? ' (needs a supervisor)' : ''}
          </Button>
        ) : (
          <p className="font-bold">The ladder’s top step is reached; a custom amount can still be asked.</p>
        )}
        <form onSubmit={submitCustom} noValidate className="flex flex-wrap items-end gap-2" aria-label="Raise to a custom amount">
          <label className="block">
            <span className="mb-1 block text-sm font-bold">Custom amount ({round.currency})</span>
            <input
              id={customId} value={custom} onChange={(e) => setCustom(e.target.value)} inputMode="decimal" autoComplete="off" placeholder="e.g. 750"
              aria-invalid={customError ? true : undefined}
              className={`w-36 rounded-md border-2 bg-card px-3 py-2 text-lg ${customError ? 'border-alert' : 'border-line'}`}
            />
          </label>
          <Button type="submit" variant="secondary" disabled={raise.isPending}>
            Raise
          </Button>
        </form>
      </div>
      {customError && <p className="mt-1 font-bold text-alert">{customError}</p>}
      {raise.data?.approvalRequested && !pending && <p role="status" className="mt-2 font-bold">Sent to a supervisor for approval.</p>}
      <p className="mt-2 text-sm text-ink-soft">{limitWords(limitForRole(role, policy), money)}</p>
      <Problem error={raise.error} problems={refused} labels={{ offerMinor: `Custom amount (${round.currency})` }} fieldIds={{ offerMinor: customId }} />
    </div>
  );
}

function Extras({ extras }: { extras: string[] }) {
  if (extras.length === 0) return null;
  return <p className="mt-1 text-lg">Plus: {extras.join(' · ')}</p>;
}
