import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SummaryDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** One signed summary: the payload as signed, its JWS, whether it is current, and the pole paths for the plots. */
export function getSummary(summaryId: string, signal?: AbortSignal): Promise<SummaryDto> {
  return api.get<SummaryDto>(apiPaths.summaries.detail(summaryId), { signal });
}

export function getSummaryQueryOptions(summaryId: string) {
  return queryOptions({ queryKey: queryKeys.summaries.detail(summaryId), queryFn: ({ signal }) => getSummary(summaryId, signal) });
}

export function useSummary(summaryId: string) {
  return useQuery(getSummaryQueryOptions(summaryId));
}
