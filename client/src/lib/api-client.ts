// The one way the client talks to the API: JSON in and out, the CSRF token on every change, typed failures, and
// responses parsed with the same zod schemas the server validates with.
import type { ZodType, z } from 'zod';
import { apiErrorSchema, type ApiError } from '@shared/schemas/common';

export class ApiRequestError extends Error {
  constructor(readonly status: number, readonly body: ApiError) {
    super(body.message);
  }
  /** The message for one field, to show beside that field in a form. */
  fieldMessage(field: string): string | undefined {
    return this.body.details?.find((d) => d.field === field)?.rule;
  }
}

let csrfToken = '';
export function setCsrfToken(token: string) {
  csrfToken = token;
}

type Listener = () => void;
const unauthenticatedListeners = new Set<Listener>();
/** Lets the app send the user back to sign-in when a session expires mid-work. */
export function onUnauthenticated(listener: Listener) {
  unauthenticatedListeners.add(listener);
  return () => {
    unauthenticatedListeners.delete(listener);
  };
}

export async function apiRequest<S extends ZodType>(method: string, path: string, schema: S | null, body?: unknown, signal?: AbortSignal): Promise<z.infer<S>> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  if (method !== 'GET') headers['X-CSRF-Token'] = csrfToken;
  const res = await fetch(`/api${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), credentials: 'same-origin', signal });
  if (res.status === 204) return undefined as z.infer<S>;
  const json: unknown = await res.json().catch(() => ({ error: 'bad_response', message: `The server answered ${res.status} without a readable body.` }));
  if (!res.ok) {
    const parsed = apiErrorSchema.safeParse(json);
    const err = new ApiRequestError(res.status, parsed.success ? parsed.data : { error: 'bad_response', message: `The server answered ${res.status}.` });
    if (res.status === 401 && path !== '/auth/sign-in') unauthenticatedListeners.forEach((l) => l());
    throw err;
  }
  return schema ? schema.parse(json) : (json as z.infer<S>);
}

export const api = {
  /** `signal`: TanStack Query's, so a query replaced or unmounted stops its request instead of letting it run on. */
  get: <S extends ZodType>(path: string, schema: S, signal?: AbortSignal) => apiRequest('GET', path, schema, undefined, signal),
  post: <S extends ZodType>(path: string, schema: S | null, body?: unknown) => apiRequest('POST', path, schema, body ?? {}),
  patch: <S extends ZodType>(path: string, schema: S | null, body?: unknown) => apiRequest('PATCH', path, schema, body ?? {}),
  del: <S extends ZodType>(path: string, schema: S | null) => apiRequest('DELETE', path, schema),
};
