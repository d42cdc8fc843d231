import type { z } from 'zod';
import type { publicOfferSchema } from '@shared/schemas/volunteers';

type Disclosure = z.infer<typeof publicOfferSchema>['disclosure'];

/** What the passenger must know before agreeing, in plain words; the details stay one tap away. */
export function BeforeYouDecide({ disclosure }: { disclosure: Disclosure }) {
  return (
    <section aria-labelledby="before-you-decide" className="rounded-xl border-2 border-line bg-card p-5" data-testid="passenger-disclosure">
      <h2 id="before-you-decide" className="text-2xl font-bold">Before you decide</h2>
      <ul className="mt-3 space-y-3 text-xl">
        <li>
          {disclosure.mayBeDeniedInvoluntarily
            ? 'If not enough people volunteer, some passengers may not be allowed to board, even if they do not want to give up their seat.'
            : 'Right now it is unlikely that anyone will be kept off this flight against their will.'}
        </li>
        <li>
          <strong>If you are kept off against your will: </strong>
          {disclosure.involuntaryRule}
        </li>
        <li>
          <strong>Cash: </strong>
          {disclosure.cashAlternative}
        </li>
        <li>
          <strong>If the offer rises: </strong>
          {disclosure.ifTheOfferRises}
        </li>
      </ul>
      {disclosure.voucherRestrictions.length > 0 && (
        <details className="mt-3 text-xl">
          <summary className="cursor-pointer font-bold text-harbour">If you are given a travel voucher</summary>
          <ul className="mt-2 ml-6 list-disc space-y-1">
            {disclosure.voucherRestrictions.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        </details>
      )}
      <p className="mt-3 text-base text-ink-soft">These words summarise the passenger-rights rules that apply here. The rules themselves decide.</p>
    </section>
  );
}
