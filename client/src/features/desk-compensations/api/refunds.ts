import { queryOptions } from '@tanstack/react-query';
import { ruleRefundsResponseSchema } from '@shared/schemas/refunds';
import { api } from '../../../lib/api-client';

export const refundKeys = {
  all: ['refunds'] as const,
  flight: (flightId: number) => [...refundKeys.all, 'flight', flightId] as const,
};

export const refundsQueryOptions = (flightId: number) =>
  queryOptions({ queryKey: refundKeys.flight(flightId), queryFn: () => api.get(`/flights/${flightId}/refunds`, ruleRefundsResponseSchema) });
