import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect, type ReactNode } from 'react';
import { onUnauthorized } from '@/lib/api-client';
import { queryClient } from '@/lib/query-client';
import { getMeQueryOptions } from '@/features/auth/api/get-me';

export function AppProvider({ children }: { children: ReactNode }) {
  // When any request finds the session gone, forget the user; the layout then sends them to sign-in.
  useEffect(() => onUnauthorized(() => queryClient.setQueryData(getMeQueryOptions().queryKey, null)), []);

  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
