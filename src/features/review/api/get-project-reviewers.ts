import { useQuery } from "@tanstack/react-query";
import type { ProjectMember } from "@shared/schemas/projects";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/**
 * The project's reviewers, whom the submit form offers: its members (one cache entry with the projects feature's
 * member list, under the same key), filtered to the reviewer role.
 */
export function useProjectReviewers(projectId: string) {
  return useQuery({
    queryKey: queryKeys.projects.members(projectId),
    queryFn: ({ signal }) => api.get<ProjectMember[]>(apiPaths.projects.members(projectId), { signal }),
    select: (members) => members.filter((m) => m.role === "reviewer"),
  });
}
