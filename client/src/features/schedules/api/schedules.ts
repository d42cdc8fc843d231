import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { scheduleListSchema, scheduleResultSchema, type ScheduleCreateBody, type ScheduleUpdateBody } from '@shared/schemas/admin-flights';
import { api } from '../../../lib/api-client';

export const scheduleKeys = { all: ['schedules'] as const, list: (stationId: number) => [...scheduleKeys.all, stationId] as const };

export const schedulesQueryOptions = (stationId: number) =>
  queryOptions({ queryKey: scheduleKeys.list(stationId), queryFn: ({ signal }) => api.get(`/stations/${stationId}/schedules`, scheduleListSchema, signal) });

function useInvalidate() {
  const qc = useQueryClient();
  // Saving a schedule makes flights: the flight lists and the departures board refetch (their query roots).
  return () => Promise.all([qc.invalidateQueries({ queryKey: scheduleKeys.all }), qc.invalidateQueries({ queryKey: ['admin-flights'] }), qc.invalidateQueries({ queryKey: ['departures'] })]);
}

export function useCreateSchedule(stationId: number) {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: (body: ScheduleCreateBody) => api.post(`/stations/${stationId}/schedules`, scheduleResultSchema, body), onSuccess: invalidate });
}

export function useUpdateSchedule() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: ({ id, body }: { id: number; body: ScheduleUpdateBody }) => api.patch(`/schedules/${id}`, scheduleResultSchema, body), onSuccess: invalidate });
}

export function useCancelSchedule() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: (id: number) => api.post(`/schedules/${id}/cancel`, scheduleResultSchema), onSuccess: invalidate });
}
