// Care costs (meals, hotel, transport, calls) for finance, apart from compensation. The list and the CSV link use
// the very same query string, so the export holds what the screen shows filtered.
import { queryOptions } from '@tanstack/react-query';
import { careLedgerResponseSchema } from '@shared/schemas/care';
import { api } from '../../../lib/api-client';

export interface CareLedgerFilters {
  stationId: string;
  from: string;
  to: string;
}

export const EMPTY_CARE_FILTERS: CareLedgerFilters = { stationId: '', from: '', to: '' };

export const careLedgerKeys = {
  all: ['care-ledger'] as const,
  list: (query: string) => [...careLedgerKeys.all, query] as const,
};

export function careLedgerQueryString(f: CareLedgerFilters): string {
  const params = new URLSearchParams();
  if (f.stationId) params.set('stationId', f.stationId);
  if (f.from) params.set('from', f.from);
  if (f.to) params.set('to', f.to);
  return params.toString();
}

export const careLedgerQueryOptions = (filters: CareLedgerFilters) => {
  const query = careLedgerQueryString(filters);
  return queryOptions({ queryKey: careLedgerKeys.list(query), queryFn: ({ signal }) => api.get(`/care/ledger?${query}`, careLedgerResponseSchema, signal) });
};

export const careLedgerCsvHref = (filters: CareLedgerFilters) => `/api/care/ledger.csv?${careLedgerQueryString(filters)}`;
