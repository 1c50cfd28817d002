import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateUserInput, UserDto } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { getUsersQueryOptions } from './get-users';

export const updateUser = async ({ id, ...input }: UpdateUserInput & { id: number }) =>
  (await api.patch<{ user: UserDto }>(`/users/${id}`, input)).user;

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSettled: () => queryClient.invalidateQueries({ queryKey: getUsersQueryOptions().queryKey }),
  });
}
