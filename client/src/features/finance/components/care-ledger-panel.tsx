import { useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { CareLedgerResponse } from '@shared/schemas/care';
import { Caution, Panel } from '../../../components/ui/page';
import { formatMoney } from '../../../lib/format';
import { careLedgerCsvHref, careLedgerQueryOptions, EMPTY_CARE_FILTERS, type CareLedgerFilters } from '../api/care-ledger-api';
import { DateField, DownloadLink, SelectField, type StationOption } from './field';

const KIND_WORDS: Record<string, string> = { meal: 'Meals', refreshment: 'Refreshments', hotel: 'Hotel nights', transport: 'Transport', communication: 'Calls and messages' };
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** What the carrier spent looking after denied passengers while they waited; never added to compensation. */
export function CareLedgerPanel({ stations }: { stations: StationOption[] }) {
  const [filters, setFilters] = useState<CareLedgerFilters>(EMPTY_CARE_FILTERS);
  const { data, isPending, error } = useQuery({ ...careLedgerQueryOptions(filters), placeholderData: keepPreviousData });
  const set = (field: keyof CareLedgerFilters) => (value: string) => setFilters({ ...filters, [field]: value });
  return (
    <Panel title="Care costs" headingId="care-costs">
      <p className="mb-3 text-ink-soft">Meals, hotel nights, transport and calls paid for while denied passengers waited. Kept apart from compensation; care given free of charge is recorded on the case, not here.</p>
      <div className="grid gap-3 sm:grid-cols-3">
        <SelectField label="Station (care costs)" value={filters.stationId} onChange={set('stationId')}>
          <option value="">All my stations</option>
          {stations.map((s) => <option key={s.id} value={String(s.id)}>{s.iata} · {s.name}</option>)}
        </SelectField>
        <DateField label="Service date from (care costs)" value={filters.from} onChange={set('from')} />
        <DateField label="Service date to (care costs)" value={filters.to} onChange={set('to')} />
      </div>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <DownloadLink href={careLedgerCsvHref(filters)}>Export CSV of care costs</DownloadLink>
      </div>
      <div className="mt-3"><Caution>The care proposed follows the configured rules; what was given and its cost are as the desk recorded them. The regulation, the contract of carriage and the carrier’s compliance staff decide what was owed.</Caution></div>
      {isPending && <p className="mt-3 text-ink-soft">Loading care costs…</p>}
      {error && <p role="alert" className="mt-3 font-bold text-alert">{error.message}</p>}
      {data && <CareLedgerBody data={data} />}
    </Panel>
  );
}

function CareLedgerBody({ data }: { data: CareLedgerResponse }) {
  if (!data.totals.length) return <p className="mt-3 text-ink-soft">No care costs match these filters.</p>;
  return (
    <div className="mt-3 space-y-4">
      <section aria-label="Care totals per currency" className="flex flex-wrap gap-3">
        {data.totals.map((t) => (
          <dl key={t.currency} className="min-w-56 rounded-md border-2 border-line bg-paper px-4 py-3" data-testid={`care-total-${t.currency}`}>
            <dt className="text-sm font-bold uppercase tracking-wide text-ink-soft">{t.currency} · {plural(t.count, 'item')}</dt>
            <dd className="text-2xl font-bold">{formatMoney(t.amountMinor, t.currency)}</dd>
          </dl>
        ))}
      </section>
      <div className="flex flex-wrap gap-6">
        <Totals caption="By kind" head="Kind" rows={data.byKind.map((k) => ({ key: `${k.kind}-${k.currency}`, label: KIND_WORDS[k.kind] ?? k.kind, ...k }))} />
        <Totals caption="By station" head="Station" rows={data.byStation.map((s) => ({ key: `${s.stationId}-${s.currency}`, label: s.station, ...s }))} />
        <Totals caption="By flight" head="Flight" rows={data.byFlight.map((f) => ({ key: `${f.flightId}-${f.currency}`, label: `${f.flight} · ${f.serviceDate} · ${f.station}`, ...f }))} />
      </div>
      <table className="w-full border-collapse text-left" data-testid="care-rows">
        <caption className="text-left font-bold">Items{data.rows.length >= 5_000 ? ' (newest 5,000; the totals and the CSV hold every one)' : ''}</caption>
        <thead>
          <tr>{['Date', 'Flight', 'Passenger', 'Kind', 'What', 'Amount', 'Provided by'].map((h) => <th key={h} scope="col" className="border-b-2 border-line p-2">{h}</th>)}</tr>
        </thead>
        <tbody>
          {data.rows.map((r) => (
            <tr key={r.id} className="border-b border-line">
              <td className="p-2">{r.serviceDate}</td>
              <td className="p-2">{r.flight} · {r.station}</td>
              <td className="p-2">{r.passengerName}</td>
              <td className="p-2">{KIND_WORDS[r.kind] ?? r.kind}</td>
              <td className="p-2">{r.description}</td>
              <td className="p-2 text-right tabular-nums">{formatMoney(r.amountMinor, r.currency)}</td>
              <td className="p-2">{r.providedBy}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Totals({ caption, head, rows }: { caption: string; head: string; rows: { key: string; label: string; currency: string; count: number; amountMinor: number }[] }) {
  return (
    <table className="border-collapse text-left">
      <caption className="text-left font-bold">{caption}</caption>
      <thead>
        <tr>{[head, 'Items', 'Amount'].map((h) => <th key={h} scope="col" className="border-b-2 border-line p-2">{h}</th>)}</tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.key}>
            <th scope="row" className="p-2 font-normal">{r.label}</th>
            <td className="p-2 text-right tabular-nums">{r.count}</td>
            <td className="p-2 text-right tabular-nums">{formatMoney(r.amountMinor, r.currency)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
