import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { deskPassengersSchema } from '@shared/schemas/flight-desk';
import {
  alternateListSchema, publicOfferSchema, roundListSchema, volunteerPolicySchema,
  type addVolunteerBodySchema, type openRoundBodySchema, type rebookBodySchema, type VolunteerPolicy,
} from '@shared/schemas/volunteers';
import { pendingApprovalListSchema } from '@shared/schemas/approvals';
import { api, apiRequest } from '../../../lib/api-client';

/** One key tree per flight, so a change notice about rounds invalidates only what this panel shows. */
export const volunteerKeys = {
  all: ['volunteer-rounds'] as const,
  flight: (flightId: number) => [...volunteerKeys.all, 'flight', flightId] as const,
  rounds: (flightId: number) => [...volunteerKeys.flight(flightId), 'rounds'] as const,
  alternates: (flightId: number) => [...volunteerKeys.flight(flightId), 'alternates'] as const,
  passengers: (flightId: number) => [...volunteerKeys.flight(flightId), 'passengers'] as const,
  disclosure: (token: string) => [...volunteerKeys.all, 'disclosure', token] as const,
  qr: (link: string) => [...volunteerKeys.all, 'qr', link] as const,
  approvals: () => [...volunteerKeys.all, 'approvals'] as const,
  stationApprovals: (stationId: number) => [...volunteerKeys.approvals(), stationId] as const,
  policy: (stationId: number) => [...volunteerKeys.all, 'policy', stationId] as const,
};

/** A slow safety net under the socket: a missed notice still shows up within half a minute. */
const SAFETY_REFETCH_MS = 30_000;

export const roundsQueryOptions = (flightId: number) =>
  queryOptions({ queryKey: volunteerKeys.rounds(flightId), queryFn: () => api.get(`/flights/${flightId}/rounds`, roundListSchema), refetchInterval: SAFETY_REFETCH_MS });

export const alternatesQueryOptions = (flightId: number) =>
  queryOptions({ queryKey: volunteerKeys.alternates(flightId), queryFn: () => api.get(`/flights/${flightId}/alternates`, alternateListSchema), staleTime: 0 });

export const flightPassengersQueryOptions = (flightId: number) =>
  queryOptions({ queryKey: volunteerKeys.passengers(flightId), queryFn: () => api.get(`/flights/${flightId}/passengers`, deskPassengersSchema), staleTime: 0 });

/** What volunteers must hear, read from the passenger page's own API so the agent says what the passenger reads. */
export const disclosureQueryOptions = (token: string) =>
  queryOptions({
    queryKey: volunteerKeys.disclosure(token),
    queryFn: async () => {
      const res = await fetch(`/api/public/offers/${encodeURIComponent(token)}`, { headers: { Accept: 'application/json' } });
      if (!res.ok) throw new Error(`The disclosure could not be loaded (the server answered ${res.status}).`);
      return publicOfferSchema.parse(await res.json()).disclosure;
    },
    staleTime: 60_000,
  });

/** One station's queue: the station comes from the page (and so from the URL), never from "all my stations". */
export const approvalsQueryOptions = (stationId: number) =>
  queryOptions({ queryKey: volunteerKeys.stationApprovals(stationId), queryFn: () => api.get(`/approvals?stationId=${stationId}`, pendingApprovalListSchema), refetchInterval: SAFETY_REFETCH_MS });

export const policyQueryOptions = (stationId: number) =>
  queryOptions({ queryKey: volunteerKeys.policy(stationId), queryFn: () => api.get(`/stations/${stationId}/volunteer-policy`, volunteerPolicySchema) });

export type OpenRoundBody = z.input<typeof openRoundBodySchema>;
export type AddVolunteerBody = z.infer<typeof addVolunteerBodySchema>;
export type RebookBody = z.infer<typeof rebookBodySchema>;

/** Every change to a round: afterwards the flight's rounds (and anything waiting on a supervisor) are refetched. */
function useRoundChange<V, R>(flightId: number, send: (v: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSettled: () => Promise.all([qc.invalidateQueries({ queryKey: volunteerKeys.flight(flightId) }), qc.invalidateQueries({ queryKey: volunteerKeys.approvals() })]),
  });
}

const approvalAnswer = z.object({ approvalRequested: z.boolean() });

export const useOpenRound = (flightId: number) => useRoundChange(flightId, (body: OpenRoundBody) => api.post(`/flights/${flightId}/rounds`, null, body));
export const useRaiseOffer = (flightId: number) =>
  useRoundChange(flightId, (v: { roundId: number; offerMinor: number }) => api.post(`/rounds/${v.roundId}/raise`, approvalAnswer, { offerMinor: v.offerMinor }));
export const useCloseRound = (flightId: number) => useRoundChange(flightId, (roundId: number) => api.post(`/rounds/${roundId}/close`, null));
export const useAddVolunteer = (flightId: number) =>
  useRoundChange(flightId, (v: { roundId: number; body: AddVolunteerBody }) => api.post(`/rounds/${v.roundId}/volunteers`, null, v.body));
export const useDecideVolunteer = (flightId: number) =>
  useRoundChange(flightId, (v: { roundId: number; volunteerId: number; accept: boolean }) => api.post(`/rounds/${v.roundId}/volunteers/${v.volunteerId}/${v.accept ? 'accept' : 'decline'}`, null));
export const useRebook = (flightId: number) =>
  useRoundChange(flightId, (v: { volunteerId: number; body: RebookBody }) => api.post(`/volunteers/${v.volunteerId}/rebook`, null, v.body));

export function useDecideApproval() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { approvalId: number; flightId: number | null; approve: boolean; reason: string }) => api.post(`/approvals/${v.approvalId}`, null, { approve: v.approve, reason: v.reason }),
    onSettled: (_d, _e, v) => Promise.all([qc.invalidateQueries({ queryKey: volunteerKeys.approvals() }), v.flightId !== null && qc.invalidateQueries({ queryKey: volunteerKeys.flight(v.flightId) })]),
  });
}

export function useSavePolicy(stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (policy: VolunteerPolicy) => apiRequest('PUT', `/stations/${stationId}/volunteer-policy`, volunteerPolicySchema, policy),
    onSuccess: (saved) => qc.setQueryData(volunteerKeys.policy(stationId), saved),
  });
}
