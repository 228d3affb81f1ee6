import { useMutation } from "@tanstack/react-query";
import type { CreateRevisionInput, RevisionDto } from "@shared/schemas/revisions";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { useRevisionSaved } from "@/features/studies/hooks/use-revision-saved";

/**
 * Saves the edited document as the study's next revision; the server runs the sweep and stores the result. A
 * revision saved by someone else since `parentRevision` answers 409 `stale_parent` (see the re-base panel).
 */
export function createRevision(studyId: string, input: CreateRevisionInput): Promise<RevisionDto> {
  return api.post<RevisionDto>(apiPaths.studies.revisions(studyId), input as unknown as Record<string, unknown>);
}

export function useCreateRevision(studyId: string, projectId: string) {
  const onSaved = useRevisionSaved(studyId, projectId);
  return useMutation({
    mutationFn: (input: CreateRevisionInput) => createRevision(studyId, input),
    onSuccess: onSaved,
  });
}
