// The passenger's payment pages talk to the public API with plain fetch: no session, no cookie, the link's token in
// the body (never in a URL the server would log).
import { queryOptions, useMutation } from '@tanstack/react-query';
import type { ZodType, z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/common';
import { CARD_WORDS } from '../model/card-words';
import { PAYOUT_WORDS } from '../model/payout-words';
import { cardDetailsLinkSchema, cardDetailsSchema, payoutAcceptedSchema, payoutLinkSchema, type BookingProof, type PayoutDetailsBody } from '@shared/schemas/payouts';

export class LinkRequestError extends Error {
  constructor(readonly status: number, readonly code: string, message: string, readonly fields: { field: string; rule: string }[] = []) {
    super(message);
  }
}

async function call<S extends ZodType>(path: string, schema: S, body: object, offline: string, broken: string): Promise<z.infer<S>> {
  let res: Response;
  try {
    res = await fetch(`/api/public/payments${path}`, { method: 'POST', headers: { Accept: 'application/json', 'Content-Type': 'application/json' }, body: JSON.stringify(body), credentials: 'omit', cache: 'no-store' });
  } catch {
    throw new LinkRequestError(0, 'offline', offline);
  }
  const json: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const parsed = apiErrorSchema.safeParse(json);
    throw parsed.success ? new LinkRequestError(res.status, parsed.data.error, parsed.data.message, parsed.data.details ?? []) : new LinkRequestError(res.status, 'bad_response', broken);
  }
  return schema.parse(json);
}

export const passengerPaymentKeys = {
  all: ['passenger-payments'] as const,
  card: (token: string) => [...passengerPaymentKeys.all, 'card', token] as const,
  payout: (token: string) => [...passengerPaymentKeys.all, 'payout', token] as const,
};

const noRetryOn4xx = (count: number, err: Error) => !(err instanceof LinkRequestError && err.status >= 400 && err.status < 500) && count < 2;

const C = CARD_WORDS;
const P = PAYOUT_WORDS;

export const cardLinkQueryOptions = (token: string) =>
  queryOptions({ queryKey: passengerPaymentKeys.card(token), queryFn: () => call('/card-details/status', cardDetailsLinkSchema, { token }, C.offline, C.broken), retry: noRetryOn4xx, staleTime: Infinity });

export const payoutLinkQueryOptions = (token: string) =>
  queryOptions({ queryKey: passengerPaymentKeys.payout(token), queryFn: () => call('/payout/status', payoutLinkSchema, { token }, P.offline, P.broken), retry: noRetryOn4xx, staleTime: Infinity });

/** The details live only in this mutation's result, in memory: never cached, never stored in the browser. */
export function useRevealCard(token: string) {
  return useMutation({ mutationFn: (proof: BookingProof) => call('/card-details/reveal', cardDetailsSchema, { token, ...proof }, C.offline, C.broken), gcTime: 0 });
}

export function useGiveAccount(token: string) {
  return useMutation({ mutationFn: (body: PayoutDetailsBody) => call('/payout/account', payoutAcceptedSchema, { token, ...body }, P.offline, P.broken), gcTime: 0 });
}
