import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { userListSchema, userSchema, type CreateUserBody, type UpdateUserBody } from '@shared/schemas/users';
import { api } from '../../../lib/api-client';

export const userKeys = { all: ['users'] as const, list: () => [...userKeys.all, 'list'] as const };

export const usersQueryOptions = () => queryOptions({ queryKey: userKeys.list(), queryFn: () => api.get('/users', userListSchema) });

export function useCreateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateUserBody) => api.post('/users', userSchema, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.all }),
  });
}

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: UpdateUserBody }) => api.patch(`/users/${id}`, userSchema, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.all }),
  });
}
