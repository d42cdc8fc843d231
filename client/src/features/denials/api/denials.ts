import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  boardingRefusalListSchema, boardingRefusalSchema, denialProposalListSchema, denialProposalSchema, rebookDenialResultSchema,
  stationPriorityRulesSchema, waitingProposalListSchema,
  type ChangeDenialsBody, type PriorityRulesBody, type ProposeDenialsBody, type RebookDenialBody, type RecordDenialAfterBody, type RecordRefusalBody,
} from '@shared/schemas/denials';
import { applyCandidatesAnswer, candidatesAnswerSchema, taggedCandidatesSchema, type TaggedCandidates } from '@shared/schemas/denial-candidates-patch';
import { alternateListSchema } from '@shared/schemas/volunteers';
import type { z } from 'zod';
import { api, apiRequest } from '../../../lib/api-client';

/** Per flight and per station, so one change notice invalidates everything this feature shows with one prefix. */
export const denialKeys = {
  all: ['denials'] as const,
  flight: (flightId: number) => [...denialKeys.all, 'flight', flightId] as const,
  candidates: (flightId: number) => [...denialKeys.flight(flightId), 'candidates'] as const,
  proposals: (flightId: number) => [...denialKeys.flight(flightId), 'proposals'] as const,
  alternates: (flightId: number) => [...denialKeys.flight(flightId), 'alternates'] as const,
  refusals: (flightId: number) => [...denialKeys.flight(flightId), 'refusals'] as const,
  station: (stationId: number) => [...denialKeys.all, 'station', stationId] as const,
  waiting: (stationId: number) => [...denialKeys.station(stationId), 'waiting'] as const,
  rules: (stationId: number) => [...denialKeys.station(stationId), 'rules'] as const,
};

type DenialProposalList = z.infer<typeof denialProposalListSchema>;

/** A slow safety net under the socket: a missed notice still shows up within a minute. */
const SAFETY_REFETCH_MS = 60_000;

/**
 * The ranking: whole on the first fetch, then only what changed since the one held (by its tag), so a check-in costs
 * each console a few hundred bytes instead of the whole list.
 */
async function fetchCandidates(flightId: number, held: TaggedCandidates | undefined, signal: AbortSignal): Promise<TaggedCandidates> {
  const path = `/flights/${flightId}/denial-candidates`;
  if (!held?.tag) return api.get(path, taggedCandidatesSchema, signal);
  const answer = await api.get(`${path}?since=${encodeURIComponent(held.tag)}`, candidatesAnswerSchema, signal);
  return applyCandidatesAnswer(held, answer) ?? api.get(path, taggedCandidatesSchema, signal);
}

export const denialCandidatesQueryOptions = (flightId: number) =>
  queryOptions({
    queryKey: denialKeys.candidates(flightId),
    queryFn: ({ client, queryKey, signal }) => fetchCandidates(flightId, client.getQueryData<TaggedCandidates>(queryKey), signal),
    refetchInterval: SAFETY_REFETCH_MS,
  });

/** The outbox sends after the commit and tells no console, so a statement still being sent is looked at again soon. */
const SENDING_REFETCH_MS = 3_000;
const statementsSending = (list: DenialProposalList | undefined) =>
  list?.proposals.some((p) => p.denials.some((d) => d.statements.some((st) => st.status === 'pending'))) ?? false;

export const denialProposalsQueryOptions = (flightId: number) =>
  queryOptions({
    queryKey: denialKeys.proposals(flightId),
    queryFn: ({ signal }) => api.get(`/flights/${flightId}/denial-proposals`, denialProposalListSchema, signal),
    refetchInterval: (query) => (statementsSending(query.state.data) ? SENDING_REFETCH_MS : SAFETY_REFETCH_MS),
  });

export const refusalsQueryOptions = (flightId: number) =>
  queryOptions({ queryKey: denialKeys.refusals(flightId), queryFn: () => api.get(`/flights/${flightId}/boarding-refusals`, boardingRefusalListSchema), refetchInterval: SAFETY_REFETCH_MS });

export const alternatesQueryOptions = (flightId: number) =>
  queryOptions({ queryKey: denialKeys.alternates(flightId), queryFn: () => api.get(`/flights/${flightId}/alternates`, alternateListSchema) });

export const waitingProposalsQueryOptions = (stationId: number) =>
  queryOptions({ queryKey: denialKeys.waiting(stationId), queryFn: () => api.get(`/stations/${stationId}/denial-proposals`, waitingProposalListSchema), refetchInterval: SAFETY_REFETCH_MS });

export const priorityRulesQueryOptions = (stationId: number) =>
  queryOptions({ queryKey: denialKeys.rules(stationId), queryFn: () => api.get(`/stations/${stationId}/priority-rules`, stationPriorityRulesSchema) });

function useFlightMutation<T, R>(flightId: number, mutationFn: (body: T) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn,
    // Everything about the flight's denials may have moved, and the station's waiting list with it.
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: denialKeys.flight(flightId) }), qc.invalidateQueries({ queryKey: [...denialKeys.all, 'station'] })]),
  });
}

export const useProposeDenials = (flightId: number) =>
  useFlightMutation(flightId, (body: ProposeDenialsBody) => api.post(`/flights/${flightId}/denial-proposals`, denialProposalSchema, body));

export const useAuthorizeDenials = (flightId: number) =>
  useFlightMutation(flightId, ({ proposalId, denialIds }: { proposalId: number; denialIds?: number[] }) =>
    api.post(`/denial-proposals/${proposalId}/authorize`, denialProposalSchema, denialIds ? { denialIds } : {}));

export const useChangeDenials = (flightId: number) =>
  useFlightMutation(flightId, ({ proposalId, ...body }: ChangeDenialsBody & { proposalId: number }) => api.post(`/denial-proposals/${proposalId}/change`, denialProposalSchema, body));

export const useWithdrawProposal = (flightId: number) =>
  useFlightMutation(flightId, ({ proposalId, reason }: { proposalId: number; reason: string }) => api.post(`/denial-proposals/${proposalId}/withdraw`, denialProposalSchema, { reason }));

export const useRecordRefusal = (flightId: number) =>
  useFlightMutation(flightId, (body: RecordRefusalBody) => api.post(`/flights/${flightId}/boarding-refusals`, boardingRefusalSchema, body));

export const useRecordDenialAfter = (flightId: number) =>
  useFlightMutation(flightId, (body: RecordDenialAfterBody) => api.post(`/flights/${flightId}/denials/recorded`, denialProposalSchema, body));

export const useRebookDenial = (flightId: number) =>
  useFlightMutation(flightId, ({ denialId, ...body }: RebookDenialBody & { denialId: number }) => api.post(`/denials/${denialId}/rebook`, rebookDenialResultSchema, body));

export function useSavePriorityRules(stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PriorityRulesBody) => apiRequest('PUT', `/stations/${stationId}/priority-rules`, stationPriorityRulesSchema, body),
    onSuccess: (saved) => {
      qc.setQueryData(denialKeys.rules(stationId), saved);
      // The ranking of every flight at the station follows the new rules.
      return qc.invalidateQueries({ queryKey: [...denialKeys.all, 'flight'] });
    },
  });
}

/** The printable statement page, served by the API as HTML. */
export const statementUrl = (denialId: number) => `/api/denials/${denialId}/statement`;
