import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { savedPlanListSchema, savedPlanSchema, type SavePlanBody } from '@shared/schemas/plans';
import { api } from '../../../lib/api-client';

export const planKeys = {
  all: ['plans'] as const,
  list: (routeKey: string) => [...planKeys.all, 'list', routeKey] as const,
};

/** The route key starts at the station's airport, so the key per route is already one station's list. */
export const plansQueryOptions = (stationId: number, routeKey: string) =>
  queryOptions({
    queryKey: [...planKeys.list(routeKey), stationId],
    queryFn: () => api.get(`/plans?${new URLSearchParams({ stationId: String(stationId), routeKey })}`, savedPlanListSchema),
  });

export function useSavePlan() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SavePlanBody) => api.post('/plans', savedPlanSchema, body),
    onSuccess: (plan) => qc.invalidateQueries({ queryKey: planKeys.list(plan.routeKey) }),
  });
}
