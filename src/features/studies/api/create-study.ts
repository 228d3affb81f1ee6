import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { CreateStudyInput, StudyDto } from "@shared/schemas/studies";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { getAlternativesQueryOptions } from "@/features/studies/api/get-alternatives";
import { getAlternativeStudiesQueryOptions } from "@/features/studies/api/get-alternative-studies";
import { getComparisonQueryOptions } from "@/features/studies/api/get-comparison";

/** Creates a study of a deck alternative; with a document, its revision 1 is computed and stored at once. */
export function createStudy(alternativeId: string, input: CreateStudyInput): Promise<StudyDto> {
  return api.post<StudyDto>(apiPaths.alternatives.studies(alternativeId), input as unknown as Record<string, unknown>);
}

export function useCreateStudy(alternativeId: string, projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateStudyInput) => createStudy(alternativeId, input),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: getAlternativeStudiesQueryOptions(alternativeId).queryKey });
      void queryClient.invalidateQueries({ queryKey: getAlternativesQueryOptions(projectId).queryKey });
      void queryClient.invalidateQueries({ queryKey: getComparisonQueryOptions(projectId).queryKey });
    },
  });
}
