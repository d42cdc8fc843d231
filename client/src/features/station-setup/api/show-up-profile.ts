import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { showUpProfileSchema, type ShowUpProfile } from '@shared/schemas/show-up-profile';
import { apiRequest, api } from '../../../lib/api-client';

/** What GET and PUT /stations/:id/show-up-profile answer. */
export const stationShowUpProfileSchema = z.object({
  stationId: z.number(),
  profile: showUpProfileSchema,
  isDefault: z.boolean(),
  updatedAt: z.string().nullable(),
  updatedByUserId: z.number().nullable(),
});
export type StationShowUpProfile = z.infer<typeof stationShowUpProfileSchema>;

export const showUpProfileKeys = { all: ['show-up-profile'] as const, station: (stationId: number) => [...showUpProfileKeys.all, stationId] as const };

const path = (stationId: number) => `/stations/${stationId}/show-up-profile`;

export const showUpProfileQueryOptions = (stationId: number) =>
  // Never refetched behind the admin's back: the editor starts from what it loaded and keeps what is typed.
  queryOptions({ queryKey: showUpProfileKeys.station(stationId), queryFn: () => api.get(path(stationId), stationShowUpProfileSchema), staleTime: Infinity });

export function useSaveShowUpProfile(stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (profile: ShowUpProfile) => apiRequest('PUT', path(stationId), stationShowUpProfileSchema, profile),
    onSuccess: (saved) => qc.setQueryData(showUpProfileKeys.station(stationId), saved),
  });
}
