import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useState, type ReactNode } from 'react';
import { onUnauthorized } from '@/lib/api-client';
import { createQueryClient } from '@/lib/query-client';
import { getMeQueryOptions } from '@/features/auth/api/get-me';

export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(createQueryClient);

  // When any request finds the session gone, forget the user; the layout then sends them to sign-in.
  useEffect(() => onUnauthorized(() => queryClient.setQueryData(getMeQueryOptions().queryKey, null)), [queryClient]);

  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
