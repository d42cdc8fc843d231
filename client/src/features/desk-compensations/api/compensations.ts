import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { compensationResponseSchema, deskCompensationsResponseSchema, voucherOfferResponseSchema, type voucherAgreementBodySchema } from '@shared/schemas/finance';
import { alertKeys } from '../../../lib/alert-keys';
import { api } from '../../../lib/api-client';

export const deskCompensationKeys = {
  all: ['desk-compensations'] as const,
  flight: (flightId: number) => [...deskCompensationKeys.all, 'flight', flightId] as const,
};

type DeskCompensations = z.infer<typeof deskCompensationsResponseSchema>;
type VoucherAgreementBody = z.infer<typeof voucherAgreementBodySchema>;

/** A slow safety net under the socket: a missed notice still shows up within a minute. */
const SAFETY_REFETCH_MS = 60_000;
/** The provider may answer after the request gave up waiting; the worker finishes it, so look again soon. */
const ISSUING_REFETCH_MS = 3_000;
const anyIssuing = (data: DeskCompensations | undefined) => data?.compensations.some((c) => c.state === 'issuing') ?? false;

export const deskCompensationsQueryOptions = (flightId: number) =>
  queryOptions({
    queryKey: deskCompensationKeys.flight(flightId),
    queryFn: () => api.get(`/flights/${flightId}/compensations`, deskCompensationsResponseSchema),
    refetchInterval: (query) => (anyIssuing(query.state.data) ? ISSUING_REFETCH_MS : SAFETY_REFETCH_MS),
  });

function useFlightMutation<T, R>(flightId: number, mutationFn: (input: T) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn,
    // An issue or a re-issue may raise or resolve an alert as well.
    onSettled: () => Promise.all([qc.invalidateQueries({ queryKey: deskCompensationKeys.flight(flightId) }), qc.invalidateQueries({ queryKey: alertKeys.all })]),
  });
}

export const useIssueCompensation = (flightId: number) =>
  useFlightMutation(flightId, (id: number) => api.post(`/compensations/${id}/issue`, compensationResponseSchema));

export const useOfferVoucher = (flightId: number) =>
  useFlightMutation(flightId, (id: number) => api.post(`/compensations/${id}/voucher-offer`, voucherOfferResponseSchema));

export const useRecordVoucherAgreement = (flightId: number) =>
  useFlightMutation(flightId, ({ id, ...body }: VoucherAgreementBody & { id: number }) => api.post(`/compensations/${id}/voucher-agreement`, compensationResponseSchema, body));

/** A payment refused, voided or canceled leaves the passenger owed: the desk starts a new one, with the reason. */
export const useReissueCompensation = (flightId: number) =>
  useFlightMutation(flightId, ({ id, reason }: { id: number; reason: string }) => api.post(`/compensations/${id}/reissue`, compensationResponseSchema, { reason }));
