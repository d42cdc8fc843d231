import { useQuery } from '@tanstack/react-query';
import { Caution } from '../../../components/ui/page';
import { disclosureQueryOptions } from '../api/rounds';

/** What every volunteer must hear before agreeing, in the words the passenger page shows them. */
export function Disclosure({ token }: { token: string }) {
  const d = useQuery(disclosureQueryOptions(token));
  return (
    <section aria-labelledby="disclosure-heading" className="rounded-lg border-2 border-watch p-3" data-testid="disclosure">
      <h3 id="disclosure-heading" className="text-lg font-bold">
        Tell every volunteer before they agree
      </h3>
      {d.isPending && <p className="text-ink-soft">Loading…</p>}
      {d.error && <p role="alert" className="font-bold text-alert">{d.error.message}</p>}
      {d.data && (
        <div className="mt-2 space-y-2">
          <p className="font-bold">
            {d.data.mayBeDeniedInvoluntarily
              ? 'This flight may be oversold: if not enough people volunteer, someone may be denied boarding against their will.'
              : 'The odds of anyone being denied boarding against their will are low on this flight right now.'}
          </p>
          <p>
            <strong>Owed if bumped involuntarily: </strong>
            {d.data.involuntaryRule}
          </p>
          <p>
            <strong>Cash alternative: </strong>
            {d.data.cashAlternative}
          </p>
          <p>
            <strong>If the offer rises: </strong>
            {d.data.ifTheOfferRises}
          </p>
          {d.data.voucherRestrictions.length > 0 && (
            <div>
              <strong>Voucher restrictions:</strong>
              <ul className="ml-5 list-disc">
                {d.data.voucherRestrictions.map((r) => (
                  <li key={r}>{r}</li>
                ))}
              </ul>
            </div>
          )}
        </div>
      )}
      <div className="mt-3">
        <Caution>These texts paraphrase the station’s rules. The applicable regulation and the carrier’s compliance staff decide what a volunteer is owed.</Caution>
      </div>
    </section>
  );
}
