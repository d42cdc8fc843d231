import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { CABIN_CODES, CABIN_LABELS } from '@shared/schemas/cabin-changes';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { formatMoney } from '../../../lib/format';
import { cabinChangesQueryOptions, cabinPassengersQueryOptions, useRecordCabinChange } from '../api/cabin-changes';
import { toMinor } from '../model/fare-difference';
import { Problem } from './problem';

const cabinName = (code: string) => CABIN_LABELS[code as keyof typeof CABIN_LABELS] ?? code;

/**
 * Passengers seated in another cabin than the one booked: recorded with the fare difference, and what the station's
 * rule says they are owed back for a downgrade. They are counted on the period report.
 */
export function CabinChanges({ flightId }: { flightId: number }) {
  const changes = useQuery(cabinChangesQueryOptions(flightId));
  const passengers = useQuery(cabinPassengersQueryOptions(flightId));
  const record = useRecordCabinChange(flightId);
  const [passengerId, setPassengerId] = useState('');
  const [flownCabin, setFlownCabin] = useState('Y');
  const [difference, setDifference] = useState('0');
  const [reason, setReason] = useState('');
  const [tried, setTried] = useState(false);
  const passenger = passengers.data?.passengers.find((p) => String(p.id) === passengerId);
  const currency = passenger?.fareCurrency ?? 'USD';
  const minor = toMinor(difference, currency);
  const problems = {
    passenger: passenger ? undefined : 'Choose the passenger.',
    difference: minor === null ? `Give the fare difference as an amount in ${currency}, e.g. 120.50.` : undefined,
    reason: reason.trim().length < 3 ? 'Say why, in at least 3 characters.' : undefined,
  };
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTried(true);
    if (!passenger || minor === null || problems.reason) return;
    record.mutate({ passengerId: passenger.id, flownCabin: flownCabin as (typeof CABIN_CODES)[number], fareDifferenceMinor: minor, reason: reason.trim() }, { onSuccess: () => { setReason(''); setTried(false); } });
  };

  return (
    <section aria-labelledby={`cabin-changes-${flightId}`} className="rounded-lg border-2 border-line p-4" data-testid="cabin-changes">
      <h3 id={`cabin-changes-${flightId}`} className="text-lg font-bold">Seated in another cabin</h3>
      <p className="text-ink-soft">An upgrade or a downgrade is counted on the period report; a downgrade may be owed a refund.</p>
      {(changes.data?.cabinChanges.length ?? 0) > 0 && (
        <ul className="my-2 space-y-1">
          {changes.data!.cabinChanges.map((c) => (
            <li key={c.id} data-testid="cabin-change">
              <strong>{c.passengerName}</strong>: {c.direction === 'downgrade' ? 'downgraded' : 'upgraded'} from {cabinName(c.bookedCabin)} to {cabinName(c.flownCabin)}
              {c.direction === 'downgrade' && <> · owed back <strong>{formatMoney(c.owedMinor, c.currency)}</strong></>}
              <span className="block text-sm text-ink-soft">{c.owedRule} · {c.reason}</span>
            </li>
          ))}
        </ul>
      )}
      <form onSubmit={submit} className="mt-2 grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={`cabin-pax-${flightId}`} className="mb-1 block font-bold">Passenger</label>
          <select id={`cabin-pax-${flightId}`} value={passengerId} onChange={(e) => setPassengerId(e.target.value)} className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg" aria-invalid={tried && problems.passenger ? true : undefined}>
            <option value="">Choose…</option>
            {passengers.data?.passengers.map((p) => <option key={p.id} value={p.id}>{p.lastName}, {p.firstName} · {p.pnr} · booked {cabinName(p.cabin)}</option>)}
          </select>
          {tried && problems.passenger && <p className="mt-1 font-bold text-alert">{problems.passenger}</p>}
        </div>
        <div>
          <label htmlFor={`cabin-flown-${flightId}`} className="mb-1 block font-bold">Cabin flown</label>
          <select id={`cabin-flown-${flightId}`} value={flownCabin} onChange={(e) => setFlownCabin(e.target.value)} className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg">
            {CABIN_CODES.map((c) => <option key={c} value={c}>{cabinName(c)}</option>)}
          </select>
        </div>
        <TextField label={`Fare difference (${currency})`} value={difference} onChange={setDifference} inputMode="decimal" error={tried ? problems.difference : undefined} hint="Between the fares of the two cabins for this journey." />
        <TextField label="Why" value={reason} onChange={setReason} maxLength={200} error={tried ? problems.reason : undefined} />
        <div className="sm:col-span-2">
          <Button type="submit" variant="secondary" disabled={record.isPending}>{record.isPending ? 'Recording…' : 'Record the cabin change'}</Button>
          <Problem error={record.error} />
        </div>
      </form>
    </section>
  );
}
