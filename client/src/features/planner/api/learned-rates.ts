import { queryOptions } from '@tanstack/react-query';
import { learnedRouteRatesSchema } from '@shared/schemas/learning';
import { api } from '../../../lib/api-client';

export const learnedRatesKeys = {
  all: ['planner-learned-rates'] as const,
  route: (stationId: number, destination: string) => [...learnedRatesKeys.all, stationId, destination] as const,
};

export const learnedRouteRatesQueryOptions = (stationId: number, destination: string) =>
  queryOptions({
    queryKey: learnedRatesKeys.route(stationId, destination),
    queryFn: ({ signal }) => api.get(`/learning/stations/${stationId}/routes/${destination}`, learnedRouteRatesSchema, signal),
    staleTime: 60_000,
  });
