import { useId, useState, type FormEvent } from 'react';
import { CARE_KINDS, type CareKind } from '@shared/compensation/care-rules';
import type { FlightCareResponse, PassengerCare } from '@shared/schemas/care';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { readMoneyField } from '../../../lib/money';
import { useRecordCare } from '../api/desk-care';

const LABELS: Record<CareKind, string> = { meal: 'Meal', refreshment: 'Refreshments', hotel: 'Hotel night', transport: 'Transport', communication: 'Calls or messages' };

/** What was handed over or booked, its cost to the carrier and who provided it. */
export function CareGivenForm({ flightId, passenger: p, data }: { flightId: number; passenger: PassengerCare; data: FlightCareResponse }) {
  const [kind, setKind] = useState<CareKind>('meal');
  const [description, setDescription] = useState('');
  const [amount, setAmount] = useState('');
  const [hotelId, setHotelId] = useState('');
  const [providedBy, setProvidedBy] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const record = useRecordCare(flightId);
  const ids = { kind: useId(), hotel: useId() };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const problems: Record<string, string> = {};
    let amountMinor: number | undefined;
    if (amount.trim()) {
      const read = readMoneyField(amount, data.currency, 'Cost', { allowZero: true });
      if (read.ok) amountMinor = read.minor;
      else problems.amountMinor = read.message;
    }
    if (kind === 'hotel' && data.hotels.length > 0 && !hotelId) problems.hotelId = 'Choose the partner hotel booked.';
    setErrors(problems);
    if (Object.keys(problems).length) return;
    record.mutate(
      { compensationId: p.compensationId, kind, description, providedBy, ...(amountMinor !== undefined ? { amountMinor } : {}), ...(kind === 'hotel' && hotelId ? { hotelId } : {}) },
      {
        onSuccess: () => { setDescription(''); setAmount(''); setErrors({}); },
        onError: (err) => setErrors(err instanceof ApiRequestError ? Object.fromEntries((err.body.details ?? [{ field: 'form', rule: err.message }]).map((d) => [d.field, d.rule])) : { form: 'The care could not be recorded.' }),
      },
    );
  };

  return (
    <form onSubmit={submit} noValidate className="mt-3 grid gap-2 rounded-md bg-paper p-3 sm:grid-cols-2" aria-label={`Record care given to ${p.passengerName}`}>
      <div>
        <label htmlFor={ids.kind} className="mb-1 block font-bold">Care given</label>
        <select id={ids.kind} value={kind} onChange={(e) => setKind(e.target.value as CareKind)} className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg">
          {CARE_KINDS.map((k) => <option key={k} value={k}>{LABELS[k]}</option>)}
        </select>
      </div>
      {kind === 'hotel' && data.hotels.length > 0 && (
        <div>
          <label htmlFor={ids.hotel} className="mb-1 block font-bold">Partner hotel</label>
          <select id={ids.hotel} value={hotelId} onChange={(e) => setHotelId(e.target.value)} aria-invalid={errors.hotelId ? true : undefined} className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg">
            <option value="">Choose…</option>
            {data.hotels.map((h) => <option key={h.id} value={h.id}>{h.name}</option>)}
          </select>
          {errors.hotelId && <p className="mt-1 font-bold text-alert">{errors.hotelId}</p>}
        </div>
      )}
      <TextField label="What was given" value={description} onChange={setDescription} error={errors.description} hint="For example: meal voucher, taxi both ways." />
      <TextField label={`Cost (${data.currency}, optional)`} value={amount} onChange={setAmount} error={errors.amountMinor} inputMode="decimal" />
      <TextField label="Provided by" value={providedBy} onChange={setProvidedBy} error={errors.providedBy} hint="The agent, the hotel desk or the taxi company." />
      <div className="flex items-end">
        <Button type="submit" variant="secondary" disabled={record.isPending}>Record care given</Button>
      </div>
      {errors.form && <p role="alert" className="font-bold text-alert sm:col-span-2">{errors.form}</p>}
    </form>
  );
}
