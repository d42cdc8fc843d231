import { queryOptions } from '@tanstack/react-query';
import { departuresResponseSchema } from '@shared/schemas/flights';
import { api } from '../../../lib/api-client';

export const departureKeys = {
  all: ['departures'] as const,
  station: (stationId: number) => [...departureKeys.all, 'station', stationId] as const,
};

export const departuresQueryOptions = (stationId: number) =>
  queryOptions({
    queryKey: departureKeys.station(stationId),
    queryFn: () => api.get(`/departures?stationId=${stationId}`, departuresResponseSchema),
    refetchInterval: 30_000,
  });
