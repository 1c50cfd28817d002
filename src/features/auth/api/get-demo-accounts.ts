import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Role } from '@shared/auth/permissions';
import { api } from '@/lib/api-client';

export interface DemoAccounts {
  accounts: { email: string; role: Role }[];
  password: string | null;
}

export const getDemoAccounts = () => api.get<DemoAccounts>('/auth/demo-accounts');

export const getDemoAccountsQueryOptions = () =>
  queryOptions({ queryKey: ['auth', 'demo-accounts'], queryFn: getDemoAccounts, staleTime: Infinity });

export const useDemoAccounts = () => useQuery(getDemoAccountsQueryOptions());
