import { queryOptions, useQuery } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import type { Project } from "@/types/api";

/** The projects the caller belongs to (all of them for an administrator). */
export function getProjects(signal?: AbortSignal): Promise<Project[]> {
  return api.get<Project[]>(apiPaths.projects.list, { signal });
}

export function getProjectsQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.projects.list(),
    queryFn: ({ signal }) => getProjects(signal),
  });
}

export function useProjects() {
  return useQuery(getProjectsQueryOptions());
}
