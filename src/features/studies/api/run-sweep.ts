import { useMutation } from "@tanstack/react-query";
import type { SweepResult } from "@shared/schemas/result";
import type { StudyDocument } from "@shared/schemas/study";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";

/** Runs a sweep of an unsaved document on the server (nothing is stored): the authoritative numbers. The body is the document itself. */
export function runSweepOnServer(study: StudyDocument): Promise<SweepResult> {
  return api.post<SweepResult>(apiPaths.sweep, study as unknown as Record<string, unknown>);
}

export function useRunSweep() {
  return useMutation({ mutationFn: runSweepOnServer });
}
