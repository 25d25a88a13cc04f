/** Builds the TanStack Query client and its defaults for the whole app. */
import { QueryClient } from '@tanstack/react-query';

import { config } from '@/constants/config';
import { ApiError } from './client';

const maxRetries = 2;

/**
 * Retries only what another try could fix: a dropped connection or a server error, not a
 * refusal (4xx) that will come back the same.
 */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < maxRetries;
}

/** @returns a query client with Tallyrun's defaults */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { staleTime: config.staleTimeMs, retry: shouldRetry, refetchOnWindowFocus: true },
      mutations: { retry: false },
    },
  });
}
