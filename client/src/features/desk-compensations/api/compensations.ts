import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { compensationResponseSchema, deskCompensationsResponseSchema, voucherOfferResponseSchema } from '@shared/schemas/finance';
import { newLinkResponseSchema, receiptResponseSchema, type AgreementBody, type CounterPaymentBody } from '@shared/schemas/payment-media';
import type { Medium } from '@shared/compensation/media';
import { alertKeys } from '../../../lib/alert-keys';
import { api } from '../../../lib/api-client';

export const deskCompensationKeys = {
  all: ['desk-compensations'] as const,
  flight: (flightId: number) => [...deskCompensationKeys.all, 'flight', flightId] as const,
  receipt: (id: number) => [...deskCompensationKeys.all, 'receipt', id] as const,
};

type DeskCompensations = z.infer<typeof deskCompensationsResponseSchema>;

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

export const useChooseMedium = (flightId: number) =>
  useFlightMutation(flightId, ({ id, medium }: { id: number; medium: Medium }) => api.post(`/compensations/${id}/medium`, compensationResponseSchema, { medium }));

export const useRecordAgreement = (flightId: number) =>
  useFlightMutation(flightId, ({ id, ...body }: AgreementBody & { id: number }) => api.post(`/compensations/${id}/agreement`, compensationResponseSchema, body));

export const usePayAtCounter = (flightId: number) =>
  useFlightMutation(flightId, ({ id, ...body }: CounterPaymentBody & { id: number }) => api.post(`/compensations/${id}/counter-payment`, compensationResponseSchema, body));

export const receiptQueryOptions = (id: number) =>
  queryOptions({ queryKey: deskCompensationKeys.receipt(id), queryFn: () => api.get(`/compensations/${id}/receipt`, receiptResponseSchema) });

/** A payment refused, voided or canceled leaves the passenger owed: the desk starts a new one, with the reason. */
export const useReissueCompensation = (flightId: number) =>
  useFlightMutation(flightId, ({ id, reason }: { id: number; reason: string }) => api.post(`/compensations/${id}/reissue`, compensationResponseSchema, { reason }));

/** A fresh payout or card-details link mailed to the passenger; the older one stops working. */
export const useSendNewLink = (flightId: number) =>
  useFlightMutation(flightId, (id: number) => api.post(`/compensations/${id}/new-link`, newLinkResponseSchema));
