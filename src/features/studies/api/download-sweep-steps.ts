import { useMutation } from "@tanstack/react-query";
import type { StudyDocument } from "@shared/schemas/study";
import { apiPaths } from "@/config/paths";
import { apiFile } from "@/lib/api-client";
import { saveFile } from "@/lib/save-file";

interface SweepStepsRequest {
  study: StudyDocument;
  format: "csv" | "json";
}

/**
 * Every solved step of an unsaved document's sweep as a file: the server runs the sweep again (nothing is stored)
 * and streams the table; the browser saves it.
 */
async function downloadSweepSteps({ study, format }: SweepStepsRequest): Promise<void> {
  const file = await apiFile(apiPaths.sweepSteps(format), study as unknown as Record<string, unknown>);
  saveFile(file.blob, file.fileName ?? `steps.${format}`);
}

export function useDownloadSweepSteps() {
  return useMutation({ mutationFn: downloadSweepSteps });
}
