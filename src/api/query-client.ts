import { QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './errors';

/** How long fetched data counts as fresh (ms). */
export const STALE = {
  /** Lists and records that others change while you look. */
  default: 30_000,
  /** Names that rarely change: brands, factories. */
  reference: 5 * 60_000,
  session: 60_000,
} as const;

/** A 4xx will not get better by asking again; network trouble and 5xx might. */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

/**
 * One client per app. `onUnauthorized` runs when any query answers 401 (session expired or the
 * account was deactivated): the session layer drops the user back to sign-in.
 */
export function createQueryClient(onUnauthorized?: (client: QueryClient) => void): QueryClient {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error) => {
        if (isApiError(error) && error.status === 401) onUnauthorized?.(client);
      },
    }),
    defaultOptions: {
      queries: { staleTime: STALE.default, retry: shouldRetry, refetchOnWindowFocus: true },
      mutations: { retry: false },
    },
  });
  return client;
}
