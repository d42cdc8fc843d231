import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { createdIntegrationKeySchema, integrationKeyListSchema, integrationKeySchema } from '@shared/schemas/integration-events';
import { api } from '../../../lib/api-client';

export const integrationKeyKeys = { all: ['integration-keys'] as const, list: (stationId: number) => [...integrationKeyKeys.all, stationId] as const };

const base = (stationId: number) => `/stations/${stationId}/integration-keys`;

export const integrationKeysQueryOptions = (stationId: number) =>
  queryOptions({ queryKey: integrationKeyKeys.list(stationId), queryFn: () => api.get(base(stationId), integrationKeyListSchema) });

export function useCreateIntegrationKey(stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => api.post(base(stationId), createdIntegrationKeySchema, { name }),
    onSuccess: () => qc.invalidateQueries({ queryKey: integrationKeyKeys.list(stationId) }),
  });
}

export function useRevokeIntegrationKey(stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (keyId: number) => api.del(`${base(stationId)}/${keyId}`, integrationKeySchema),
    onSuccess: () => qc.invalidateQueries({ queryKey: integrationKeyKeys.list(stationId) }),
  });
}
