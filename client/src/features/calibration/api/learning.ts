import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  closedFlightSchema, outcomeRowSchema, stationLearningSchema, trainingRequestAnswerSchema,
  type OutcomeCorrection, type RatesChoice,
} from '@shared/schemas/learning';
import { api, apiRequest } from '../../../lib/api-client';

export const learningKeys = {
  all: ['learning'] as const,
  station: (stationId: number) => [...learningKeys.all, 'station', stationId] as const,
  closedFlights: (stationId: number) => [...learningKeys.all, 'closed-flights', stationId] as const,
  outcomes: (closedFlightId: number) => [...learningKeys.all, 'outcomes', closedFlightId] as const,
};

export const stationLearningQueryOptions = (stationId: number) =>
  queryOptions({
    queryKey: learningKeys.station(stationId),
    queryFn: ({ signal }) => api.get(`/learning/stations/${stationId}`, stationLearningSchema, signal),
    // While a run is queued or going, its progress is polled; otherwise nothing moves without a click.
    refetchInterval: (q) => (q.state.data?.job && ['queued', 'running'].includes(q.state.data.job.status) ? 1000 : false),
  });

export const closedFlightsQueryOptions = (stationId: number) =>
  queryOptions({
    queryKey: learningKeys.closedFlights(stationId),
    queryFn: ({ signal }) => api.get(`/learning/stations/${stationId}/closed-flights`, z.object({ flights: z.array(closedFlightSchema) }), signal),
  });

export const outcomesQueryOptions = (closedFlightId: number) =>
  queryOptions({
    queryKey: learningKeys.outcomes(closedFlightId),
    queryFn: ({ signal }) => api.get(`/learning/closed-flights/${closedFlightId}/outcomes`, z.object({ outcomes: z.array(outcomeRowSchema) }), signal),
  });

export function useRequestTraining() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/learning/jobs', trainingRequestAnswerSchema),
    onSuccess: () => qc.invalidateQueries({ queryKey: learningKeys.all }),
  });
}

export function useSaveRatesChoice(stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (choice: RatesChoice) => apiRequest('PUT', `/learning/stations/${stationId}/choice`, stationLearningSchema, choice),
    onSuccess: (saved) => qc.setQueryData(learningKeys.station(stationId), saved),
  });
}

export function useCorrectOutcome(closedFlightId: number, stationId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: OutcomeCorrection & { id: number }) => api.patch(`/learning/outcomes/${id}`, null, body),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: learningKeys.outcomes(closedFlightId) });
      void qc.invalidateQueries({ queryKey: learningKeys.closedFlights(stationId) });
    },
  });
}
