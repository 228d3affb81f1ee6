import { useMutation } from "@tanstack/react-query";
import type { SweepResult } from "@shared/schemas/result";
import type { StudyDocument } from "@shared/schemas/study";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";

/** Runs a sweep of an unsaved document on the server (nothing is stored): the authoritative numbers. */
export function runSweepOnServer(study: StudyDocument): Promise<SweepResult> {
  return api.post<SweepResult>(apiPaths.sweep, { study });
}

export function useRunSweep() {
  return useMutation({ mutationFn: runSweepOnServer });
}
