import { queryOptions, useQuery } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api, ApiError } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import type { User } from "@/types/api";

/** The signed-in user, or null when there is no valid session (a 401 is an answer here, not an error). */
export async function getMe(signal?: AbortSignal): Promise<User | null> {
  try {
    return await api.get<User>(apiPaths.auth.me, { signal, redirectOnUnauthorized: false });
  } catch (error) {
    if (error instanceof ApiError && error.isUnauthorized) return null;
    throw error;
  }
}

export function getMeQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });
}

export function useMe() {
  return useQuery(getMeQueryOptions());
}
