import { useId, useState, type FormEvent } from 'react';
import type { VolunteerPolicy } from '@shared/schemas/volunteers';
import { Button } from '../../../components/ui/button';
import { formatMoney } from '../../../lib/format';
import { useOpenRound } from '../api/rounds';
import { limitForRole } from '@shared/schemas/approvals';
import { limitWords, needsSupervisor } from '../model/round-words';
import { Problem } from './problem';
import type { FieldProblem } from '../../../components/ui/form-problems';

type Kind = 'posted' | 'sealed';
const NEEDED_RULE = 'must be a whole number from 1 to 60';

const KINDS: { kind: Kind; title: string; what: string }[] = [
  { kind: 'posted', title: 'Posted offer', what: 'Everyone hears one amount; you raise it step by step until enough people volunteer.' },
  { kind: 'sealed', title: 'Sealed bids', what: 'Each volunteer names the least they would accept; you accept the lowest asks first.' },
];

/** Opening a round: the kind, the first offer (the ladder's first step), the extras and how many volunteers. */
export function OpenRoundForm({ flightId, policy, role, volunteerTarget }: { flightId: number; policy: VolunteerPolicy; role: string | undefined; volunteerTarget: number | null }) {
  const [kind, setKind] = useState<Kind>('posted');
  const [offerMinor, setOfferMinor] = useState(policy.ladderMinor[0]);
  const [extras, setExtras] = useState<string[]>(policy.extras);
  const [needed, setNeeded] = useState(String(Math.max(1, volunteerTarget ?? 1)));
  const open = useOpenRound(flightId);
  const [refused, setRefused] = useState<FieldProblem[] | null>(null);
  const id = useId();
  const neededNumber = Number(needed);
  const neededOk = Number.isInteger(neededNumber) && neededNumber >= 1 && neededNumber <= 60;
  const money = (m: number) => formatMoney(m, policy.currency);

  function submit(e: FormEvent) {
    e.preventDefault();
    if (!neededOk) return setRefused([{ field: 'volunteersNeeded', rule: NEEDED_RULE }]);
    setRefused(null);
    open.mutate({ kind, offerMinor: kind === 'posted' ? offerMinor : undefined, extras, volunteersNeeded: neededNumber });
  }

  return (
    <form onSubmit={submit} noValidate aria-label="Open a volunteer round" className="space-y-5">
      <p className="text-lg">No volunteer round is open on this flight.</p>
      <fieldset>
        <legend className="mb-2 text-lg font-bold">How volunteers are asked</legend>
        <div className="grid gap-3 md:grid-cols-2">
          {KINDS.map((k) => (
            <label key={k.kind} className={`flex cursor-pointer gap-3 rounded-lg border-2 p-3 ${kind === k.kind ? 'border-harbour bg-harbour-soft' : 'border-line'}`}>
              <input type="radio" name="round-kind" value={k.kind} checked={kind === k.kind} onChange={() => setKind(k.kind)} className="mt-1 h-5 w-5" />
              <span>
                <span className="block text-lg font-bold">{k.title}</span>
                <span className="text-ink-soft">{k.what}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <div className="grid gap-4 md:grid-cols-2">
        {kind === 'posted' && (
          <div>
            <label htmlFor={`${id}-offer`} className="mb-1 block font-bold">First offer</label>
            <select id={`${id}-offer`} aria-describedby={`${id}-offer-hint`} className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg" value={offerMinor} onChange={(e) => setOfferMinor(Number(e.target.value))}>
              {policy.ladderMinor.map((step) => (
                <option key={step} value={step}>
                  {money(step)}
                  {needsSupervisor(step, policy, role) ? ' — above your limit: waits for a supervisor' : ''}
                </option>
              ))}
            </select>
            <p id={`${id}-offer-hint`} className="mt-1 text-sm text-ink-soft">The station’s ladder. {limitWords(limitForRole(role, policy), money)}</p>
          </div>
        )}
        <div>
          <label htmlFor={`${id}-needed`} className="mb-1 block font-bold">Volunteers needed</label>
          <input
            id={`${id}-needed`} type="number" min={1} max={60} inputMode="numeric" value={needed} onChange={(e) => setNeeded(e.target.value)}
            aria-invalid={neededOk ? undefined : true} aria-describedby={`${id}-needed-hint`}
            className={`w-full rounded-md border-2 bg-card px-3 py-2 text-lg ${neededOk ? 'border-line' : 'border-alert'}`}
          />
          {neededOk ? (
            <p id={`${id}-needed-hint`} className="mt-1 text-sm text-ink-soft">
              {volunteerTarget && volunteerTarget > 0 ? 'Prefilled from the odds panel’s volunteer target.' : 'The odds panel asks for no volunteers right now: set how many you need.'}
            </p>
          ) : (
            <p id={`${id}-needed-hint`} className="mt-1 font-bold text-alert">{NEEDED_RULE}</p>
          )}
        </div>
      </div>
      {policy.extras.length > 0 && (
        <fieldset>
          <legend className="mb-1 font-bold">Extras offered with the amount</legend>
          <div className="flex flex-wrap gap-x-6 gap-y-2">
            {policy.extras.map((x) => (
              <label key={x} className="flex items-center gap-2 text-lg">
                <input type="checkbox" className="h-5 w-5" checked={extras.includes(x)} onChange={(e) => setExtras(e.target.checked ? [...extras, x] : extras.filter((y) => y !== x))} />
                {x}
              </label>
            ))}
          </div>
        </fieldset>
      )}
      <Button type="submit" disabled={open.isPending} className="text-lg">
        {open.isPending ? 'Opening…' : kind === 'posted' ? `Open a volunteer round at ${money(offerMinor)}` : 'Open a sealed-bid round'}
      </Button>
      <Problem
        error={open.error}
        problems={refused}
        labels={{ volunteersNeeded: 'Volunteers needed', offerMinor: 'First offer', kind: 'How volunteers are asked', extras: 'Extras offered with the amount' }}
        fieldIds={{ volunteersNeeded: `${id}-needed`, offerMinor: `${id}-offer` }}
      />
    </form>
  );
}
