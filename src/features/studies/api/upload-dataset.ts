import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { DatasetDto, DatasetMetaInput } from "@shared/schemas/datasets";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { getAlternativesQueryOptions } from "@/features/studies/api/get-alternatives";
import { getDatasetsQueryOptions } from "@/features/studies/api/get-datasets";

export interface UploadDatasetInput {
  file: File;
  meta: DatasetMetaInput;
}

/**
 * Uploads a test data set for a deck alternative: the CSV kept byte for byte and its description (`meta`). The
 * server reads, checks and converts it; a file it cannot read answers 400 with every problem's line and column.
 */
export function uploadDataset(alternativeId: string, { file, meta }: UploadDatasetInput): Promise<DatasetDto> {
  const form = new FormData();
  form.append("meta", JSON.stringify(meta));
  form.append("file", file, file.name);
  return api.upload<DatasetDto>(apiPaths.alternatives.datasets(alternativeId), form);
}

export function useUploadDataset(alternativeId: string, projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadDatasetInput) => uploadDataset(alternativeId, input),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: getDatasetsQueryOptions(alternativeId).queryKey });
      void queryClient.invalidateQueries({ queryKey: getAlternativesQueryOptions(projectId).queryKey });
    },
  });
}
