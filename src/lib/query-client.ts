import { QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client.ts';

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        // A 4xx will answer the same way again; only network trouble and 5xx are worth a retry.
        retry: (failureCount, error) => (isApiError(error) && error.status >= 400 && error.status < 500 ? false : failureCount < 2),
      },
      mutations: { retry: false },
    },
  });
}

export const queryClient = createQueryClient();
