import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { careGivenSchema, choiceKindSchema, flightCareResponseSchema, type RecordCareBody, type RecordChoiceBody } from '@shared/schemas/care';
import { api } from '../../../lib/api-client';

export const deskCareKeys = {
  all: ['desk-care'] as const,
  flight: (flightId: number) => [...deskCareKeys.all, 'flight', flightId] as const,
};

/** The flight's notices (use-care-live.ts) bring another agent's records; this slow refetch only covers a lost notice. */
const SAFETY_REFETCH_MS = 60_000;

export const deskCareQueryOptions = (flightId: number) =>
  queryOptions({
    queryKey: deskCareKeys.flight(flightId),
    queryFn: ({ signal }) => api.get(`/flights/${flightId}/care`, flightCareResponseSchema, signal),
    refetchInterval: SAFETY_REFETCH_MS,
  });

const choiceResponse = z.object({ choice: z.object({ id: z.number(), kind: choiceKindSchema }) });
const careResponse = z.object({ given: careGivenSchema });

function useFlightMutation<T, R>(flightId: number, mutationFn: (input: T) => Promise<R>) {
  const qc = useQueryClient();
  // A choice can change the compensation's amount: the server's flight notice tells the money panel to read it again.
  return useMutation({ mutationFn, onSettled: () => qc.invalidateQueries({ queryKey: deskCareKeys.flight(flightId) }) });
}

export const useRecordChoice = (flightId: number) =>
  useFlightMutation(flightId, ({ compensationId, ...body }: RecordChoiceBody & { compensationId: number }) => api.post(`/compensations/${compensationId}/choice`, choiceResponse, body));

export const useRecordCare = (flightId: number) =>
  useFlightMutation(flightId, ({ compensationId, ...body }: RecordCareBody & { compensationId: number }) => api.post(`/compensations/${compensationId}/care`, careResponse, body));

const careMailResponse = z.object({ messageId: z.string(), created: z.boolean(), kind: z.enum(['written-statement', 'care-summary']) });
export type CareMailResult = z.infer<typeof careMailResponse>;

export const useMailCare = (flightId: number) =>
  useFlightMutation(flightId, ({ compensationId }: { compensationId: number }) => api.post(`/compensations/${compensationId}/care-mail`, careMailResponse, {}));
