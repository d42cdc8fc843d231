import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { deskPassengersSchema, flightDeskSchema, flightEventTrailSchema, forecastHistorySchema, type setShockBodySchema } from '@shared/schemas/flight-desk';
import { api, apiRequest } from '../../../lib/api-client';

/** One key tree per flight, so a change notice invalidates everything the desk shows with a single prefix. */
export const flightKeys = {
  all: ['flights'] as const,
  detail: (id: number) => [...flightKeys.all, 'detail', id] as const,
  passengers: (id: number) => [...flightKeys.detail(id), 'passengers'] as const,
  forecastHistory: (id: number) => [...flightKeys.detail(id), 'forecast-history'] as const,
  events: (id: number) => [...flightKeys.detail(id), 'events'] as const,
};

/** A slow safety net under the socket: a missed notice still shows up within a minute. */
const SAFETY_REFETCH_MS = 60_000;

export const flightDeskQueryOptions = (id: number) =>
  queryOptions({ queryKey: flightKeys.detail(id), queryFn: () => api.get(`/flights/${id}`, flightDeskSchema), refetchInterval: SAFETY_REFETCH_MS });

export const deskPassengersQueryOptions = (id: number) =>
  queryOptions({ queryKey: flightKeys.passengers(id), queryFn: () => api.get(`/flights/${id}/passengers`, deskPassengersSchema), refetchInterval: SAFETY_REFETCH_MS });

export const forecastHistoryQueryOptions = (id: number) =>
  queryOptions({ queryKey: flightKeys.forecastHistory(id), queryFn: () => api.get(`/flights/${id}/forecast-history`, forecastHistorySchema), refetchInterval: SAFETY_REFETCH_MS });

export const flightEventsQueryOptions = (id: number) =>
  queryOptions({ queryKey: flightKeys.events(id), queryFn: () => api.get(`/flights/${id}/events`, flightEventTrailSchema), refetchInterval: SAFETY_REFETCH_MS });

export type SetShockBody = z.infer<typeof setShockBodySchema>;

export function useSetShock(flightId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SetShockBody) => apiRequest('PUT', `/flights/${flightId}/shock`, flightDeskSchema, body),
    onSuccess: (desk) => {
      qc.setQueryData(flightKeys.detail(flightId), desk);
      // The odds history and the trail gained a point each; the passengers' figures may have moved too.
      return qc.invalidateQueries({ queryKey: flightKeys.detail(flightId), predicate: (q) => q.queryKey.length > flightKeys.detail(flightId).length });
    },
  });
}
