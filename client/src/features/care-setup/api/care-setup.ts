import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { careSetupResponseSchema, type CareSetupBody } from '@shared/schemas/care';
import { apiRequest, api } from '../../../lib/api-client';

export const careSetupKeys = {
  all: ['care-setup'] as const,
  station: (stationId: number) => [...careSetupKeys.all, 'station', stationId] as const,
};

export const careSetupQueryOptions = (stationId: number) =>
  queryOptions({
    queryKey: careSetupKeys.station(stationId),
    queryFn: ({ signal }) => api.get(`/stations/${stationId}/care-setup`, careSetupResponseSchema, signal).then((r) => r.setup),
  });

export function useSaveCareSetup(stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CareSetupBody) => apiRequest('PUT', `/stations/${stationId}/care-setup`, careSetupResponseSchema, body).then((r) => r.setup),
    onSuccess: (setup) => qc.setQueryData(careSetupKeys.station(stationId), setup),
  });
}
