import { useQuery } from '@tanstack/react-query';
import { isPaymentLost } from '@shared/schemas/finance';
import { Caution, Panel } from '../../../components/ui/page';
import { deskCompensationsQueryOptions } from '../api/compensations';
import { useFlightCompensationsLive } from '../api/use-compensations-live';
import { CabinChanges } from './cabin-changes';
import { CompensationCard } from './compensation-card';
import { RefundsList } from './refunds-list';

/**
 * The flight desk's compensation slot: what each volunteer or denied passenger is owed, and the agent's one press
 * to pay it. Only agents handle the money, so the panel loads nothing for anyone else.
 */
export function CompensationsPanel({ flightId }: { flightId: number }) {
  const list = useQuery(deskCompensationsQueryOptions(flightId));
  useFlightCompensationsLive(flightId);
  const rows = list.data?.compensations ?? [];
  const due = rows.filter((c) => c.state === 'due').length;
  const lost = rows.filter((c) => isPaymentLost(c.state)).length;

  return (
    <section data-testid="desk-compensations" aria-labelledby="desk-compensations-title" className="rounded-lg border-2 border-line bg-card p-4">
      <h2 id="desk-compensations-title" className="mb-3 text-xl font-bold">
        Compensation
      </h2>
      <div className="space-y-4">
        <Caution />
        {list.isPending && <p className="text-lg text-ink-soft">Loading what is owed…</p>}
        {list.error && (
          <p role="alert" className="font-bold text-alert">
            The compensations could not be loaded: {list.error.message}
          </p>
        )}
        {list.data && rows.length === 0 && (
          <Panel className="bg-paper">
            <p className="text-lg text-ink-soft">Nothing owed on this flight yet. Accepting a volunteer or processing an authorized denial adds it here.</p>
          </Panel>
        )}
        {rows.length > 0 && (
          <p className="text-lg" data-testid="compensations-summary">
            <strong>{rows.length}</strong> {rows.length === 1 ? 'compensation' : 'compensations'}, <strong>{due}</strong> still to issue.
            {lost > 0 && (
              <strong className="ml-2 text-alert" data-testid="compensations-lost">
                <span aria-hidden>⚠ </span>
                {lost} {lost === 1 ? 'payment was' : 'payments were'} voided, canceled or refused: still owed, re-issue below.
              </strong>
            )}
          </p>
        )}
        <ul className="space-y-3">
          {rows.map((c) => (
            <li key={c.id}>
              <CompensationCard flightId={flightId} compensation={c} />
            </li>
          ))}
        </ul>
        <RefundsList flightId={flightId} />
        <CabinChanges flightId={flightId} />
      </div>
    </section>
  );
}
