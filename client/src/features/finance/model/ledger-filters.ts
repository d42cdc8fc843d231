// The ledger's filters as the screen holds them, and as the API (list and CSV alike) reads them.
import type { CompensationStateCode } from '@shared/schemas/finance';
import type { RegimeCode } from '@shared/schemas/common';
import type { Medium } from '@shared/compensation/media';

export interface LedgerFilters {
  stationId: number | null;
  from: string;
  to: string;
  regime: RegimeCode | '';
  state: CompensationStateCode | '';
  medium: Medium | '';
  due: 'overdue' | 'due-soon' | '';
  page: number;
  pageSize: number;
}

export const EMPTY_FILTERS: LedgerFilters = { stationId: null, from: '', to: '', regime: '', state: '', medium: '', due: '', page: 1, pageSize: 50 };

/** Only the filters that are set; paging only for the on-screen list, never for the export. */
export function ledgerQueryString(f: LedgerFilters, paged: boolean): string {
  const params = new URLSearchParams();
  if (f.stationId !== null) params.set('stationId', String(f.stationId));
  if (f.from) params.set('from', f.from);
  if (f.to) params.set('to', f.to);
  if (f.regime) params.set('regime', f.regime);
  if (f.state) params.set('state', f.state);
  if (f.medium) params.set('medium', f.medium);
  if (f.due) params.set('due', f.due);
  if (paged) {
    params.set('page', String(f.page));
    params.set('pageSize', String(f.pageSize));
  }
  return params.toString();
}

/** A changed filter starts again at the first page. */
export function withFilter<K extends keyof LedgerFilters>(f: LedgerFilters, key: K, value: LedgerFilters[K]): LedgerFilters {
  return { ...f, [key]: value, page: key === 'page' ? (value as number) : 1 };
}
