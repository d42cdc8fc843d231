import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { adminFlightListSchema, adminFlightSchema, type FlightCreateBody, type FlightUpdateBody } from '@shared/schemas/admin-flights';
import { api } from '../../../lib/api-client';

export const adminFlightKeys = {
  all: ['admin-flights'] as const,
  list: (stationId: number, from: string, to: string) => [...adminFlightKeys.all, stationId, from, to] as const,
};

export const adminFlightsQueryOptions = (stationId: number, from: string, to: string) =>
  queryOptions({ queryKey: adminFlightKeys.list(stationId, from, to), queryFn: ({ signal }) => api.get(`/stations/${stationId}/flights?from=${from}&to=${to}`, adminFlightListSchema, signal) });

function useInvalidate() {
  const qc = useQueryClient();
  // The departures board and flight desks show the same flights: their roots refetch too.
  return () => Promise.all([qc.invalidateQueries({ queryKey: adminFlightKeys.all }), qc.invalidateQueries({ queryKey: ['departures'] }), qc.invalidateQueries({ queryKey: ['flights'] })]);
}

export function useCreateFlight(stationId: number) {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: (body: FlightCreateBody) => api.post(`/stations/${stationId}/flights`, adminFlightSchema, body), onSuccess: invalidate });
}

export function useUpdateFlight() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: ({ id, body }: { id: number; body: FlightUpdateBody }) => api.patch(`/flights/${id}`, adminFlightSchema, body), onSuccess: invalidate });
}

export function useCancelFlight() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: ({ id, reason }: { id: number; reason: string }) => api.post(`/flights/${id}/cancel`, adminFlightSchema, { reason }), onSuccess: invalidate });
}
