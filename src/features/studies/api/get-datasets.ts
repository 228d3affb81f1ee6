import { queryOptions, useQuery } from "@tanstack/react-query";
import type { DatasetDto } from "@shared/schemas/datasets";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** The aerodynamic data sets uploaded for one deck alternative. */
export function getDatasets(alternativeId: string, signal?: AbortSignal): Promise<DatasetDto[]> {
  return api.get<DatasetDto[]>(apiPaths.alternatives.datasets(alternativeId), { signal });
}

export function getDatasetsQueryOptions(alternativeId: string) {
  return queryOptions({
    queryKey: queryKeys.datasets.list(alternativeId),
    queryFn: ({ signal }) => getDatasets(alternativeId, signal),
  });
}

export function useDatasets(alternativeId: string | null) {
  return useQuery({ ...getDatasetsQueryOptions(alternativeId ?? ""), enabled: alternativeId !== null });
}
