import { MutationCache, QueryCache, QueryClient, type DefaultOptions } from '@tanstack/react-query';
import { isApiError } from './api-client';
import { reportSessionLost } from './session-events';

/** Calls whose 401 is an answer to show (sign-in) rather than a lost session. */
export type RequestMeta = { expectUnauthenticated?: boolean };

declare module '@tanstack/react-query' {
  interface Register {
    queryMeta: RequestMeta;
    mutationMeta: RequestMeta;
  }
}

/** How long read data counts as fresh before a background refetch (common practice, no source). */
const staleTimeMs = 30_000;

const defaultOptions: DefaultOptions = {
  queries: {
    staleTime: staleTimeMs,
    refetchOnWindowFocus: false,
    retry: (failureCount, error) => {
      // Answers of the API (4xx) will not change on retry; a dropped connection or 503 may.
      if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
      return failureCount < 2;
    },
  },
};

export function createQueryClient(): QueryClient {
  const onError = (error: unknown, meta: RequestMeta | undefined) => {
    if (isApiError(error) && error.status === 401 && !meta?.expectUnauthenticated) reportSessionLost();
  };
  return new QueryClient({
    defaultOptions,
    queryCache: new QueryCache({ onError: (error, query) => onError(error, query.meta) }),
    mutationCache: new MutationCache({ onError: (error, _v, _c, mutation) => onError(error, mutation.meta) }),
  });
}
