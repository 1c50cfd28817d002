import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateUserInput, UserDto } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { getUsersQueryOptions } from './get-users';

export const createUser = async (input: CreateUserInput) => (await api.post<{ user: UserDto }>('/users', input)).user;

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getUsersQueryOptions().queryKey }),
  });
}
