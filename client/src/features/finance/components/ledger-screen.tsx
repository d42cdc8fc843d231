import { useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { Caution, Panel } from '../../../components/ui/page';
import { ledgerCsvHref, ledgerQueryOptions } from '../api/finance-api';
import { EMPTY_FILTERS, withFilter } from '../model/ledger-filters';
import { DownloadLink, type StationOption } from './field';
import { LedgerFiltersBar } from './ledger-filters-bar';
import { LedgerTable } from './ledger-table';
import { LedgerTotals, MediumTotals } from './ledger-totals';
import { RefundTotals } from './refund-totals';

export function LedgerScreen({ stations }: { stations: StationOption[] }) {
  const [filters, setFilters] = useState(EMPTY_FILTERS);
  const { data, isPending, error } = useQuery({ ...ledgerQueryOptions(filters), placeholderData: keepPreviousData });
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  return (
    <div className="space-y-4">
      <Panel>
        <LedgerFiltersBar stations={stations} filters={filters} onChange={setFilters} />
        <div className="mt-3 flex flex-wrap items-center gap-3">
          <DownloadLink href={ledgerCsvHref(filters)}>Export CSV of these rows</DownloadLink>
          <span className="text-sm text-ink-soft">The export holds every row these filters select, on all pages.</span>
        </div>
      </Panel>
      <Caution />
      {isPending && <p className="text-ink-soft">Loading the ledger…</p>}
      {error && <p role="alert" className="font-bold text-alert">{error.message}</p>}
      {data && (
        <>
          <LedgerTotals totals={data.totals} total={data.total} />
          <MediumTotals byMedium={data.byMedium} />
          <RefundTotals refundTotals={data.refundTotals} />
          {data.rows.length > 0 && <LedgerTable rows={data.rows} />}
          {pages > 1 && (
            <nav aria-label="Pages" className="flex items-center gap-3">
              <Button type="button" variant="secondary" disabled={filters.page <= 1} onClick={() => setFilters(withFilter(filters, 'page', filters.page - 1))}>Previous</Button>
              <span>Page {filters.page} of {pages}</span>
              <Button type="button" variant="secondary" disabled={filters.page >= pages} onClick={() => setFilters(withFilter(filters, 'page', filters.page + 1))}>Next</Button>
            </nav>
          )}
        </>
      )}
    </div>
  );
}
