import { useMutation } from "@tanstack/react-query";
import type { RevisionDto } from "@shared/schemas/revisions";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { useRevisionSaved } from "@/features/studies/hooks/use-revision-saved";

export interface ImportRevisionInput {
  file: File;
  /** The revision the import goes on top of (409 when a newer one exists). */
  parentRevision: number;
  changeNote: string;
}

/** Uploads a study file (`stillspan.study/1` JSON) as the study's next revision; the server validates and runs it. */
export function importRevision(studyId: string, input: ImportRevisionInput): Promise<RevisionDto> {
  const form = new FormData();
  form.append("parentRevision", String(input.parentRevision));
  form.append("changeNote", input.changeNote);
  form.append("file", input.file, input.file.name);
  return api.upload<RevisionDto>(apiPaths.studies.import(studyId), form);
}

export function useImportRevision(studyId: string, projectId: string) {
  const onSaved = useRevisionSaved(studyId, projectId);
  return useMutation({
    mutationFn: (input: ImportRevisionInput) => importRevision(studyId, input),
    onSuccess: onSaved,
  });
}
