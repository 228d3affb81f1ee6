import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ProjectCreateInput } from "@shared/schemas/projects";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import type { Project } from "@/types/api";

export function createProject(input: ProjectCreateInput): Promise<Project> {
  return api.post<Project>(apiPaths.projects.list, input);
}

export function useCreateProject({ onSuccess }: { onSuccess?: (project: Project) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    onSuccess: async (project) => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.projects.list() });
      onSuccess?.(project);
    },
  });
}
