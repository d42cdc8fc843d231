import { Button } from '../../../components/ui/button';
import { CellInput } from './cell-input';
import { rowId, type DraftErrors, type RateRow } from '../model/profile-draft';

interface Props {
  rates: RateRow[];
  errors: DraftErrors;
  onChange: (rates: RateRow[]) => void;
}

/** Booking show rates by segment: one row per cabin, local and connecting passengers side by side. */
export function BookingRatesTable({ rates, errors, onChange }: Props) {
  const set = (id: string, patch: Partial<RateRow>) => onChange(rates.map((r) => (r.id === id ? { ...r, ...patch } : r)));
  return (
    <fieldset className="space-y-2">
      <legend className="text-lg font-bold">Booking rates by segment</legend>
      <p className="text-sm text-ink-soft">The chance that a booked passenger shows, before check-in tells us more: 0.92 or 92 %.</p>
      <table>
        <caption className="sr-only">Booking rates by cabin and segment</caption>
        <thead className="bg-harbour-soft text-left">
          <tr>
            <th scope="col" className="px-2 py-2">Cabin</th>
            <th scope="col" className="px-2 py-2">Local</th>
            <th scope="col" className="px-2 py-2">Connecting</th>
            <th scope="col" className="px-2 py-2"><span className="sr-only">Remove</span></th>
          </tr>
        </thead>
        <tbody>
          {rates.map((r, i) => {
            const cabin = r.cabin.trim().toUpperCase();
            return (
              <tr key={r.id} className="border-t border-line align-top">
                <td className="px-2 py-1">
                  <CellInput label={`Row ${i + 1}: cabin letter`} inputMode="text" className="w-16" maxLength={1} value={r.cabin} onChange={(v) => set(r.id, { cabin: v })} error={errors[`rates.${i}.cabin`]} />
                </td>
                <td className="px-2 py-1">
                  <CellInput label={`Cabin ${cabin || i + 1}: local booking rate`} value={r.local} onChange={(v) => set(r.id, { local: v })} error={errors[`bookingRates.local.${cabin}`]} />
                </td>
                <td className="px-2 py-1">
                  <CellInput label={`Cabin ${cabin || i + 1}: connecting booking rate`} value={r.connecting} onChange={(v) => set(r.id, { connecting: v })} error={errors[`bookingRates.connecting.${cabin}`]} />
                </td>
                <td className="px-2 py-1">
                  <Button type="button" variant="quiet" aria-label={`Remove cabin ${cabin || i + 1}`} disabled={rates.length <= 1} onClick={() => onChange(rates.filter((x) => x.id !== r.id))}>
                    Remove
                  </Button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {errors.bookingRates && <p className="font-bold text-alert">{errors.bookingRates}</p>}
      <Button type="button" variant="secondary" onClick={() => onChange([...rates, { id: rowId(), cabin: '', local: '', connecting: '' }])}>
        Add a cabin
      </Button>
    </fieldset>
  );
}
