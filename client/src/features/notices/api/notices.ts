import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { noticeDetailSchema, stationNoticeListSchema, stationNoticeSchema, type NoticesQuery } from '@shared/schemas/admin-notices';
import { api } from '../../../lib/api-client';

export const noticeKeys = {
  all: ['station-notices'] as const,
  list: (stationId: number, q: NoticesQuery) => [...noticeKeys.all, stationId, 'list', q] as const,
  detail: (stationId: number, id: string) => [...noticeKeys.all, stationId, 'detail', id] as const,
};

const search = (q: NoticesQuery) => new URLSearchParams(Object.entries(q).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)])).toString();

export const noticesQueryOptions = (stationId: number, q: NoticesQuery) =>
  queryOptions({ queryKey: noticeKeys.list(stationId, q), queryFn: ({ signal }) => api.get(`/stations/${stationId}/notices?${search(q)}`, stationNoticeListSchema, signal), refetchInterval: 15_000 });

export const noticeQueryOptions = (stationId: number, id: string) =>
  queryOptions({ queryKey: noticeKeys.detail(stationId, id), queryFn: ({ signal }) => api.get(`/stations/${stationId}/notices/${id}`, noticeDetailSchema, signal) });

export function useNoticeAction(stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, action }: { id: string; action: 'retry' | 'resend' }) => api.post(`/stations/${stationId}/notices/${id}/${action}`, stationNoticeSchema),
    onSuccess: () => qc.invalidateQueries({ queryKey: noticeKeys.all }),
  });
}
