import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

/** Client-side errors (4xx) are answers, not glitches: retrying them only delays the message. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status < 500) return false;
  return failureCount < 2;
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 30_000, refetchOnWindowFocus: false },
      mutations: { retry: false },
    },
  });
}

/**
 * The application's one client, made when the app starts: the provider hands it to components, and the
 * router's loaders, which run before anything renders, start requests in it.
 */
export const queryClient = createQueryClient();
