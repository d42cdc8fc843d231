import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import type { CareSetup, PartnerHotel } from '@shared/schemas/care';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/page';
import { TextField } from '../../../components/ui/text-field';
import { ApiRequestError } from '../../../lib/api-client';
import { moneyFieldText, readMoneyField } from '../../../lib/money';
import { careSetupQueryOptions, useSaveCareSetup } from '../api/care-setup';

/** The station's meal allowances and partner hotels, which the desk's care panel proposes from. */
export function CareSetupEditor({ stationId }: { stationId: number }) {
  const saved = useQuery(careSetupQueryOptions(stationId));
  if (saved.error) return <p role="alert" className="font-bold text-alert">{saved.error.message}</p>;
  if (!saved.data) return <p className="text-ink-soft">Loading the care setup…</p>;
  return <CareSetupForm key={stationId} stationId={stationId} saved={saved.data} />;
}

interface HotelDraft { id?: string; name: string; address: string; phone: string; rate: string }

const draftOf = (h: PartnerHotel, currency: string): HotelDraft => ({ id: h.id, name: h.name, address: h.address, phone: h.phone, rate: moneyFieldText(h.nightlyRateMinor, currency, { keepDecimals: true }) });
const text = (minor: number, currency: string, configured: boolean) => (configured ? moneyFieldText(minor, currency, { keepDecimals: true }) : '');

function CareSetupForm({ stationId, saved }: { stationId: number; saved: CareSetup }) {
  const { currency } = saved;
  const [refreshment, setRefreshment] = useState(text(saved.refreshmentMinor, currency, saved.configured));
  const [meal, setMeal] = useState(text(saved.mealMinor, currency, saved.configured));
  const [hotels, setHotels] = useState<HotelDraft[]>(saved.hotels.map((h) => draftOf(h, currency)));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState(false);
  const save = useSaveCareSetup(stationId);

  const setHotel = (i: number, patch: Partial<HotelDraft>) => setHotels(hotels.map((h, j) => (j === i ? { ...h, ...patch } : h)));

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setDone(false);
    const problems: Record<string, string> = {};
    const money = (value: string, field: string, label: string) => {
      const read = readMoneyField(value, currency, label, { allowZero: true });
      if (!read.ok) problems[field] = read.message;
      return read.ok ? read.minor : 0;
    };
    const body = {
      refreshmentMinor: money(refreshment, 'refreshmentMinor', 'Refreshment allowance'),
      mealMinor: money(meal, 'mealMinor', 'Meal allowance'),
      hotels: hotels.map((h, i) => ({ ...(h.id ? { id: h.id } : {}), name: h.name, address: h.address, phone: h.phone, nightlyRateMinor: money(h.rate, `hotels.${i}.nightlyRateMinor`, 'Nightly rate') })),
    };
    setErrors(problems);
    if (Object.keys(problems).length) return;
    save.mutate(body, {
      onSuccess: (setup) => {
        setHotels(setup.hotels.map((h) => draftOf(h, currency)));
        setDone(true);
      },
      onError: (err) => {
        if (err instanceof ApiRequestError) setErrors(Object.fromEntries((err.body.details ?? []).map((d) => [d.field, d.rule])));
      },
    });
  };

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="Care for waiting passengers">
      <p className="text-ink-soft">
        What the desk hands out to denied passengers who wait, in {currency}. The desk sees these amounts next to the care the rule calls for.
      </p>
      {!saved.configured && <p className="font-bold">Not set yet: the desk sees no suggested amounts until you save.</p>}
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label={`Refreshment allowance (${currency})`} value={refreshment} onChange={setRefreshment} error={errors.refreshmentMinor} hint="Per passenger, for drinks and a snack." inputMode="decimal" />
        <TextField label={`Meal allowance (${currency})`} value={meal} onChange={setMeal} error={errors.mealMinor} hint="Per passenger and meal." inputMode="decimal" />
      </div>
      <fieldset className="space-y-3">
        <legend className="text-lg font-bold">Partner hotels</legend>
        {hotels.length === 0 && <p className="text-ink-soft">No partner hotels yet.</p>}
        {hotels.map((h, i) => (
          <div key={h.id ?? `new-${i}`} className="grid gap-2 rounded-md border-2 border-line p-3 sm:grid-cols-2" role="group" aria-label={`Hotel ${i + 1}`}>
            <TextField label="Hotel name" value={h.name} onChange={(v) => setHotel(i, { name: v })} error={errors[`hotels.${i}.name`]} />
            <TextField label="Phone" value={h.phone} onChange={(v) => setHotel(i, { phone: v })} error={errors[`hotels.${i}.phone`]} />
            <TextField label="Address" value={h.address} onChange={(v) => setHotel(i, { address: v })} error={errors[`hotels.${i}.address`]} />
            <TextField label={`Nightly rate (${currency})`} value={h.rate} onChange={(v) => setHotel(i, { rate: v })} error={errors[`hotels.${i}.nightlyRateMinor`]} inputMode="decimal" />
            <div className="sm:col-span-2">
              <Button type="button" variant="quiet" onClick={() => setHotels(hotels.filter((_, j) => j !== i))}>Remove {h.name || 'this hotel'}</Button>
            </div>
          </div>
        ))}
        <Button type="button" variant="secondary" onClick={() => setHotels([...hotels, { name: '', address: '', phone: '', rate: '' }])}>Add a partner hotel</Button>
      </fieldset>
      {errors.hotels && <p role="alert" className="font-bold text-alert">{errors.hotels}</p>}
      {save.error && !(save.error instanceof ApiRequestError && save.error.body.details?.length) && <p role="alert" className="font-bold text-alert">{save.error.message}</p>}
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={save.isPending}>{save.isPending ? 'Saving…' : 'Save care setup'}</Button>
        {done && <p role="status" className="font-bold">Saved.</p>}
      </div>
      <Caution>These amounts are the station’s own policy. The rule asks for care in reasonable relation to the wait; the applicable regulation, the contract of carriage and the carrier’s compliance staff decide.</Caution>
    </form>
  );
}
