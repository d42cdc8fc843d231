import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionResponseSchema, type SignInBody } from '@shared/schemas/auth';
import { api, setCsrfToken } from './api-client';

export const sessionKeys = { all: ['session'] as const };

export const sessionQueryOptions = () =>
  queryOptions({
    queryKey: sessionKeys.all,
    queryFn: async () => {
      const s = await api.get('/auth/session', sessionResponseSchema);
      setCsrfToken(s.csrfToken);
      return s;
    },
    staleTime: 60_000,
  });

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SignInBody) => api.post('/auth/sign-in', sessionResponseSchema, body),
    onSuccess: (s) => {
      setCsrfToken(s.csrfToken);
      // Everything cached belonged to nobody or to someone else: start clean for this user.
      qc.clear();
      qc.setQueryData(sessionKeys.all, s);
    },
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/auth/sign-out', null),
    onSettled: async () => {
      qc.clear();
      await qc.fetchQuery(sessionQueryOptions());
    },
  });
}
