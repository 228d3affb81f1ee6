import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { AlternativeDto, CreateAlternativeInput } from "@shared/schemas/alternatives";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { getAlternativesQueryOptions } from "@/features/studies/api/get-alternatives";
import { getComparisonQueryOptions } from "@/features/studies/api/get-comparison";

export function createAlternative(projectId: string, input: CreateAlternativeInput): Promise<AlternativeDto> {
  return api.post<AlternativeDto>(apiPaths.projects.alternatives(projectId), input as unknown as Record<string, unknown>);
}

export function useCreateAlternative(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateAlternativeInput) => createAlternative(projectId, input),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: getAlternativesQueryOptions(projectId).queryKey });
      void queryClient.invalidateQueries({ queryKey: getComparisonQueryOptions(projectId).queryKey });
    },
  });
}
