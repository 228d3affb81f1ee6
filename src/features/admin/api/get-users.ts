import { queryOptions, useQuery } from "@tanstack/react-query";
import type { AdminUser } from "@shared/schemas/users";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** Every account with its administrator flag and memberships (administrators only). */
export function getUsers(signal?: AbortSignal): Promise<AdminUser[]> {
  return api.get<AdminUser[]>(apiPaths.users.list, { signal });
}

export function getUsersQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.users.list(),
    queryFn: ({ signal }) => getUsers(signal),
  });
}

export function useUsers() {
  return useQuery(getUsersQueryOptions());
}
