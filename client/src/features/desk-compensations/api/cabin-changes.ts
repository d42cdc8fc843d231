import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { cabinChangeResponseSchema, cabinChangesResponseSchema, type RecordCabinChangeBody } from '@shared/schemas/cabin-changes';
import { deskPassengersSchema } from '@shared/schemas/flight-desk';
import { api } from '../../../lib/api-client';
import { deskCompensationKeys } from './compensations';
import { refundKeys } from './refunds';

export const cabinChangeKeys = {
  all: ['cabin-changes'] as const,
  flight: (flightId: number) => [...cabinChangeKeys.all, 'flight', flightId] as const,
  passengers: (flightId: number) => [...cabinChangeKeys.all, 'passengers', flightId] as const,
};

export const cabinChangesQueryOptions = (flightId: number) =>
  queryOptions({ queryKey: cabinChangeKeys.flight(flightId), queryFn: () => api.get(`/flights/${flightId}/cabin-changes`, cabinChangesResponseSchema) });

/** The flight's passengers, to pick whom the change is for. */
export const cabinPassengersQueryOptions = (flightId: number) =>
  queryOptions({ queryKey: cabinChangeKeys.passengers(flightId), queryFn: () => api.get(`/flights/${flightId}/passengers`, deskPassengersSchema) });

export function useRecordCabinChange(flightId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: RecordCabinChangeBody) => api.post(`/flights/${flightId}/cabin-changes`, cabinChangeResponseSchema, body),
    // A downgrade beside a compensation adds a refund and its payment row.
    onSettled: () => Promise.all([cabinChangeKeys.flight(flightId), refundKeys.flight(flightId), deskCompensationKeys.flight(flightId)].map((queryKey) => qc.invalidateQueries({ queryKey }))),
  });
}
