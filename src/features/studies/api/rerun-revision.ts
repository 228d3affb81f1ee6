import { useMutation } from "@tanstack/react-query";
import type { RevisionDto } from "@shared/schemas/revisions";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { useRevisionSaved } from "@/features/studies/hooks/use-revision-saved";

interface RerunRevisionInput {
  revisionId: string;
  /** The study's newest revision as the page shows it: the re-run goes on top of it (409 when a newer one exists). */
  parentRevision: number;
}

/** Computes a revision's document again with the server's current engine, stored as the study's next revision. */
export function rerunRevision({ revisionId, parentRevision }: RerunRevisionInput): Promise<RevisionDto> {
  return api.post<RevisionDto>(apiPaths.revisions.rerun(revisionId), { parentRevision });
}

export function useRerunRevision(studyId: string, projectId: string) {
  const onSaved = useRevisionSaved(studyId, projectId);
  return useMutation({
    mutationFn: rerunRevision,
    onSuccess: onSaved,
  });
}
