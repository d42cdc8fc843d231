import { useId } from 'react';
import type { ConnectionFilter, PassengerFilters, StatusFilter } from '../model/passenger-filters';
import { cabinName, PASSENGER_STATUS, ssrWords } from '../model/words';

const STATUS_CHOICES: { value: StatusFilter; label: string }[] = [
  { value: 'all', label: 'Everyone' },
  { value: 'not-boarded', label: 'Still to board' },
  ...(['booked', 'checked-in', 'boarded', 'offloaded', 'cancelled'] as const).map((s) => ({ value: s, label: PASSENGER_STATUS[s].word })),
];

const CONNECTION_CHOICES: { value: ConnectionFilter; label: string }[] = [
  { value: 'all', label: 'All' },
  { value: 'connecting', label: 'Connecting in' },
  { value: 'local', label: 'Starting here' },
];

export function PassengerFilterBar({ filters, onChange, cabins, ssrCodes }: { filters: PassengerFilters; onChange: (f: PassengerFilters) => void; cabins: string[]; ssrCodes: string[] }) {
  const set = <K extends keyof PassengerFilters>(key: K, value: PassengerFilters[K]) => onChange({ ...filters, [key]: value });
  return (
    <>
      <Select label="Status" value={filters.status} onChange={(v) => set('status', v as StatusFilter)} options={STATUS_CHOICES} />
      <Select label="Cabin" value={filters.cabin} onChange={(v) => set('cabin', v)} options={[{ value: 'all', label: 'All cabins' }, ...cabins.map((c) => ({ value: c, label: cabinName(c) }))]} />
      <Select label="Connection" value={filters.connection} onChange={(v) => set('connection', v as ConnectionFilter)} options={CONNECTION_CHOICES} />
      <Select
        label="SSR"
        value={filters.ssr}
        onChange={(v) => set('ssr', v)}
        options={[{ value: 'all', label: 'All' }, { value: 'any', label: 'Any SSR' }, ...ssrCodes.map((c) => ({ value: c, label: `${c} · ${ssrWords(c)}` }))]}
      />
    </>
  );
}

function Select({ label, value, onChange, options }: { label: string; value: string; onChange: (v: string) => void; options: { value: string; label: string }[] }) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="mb-1 block font-bold">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className="max-w-64 rounded-md border-2 border-line bg-card px-3 py-2 text-lg focus:border-harbour">
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}
