import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { alertResponseSchema, alertsResponseSchema } from '@shared/schemas/alerts';
import { alertKeys } from '../../../lib/alert-keys';
import { api } from '../../../lib/api-client';

/** Alerts are rare and matter: a short poll keeps station and finance screens current without a socket topic. */
const ALERT_REFETCH_MS = 15_000;

export const alertsQueryOptions = (stationId?: number) =>
  queryOptions({
    queryKey: alertKeys.list(stationId),
    queryFn: () => api.get(`/alerts${stationId === undefined ? '' : `?stationId=${stationId}`}`, alertsResponseSchema),
    refetchInterval: ALERT_REFETCH_MS,
  });

export function useAcknowledgeAlert() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.post(`/alerts/${id}/acknowledge`, alertResponseSchema),
    onSettled: () => qc.invalidateQueries({ queryKey: alertKeys.all }),
  });
}
