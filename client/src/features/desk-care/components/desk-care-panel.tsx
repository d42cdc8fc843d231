import { useQuery } from '@tanstack/react-query';
import { Caution, Panel } from '../../../components/ui/page';
import { deskCareQueryOptions } from '../api/desk-care';
import { useFlightCareLive } from '../api/use-care-live';
import { PassengerCareCard } from './passenger-care-card';

/** For each denied passenger (volunteer or not): the choice the rule offers, the care their wait calls for, and what was given. */
export function DeskCarePanel({ flightId }: { flightId: number }) {
  const care = useQuery(deskCareQueryOptions(flightId));
  useFlightCareLive(flightId);
  return (
    <Panel title="Care and the passenger’s choice" className="mt-4">
      {care.error && <p role="alert" className="font-bold text-alert">{care.error.message}</p>}
      {!care.data && !care.error && <p className="text-ink-soft">Loading care…</p>}
      {care.data && care.data.passengers.length === 0 && (
        <p className="text-ink-soft">Nobody is denied boarding on this flight yet. A passenger shows here once they volunteered, or once their denial is rebooked.</p>
      )}
      {care.data && !care.data.allowancesConfigured && care.data.passengers.length > 0 && (
        <p className="mb-3 text-ink-soft">This station has not set its meal allowances yet, so no amounts are suggested. An admin sets them in Station setup.</p>
      )}
      <div className="space-y-4">
        {care.data?.passengers.map((p) => <PassengerCareCard key={p.compensationId} flightId={flightId} passenger={p} data={care.data} />)}
      </div>
      {care.data && care.data.passengers.length > 0 && (
        <div className="mt-4">
          <Caution>Bumpboard proposes what the configured rules say about the passenger’s choice and care. The applicable regulation, the contract of carriage and the carrier’s compliance staff decide.</Caution>
        </div>
      )}
    </Panel>
  );
}
