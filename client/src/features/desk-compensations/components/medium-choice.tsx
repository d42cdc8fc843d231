import type { Medium } from '@shared/compensation/media';
import type { DeskCompensation } from '@shared/schemas/finance';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { useChooseMedium } from '../api/compensations';
import { Problem } from './problem';

/** The media the station's rule allows for this passenger, the lawful default first; a card or credit says it needs agreement. */
export function MediumChoice({ flightId, compensation: c }: { flightId: number; compensation: DeskCompensation }) {
  const choose = useChooseMedium(flightId);
  const { terms } = c.payment;
  const unavailable = new Map((terms.unavailable ?? []).map((u) => [u.medium, u.reason] as const));
  return (
    <fieldset className="mt-4 rounded-md border-2 border-line p-3" data-testid="medium-choice">
      <legend className="px-1 text-lg font-bold">How the passenger is paid</legend>
      <div className="flex flex-wrap gap-2">
        {terms.media.map((m: Medium, i) => (
          <label key={m} className={`flex items-center gap-2 rounded-md border-2 px-3 py-2 text-lg ${unavailable.has(m) ? 'cursor-not-allowed text-ink-soft' : 'cursor-pointer'} ${c.medium === m ? 'border-harbour bg-paper font-bold' : 'border-line'}`}>
            <input type="radio" name={`medium-${c.id}`} value={m} checked={c.medium === m} disabled={choose.isPending || unavailable.has(m)} onChange={() => choose.mutate({ id: c.id, medium: m })} className="size-5" />
            {MEDIUM_LABELS[m]}
            {i === 0 && <span className="text-base font-normal text-ink-soft">(the rule’s default)</span>}
            {terms.needsAgreement.includes(m) && <span className="text-base font-normal text-ink-soft">(only if the passenger agrees)</span>}
          </label>
        ))}
      </div>
      {[...unavailable].map(([m, reason]) => (
        <p key={m} className="mt-2" data-testid="medium-unavailable">
          <strong>{MEDIUM_LABELS[m]} cannot be used here:</strong> {reason}.
        </p>
      ))}
      <p className="mt-2 text-ink-soft">Rule applied: {terms.ruleRef}</p>
      <Problem error={choose.error} />
    </fieldset>
  );
}
