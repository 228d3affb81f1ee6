import { QueryClient, type DefaultOptions } from "@tanstack/react-query";
import { ApiError } from "@/lib/api-client";

/**
 * Retry transient failures (network, 5xx) once; never retry an answer the server meant — a 4xx will not
 * change by asking again.
 */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 1;
}

export const queryConfig = {
  queries: {
    staleTime: 30_000,
    retry: shouldRetry,
    refetchOnWindowFocus: false,
  },
  mutations: {
    retry: false,
  },
} satisfies DefaultOptions;

export function createQueryClient(): QueryClient {
  return new QueryClient({ defaultOptions: queryConfig });
}
