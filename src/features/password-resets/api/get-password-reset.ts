import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PasswordResetLookupDto } from '@shared/schemas/password-reset';
import { api } from '@/lib/api-client';

/** Whether a reset link still works; one that does not answers 400 `invalid_token`. */
export const getPasswordReset = async (token: string) =>
  (await api.get<{ reset: PasswordResetLookupDto }>(`/password-resets/lookup?token=${encodeURIComponent(token)}`)).reset;

export const getPasswordResetQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['password-resets', token], queryFn: () => getPasswordReset(token), staleTime: Infinity });

export const usePasswordReset = (token: string) => useQuery(getPasswordResetQueryOptions(token));
