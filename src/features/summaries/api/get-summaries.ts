import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SummaryListItemDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** Signed summaries of the caller's projects, newest first. */
export function getSummaries(signal?: AbortSignal): Promise<SummaryListItemDto[]> {
  return api.get<SummaryListItemDto[]>(apiPaths.summaries.list, { signal });
}

export function getSummariesQueryOptions() {
  return queryOptions({ queryKey: queryKeys.summaries.list(), queryFn: ({ signal }) => getSummaries(signal) });
}

export function useSummaries() {
  return useQuery(getSummariesQueryOptions());
}
