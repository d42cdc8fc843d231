import { COMPENSATION_STATES, STATE_LABELS } from '@shared/schemas/finance';
import { REGIMES, REGIME_LABELS } from '@shared/schemas/common';
import { MEDIA } from '@shared/compensation/media';
import { MEDIUM_LABELS } from '@shared/schemas/payment-media';
import { withFilter, type LedgerFilters } from '../model/ledger-filters';
import { DateField, SelectField, type StationOption } from './field';

export function LedgerFiltersBar({ stations, filters, onChange }: { stations: StationOption[]; filters: LedgerFilters; onChange: (f: LedgerFilters) => void }) {
  return (
    <form role="search" aria-label="Filter the ledger" className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4" onSubmit={(e) => e.preventDefault()}>
      <SelectField label="Station" value={filters.stationId === null ? '' : String(filters.stationId)} onChange={(v) => onChange(withFilter(filters, 'stationId', v ? Number(v) : null))}>
        <option value="">All my stations</option>
        {stations.map((s) => (
          <option key={s.id} value={s.id}>
            {s.iata} · {s.name}
          </option>
        ))}
      </SelectField>
      <DateField label="Flights from" value={filters.from} onChange={(v) => onChange(withFilter(filters, 'from', v))} />
      <DateField label="Flights to" value={filters.to} onChange={(v) => onChange(withFilter(filters, 'to', v))} />
      <SelectField label="Regime" value={filters.regime} onChange={(v) => onChange(withFilter(filters, 'regime', v as LedgerFilters['regime']))}>
        <option value="">Any regime</option>
        {REGIMES.map((r) => (
          <option key={r} value={r}>
            {REGIME_LABELS[r]}
          </option>
        ))}
      </SelectField>
      <SelectField label="State" value={filters.state} onChange={(v) => onChange(withFilter(filters, 'state', v as LedgerFilters['state']))}>
        <option value="">Any state</option>
        {COMPENSATION_STATES.map((s) => (
          <option key={s} value={s}>
            {STATE_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Medium" value={filters.medium} onChange={(v) => onChange(withFilter(filters, 'medium', v as LedgerFilters['medium']))}>
        <option value="">Any medium</option>
        {MEDIA.map((m) => (
          <option key={m} value={m}>
            {MEDIUM_LABELS[m]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Deadline" value={filters.due} onChange={(v) => onChange(withFilter(filters, 'due', v as LedgerFilters['due']))}>
        <option value="">Any</option>
        <option value="due-soon">Due soon (owed, deadline within 2 h)</option>
        <option value="overdue">Overdue (owed, past the rule’s deadline)</option>
      </SelectField>
    </form>
  );
}
