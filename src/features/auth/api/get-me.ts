import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionUserDto } from '@shared/schemas/auth';
import { api, ApiError } from '@/lib/api-client';

/** The signed-in user, or null when signed out (401 is an answer here, not an error). */
export async function getMe(): Promise<SessionUserDto | null> {
  try {
    const { user } = await api.get<{ user: SessionUserDto }>('/auth/me');
    return user;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const getMeQueryOptions = () => queryOptions({ queryKey: ['auth', 'me'], queryFn: getMe, staleTime: 5 * 60_000 });

export const useMe = () => useQuery(getMeQueryOptions());
