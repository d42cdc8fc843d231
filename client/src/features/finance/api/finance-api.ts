// Finance's queries and actions. Lists are fetched with the very query string the CSV link uses, so an export
// holds exactly what the screen shows filtered.
import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  compensationResponseSchema,
  periodReportSchema,
  ledgerResponseSchema,
  reconciliationDetailSchema,
  reconciliationRunsResponseSchema,
  startReconciliationResponseSchema,
} from '@shared/schemas/finance';
import { alertKeys } from '../../../lib/alert-keys';
import { api } from '../../../lib/api-client';
import { ledgerQueryString, type LedgerFilters } from '../model/ledger-filters';

export const financeKeys = {
  all: ['finance'] as const,
  ledger: (query: string) => [...financeKeys.all, 'ledger', query] as const,
  runs: () => [...financeKeys.all, 'runs'] as const,
  run: (id: number) => [...financeKeys.all, 'run', id] as const,
  report: (quarter: string, stationId: number) => [...financeKeys.all, 'report', quarter, stationId] as const,
};

export const ledgerQueryOptions = (filters: LedgerFilters) => {
  const query = ledgerQueryString(filters, true);
  return queryOptions({ queryKey: financeKeys.ledger(query), queryFn: () => api.get(`/finance/compensations?${query}`, ledgerResponseSchema) });
};

/** The CSV export of exactly the filtered rows (every page of them). */
export const ledgerCsvHref = (filters: LedgerFilters) => `/api/finance/compensations.csv?${ledgerQueryString(filters, false)}`;

export const runsQueryOptions = () =>
  queryOptions({
    queryKey: financeKeys.runs(),
    queryFn: () => api.get('/finance/reconciliations', reconciliationRunsResponseSchema),
    refetchInterval: (q) => (q.state.data?.runs.some((r) => r.status === 'running') ? 1_500 : false),
  });

/** A running reconciliation is polled for its progress until it is done. */
export const runQueryOptions = (id: number) =>
  queryOptions({
    queryKey: financeKeys.run(id),
    queryFn: () => api.get(`/finance/reconciliations/${id}`, reconciliationDetailSchema),
    refetchInterval: (q) => (q.state.data?.run.status === 'running' ? 1_000 : false),
  });

export const reportQueryOptions = (quarter: string, stationId: number) =>
  queryOptions({
    queryKey: financeKeys.report(quarter, stationId),
    queryFn: () => api.get(`/finance/report?${new URLSearchParams({ quarter, stationId: String(stationId) })}`, periodReportSchema),
  });

export const reportCsvHref = (quarter: string, stationId: number) => `/api/finance/report.csv?${new URLSearchParams({ quarter, stationId: String(stationId) })}`;

export function useCompensationAction() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, action, reason }: { id: number; action: 'void' | 'reissue'; reason: string }) =>
      api.post(`/compensations/${id}/${action}`, compensationResponseSchema, { reason }),
    // A void raises an alert and a re-issue resolves it: the alerts list refreshes with the ledger.
    onSettled: () => Promise.all([qc.invalidateQueries({ queryKey: [...financeKeys.all, 'ledger'] }), qc.invalidateQueries({ queryKey: alertKeys.all })]),
  });
}

export function useStartReconciliation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (stationId: number | null) => api.post('/finance/reconciliations', startReconciliationResponseSchema, stationId === null ? {} : { stationId }),
    onSuccess: () => qc.invalidateQueries({ queryKey: financeKeys.runs() }),
  });
}

export function useResolveDifference(runId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ differenceId, note }: { differenceId: number; note: string }) =>
      api.post(`/finance/reconciliations/${runId}/differences/${differenceId}/resolve`, null, { note }),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: financeKeys.run(runId) }), qc.invalidateQueries({ queryKey: financeKeys.runs() })]),
  });
}
