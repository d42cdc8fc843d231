// The passenger's page talks to the public API with plain fetch: no session, no CSRF token, nothing of the staff app.
import { queryOptions, useMutation } from '@tanstack/react-query';
import type { ZodType, z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/common';
import { identifiedSchema, passengerStatusSchema, publicOfferSchema } from '@shared/schemas/volunteers';

export class OfferRequestError extends Error {
  constructor(readonly status: number, readonly code: string, message: string) {
    super(message);
  }
  /** The link was tampered with or has expired: only the gate agent can give a working one. */
  get linkInvalid() {
    return this.code === 'link_invalid';
  }
}

async function call<S extends ZodType>(token: string, path: string, schema: S, body?: unknown): Promise<z.infer<S>> {
  let res: Response;
  try {
    res = await fetch(`/api/public/offers/${encodeURIComponent(token)}${path}`, {
      method: body === undefined ? 'GET' : 'POST',
      headers: body === undefined ? { Accept: 'application/json' } : { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'omit',
    });
  } catch {
    throw new OfferRequestError(0, 'offline', 'No connection right now. Check your signal and try again.');
  }
  const json: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const parsed = apiErrorSchema.safeParse(json);
    throw new OfferRequestError(res.status, parsed.success ? parsed.data.error : 'bad_response', parsed.success ? parsed.data.message : 'Something went wrong. Please try again, or ask the gate agent.');
  }
  return schema.parse(json);
}

export const offerKeys = {
  all: ['offer-your-seat'] as const,
  offer: (token: string) => [...offerKeys.all, token] as const,
  status: (token: string, passengerToken: string) => [...offerKeys.offer(token), 'status', passengerToken] as const,
};

/** The offer can be raised while the passenger reads it: a slow refresh keeps the amount current. */
const OFFER_REFRESH_MS = 15_000;
/** How often the outcome is asked while the gate decides. */
export const STATUS_POLL_MS = 5_000;

const noRetryOn4xx = (count: number, err: Error) => !(err instanceof OfferRequestError && err.status >= 400 && err.status < 500) && count < 2;

export const publicOfferQueryOptions = (token: string) =>
  queryOptions({ queryKey: offerKeys.offer(token), queryFn: () => call(token, '', publicOfferSchema), refetchInterval: OFFER_REFRESH_MS, retry: noRetryOn4xx });

type PassengerStatus = z.infer<typeof passengerStatusSchema>;
const isSettled = (s: PassengerStatus | undefined) => s !== undefined && (s.status === 'declined' || s.status === 'withdrawn' || (s.status === 'accepted' && s.rebooking !== null));

export const passengerStatusQueryOptions = (token: string, passengerToken: string) =>
  queryOptions({
    queryKey: offerKeys.status(token, passengerToken),
    queryFn: () => call(token, `/status?passengerToken=${encodeURIComponent(passengerToken)}`, passengerStatusSchema),
    // Asked again until the gate has decided and, for an accepted offer, the new flight is known.
    refetchInterval: (q) => (isSettled(q.state.data) ? false : STATUS_POLL_MS),
    retry: noRetryOn4xx,
  });

export function useIdentify(token: string) {
  return useMutation({ mutationFn: (body: { pnr: string; lastName: string }) => call(token, '/identify', identifiedSchema, body) });
}

export function usePlaceBid(token: string) {
  return useMutation({
    mutationFn: (body: { passengerToken: string; askMinor?: number; acceptPosted?: true }) => call(token, '/bids', passengerStatusSchema.pick({ status: true }).partial(), body),
  });
}
