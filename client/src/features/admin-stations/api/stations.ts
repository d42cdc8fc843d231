import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { airportLookupSchema, stationSettingsListSchema, stationSettingsSchema, type StationCreateBody, type StationUpdateBody } from '@shared/schemas/admin-stations';
import { api } from '../../../lib/api-client';
import { sessionQueryOptions } from '../../../lib/session';

export const stationSettingsKeys = { all: ['station-settings'] as const, list: () => [...stationSettingsKeys.all, 'list'] as const, airport: (iata: string) => [...stationSettingsKeys.all, 'airport', iata] as const };

export const stationSettingsQueryOptions = () => queryOptions({ queryKey: stationSettingsKeys.list(), queryFn: ({ signal }) => api.get('/stations/settings', stationSettingsListSchema, signal) });

/** The reference airport data's entry for a code, so the admin sees the zone before opening the station. */
export const airportQueryOptions = (iata: string) =>
  queryOptions({ queryKey: stationSettingsKeys.airport(iata), queryFn: ({ signal }) => api.get(`/stations/airports/${iata}`, airportLookupSchema, signal), enabled: /^[A-Z]{3}$/.test(iata), retry: false, staleTime: Infinity });

function useInvalidate() {
  const qc = useQueryClient();
  // The session lists the user's stations (the picker); the station list feeds every other screen.
  return () => Promise.all([qc.invalidateQueries({ queryKey: stationSettingsKeys.all }), qc.invalidateQueries({ queryKey: ['stations'] }), qc.invalidateQueries({ queryKey: sessionQueryOptions().queryKey })]);
}

export function useCreateStation() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: (body: StationCreateBody) => api.post('/stations', stationSettingsSchema, body), onSuccess: invalidate });
}

export function useUpdateStation() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: ({ id, body }: { id: number; body: StationUpdateBody }) => api.patch(`/stations/${id}`, stationSettingsSchema, body), onSuccess: invalidate });
}
