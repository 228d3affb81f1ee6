import { queryOptions, useQuery } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";

export interface ProjectMember {
  userId: string;
  name: string;
  email: string;
  role: "analyst" | "reviewer" | "viewer";
}

/** The project's members; the submit form offers its reviewers. */
export function getProjectMembers(projectId: string, signal?: AbortSignal): Promise<ProjectMember[]> {
  return api.get<ProjectMember[]>(apiPaths.projects.members(projectId), { signal });
}

export function getProjectMembersQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: ["projects", "members", projectId],
    queryFn: ({ signal }) => getProjectMembers(projectId, signal),
  });
}

export function useProjectReviewers(projectId: string) {
  return useQuery({ ...getProjectMembersQueryOptions(projectId), select: (members) => members.filter((m) => m.role === "reviewer") });
}
