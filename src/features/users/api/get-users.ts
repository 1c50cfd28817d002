import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UserDto } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';

export const getUsers = async () => (await api.get<{ users: UserDto[] }>('/users')).users;

export const getUsersQueryOptions = () => queryOptions({ queryKey: ['users'], queryFn: getUsers });

export const useUsers = () => useQuery(getUsersQueryOptions());
