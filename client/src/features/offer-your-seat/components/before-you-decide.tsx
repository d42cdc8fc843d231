import type { z } from 'zod';
import type { publicOfferSchema } from '@shared/schemas/volunteers';
import { useT } from '../../../lib/language';

type Disclosure = z.infer<typeof publicOfferSchema>['disclosure'];

/** What the passenger must know before agreeing, in plain words; the details stay one tap away. */
export function BeforeYouDecide({ disclosure }: { disclosure: Disclosure }) {
  const t = useT();
  return (
    <section aria-labelledby="before-you-decide" className="rounded-xl border-2 border-line bg-card p-5" data-testid="passenger-disclosure">
      <h2 id="before-you-decide" className="text-2xl font-bold">{t('passenger.before.title')}</h2>
      <ul className="mt-3 space-y-3 text-xl">
        <li>{disclosure.mayBeDeniedInvoluntarily ? t('passenger.before.mayBeDenied') : t('passenger.before.unlikely')}</li>
        <li>
          <strong>{t('passenger.before.keptOff')} </strong>
          {disclosure.involuntaryRule}
        </li>
        <li>
          <strong>{t('passenger.before.cash')} </strong>
          {disclosure.cashAlternative}
        </li>
        <li>
          <strong>{t('passenger.before.rises')} </strong>
          {disclosure.ifTheOfferRises}
        </li>
      </ul>
      {disclosure.voucherRestrictions.length > 0 && (
        <details className="mt-3 text-xl">
          <summary className="cursor-pointer font-bold text-harbour">{t('passenger.before.voucher')}</summary>
          <ul className="mt-2 ml-6 list-disc space-y-1">
            {disclosure.voucherRestrictions.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        </details>
      )}
      <p className="mt-3 text-base text-ink-soft">{t('passenger.before.summary')}</p>
    </section>
  );
}
