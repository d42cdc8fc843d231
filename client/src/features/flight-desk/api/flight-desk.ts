import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { deskPassengersSchema, flightDeskSchema, flightEventTrailSchema, forecastHistorySchema, type setShockBodySchema } from '@shared/schemas/flight-desk';
import { api, apiRequest } from '../../../lib/api-client';

/** One key tree per flight, so a change notice reaches everything the desk shows with a single prefix. */
export const flightKeys = {
  all: ['flights'] as const,
  detail: (id: number) => [...flightKeys.all, 'detail', id] as const,
  passengers: (id: number) => [...flightKeys.detail(id), 'passengers'] as const,
  forecastHistory: (id: number) => [...flightKeys.detail(id), 'forecast-history'] as const,
  events: (id: number) => [...flightKeys.detail(id), 'events'] as const,
};

/** A slow safety net under the socket: a missed notice still shows up within a minute (a 304 when nothing moved). */
const SAFETY_REFETCH_MS = 60_000;
/**
 * Notices keep a mounted desk current, and a patch counts as fresh data. Opening the desk again asks at once: notices
 * went unheard while it was closed, and the answer is a 304 when nothing moved.
 */
const LIVE_STALE_MS = 0;

export const flightDeskQueryOptions = (id: number) =>
  queryOptions({
    queryKey: flightKeys.detail(id), staleTime: LIVE_STALE_MS, refetchInterval: SAFETY_REFETCH_MS,
    queryFn: ({ signal }) => api.get(`/flights/${id}`, flightDeskSchema, signal),
  });

export const deskPassengersQueryOptions = (id: number) =>
  queryOptions({
    queryKey: flightKeys.passengers(id), staleTime: LIVE_STALE_MS, refetchInterval: SAFETY_REFETCH_MS,
    queryFn: ({ signal }) => api.get(`/flights/${id}/passengers`, deskPassengersSchema, signal),
  });

export const forecastHistoryQueryOptions = (id: number) =>
  queryOptions({
    queryKey: flightKeys.forecastHistory(id), staleTime: LIVE_STALE_MS, refetchInterval: SAFETY_REFETCH_MS,
    queryFn: ({ signal }) => api.get(`/flights/${id}/forecast-history`, forecastHistorySchema, signal),
  });

export const flightEventsQueryOptions = (id: number) =>
  queryOptions({
    queryKey: flightKeys.events(id), staleTime: LIVE_STALE_MS, refetchInterval: SAFETY_REFETCH_MS,
    queryFn: ({ signal }) => api.get(`/flights/${id}/events`, flightEventTrailSchema, signal),
  });

export type SetShockBody = z.infer<typeof setShockBodySchema>;

export function useSetShock(flightId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SetShockBody) => apiRequest('PUT', `/flights/${flightId}/shock`, flightDeskSchema, body),
    // The answer is the desk at the new version; the notice of that version patches the lists (or they refetch).
    onSuccess: (desk) => qc.setQueryData(flightDeskQueryOptions(flightId).queryKey, (held) => (held && held.version > desk.version ? held : desk)),
  });
}
