import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SummaryPreviewDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** The revision's stability summary exactly as the server would sign it now, with the hash the signature carries back. */
export function getSummaryPreview(revisionId: string, signal?: AbortSignal): Promise<SummaryPreviewDto> {
  return api.get<SummaryPreviewDto>(apiPaths.review.summaryPreview(revisionId), { signal });
}

export function getSummaryPreviewQueryOptions(revisionId: string) {
  return queryOptions({
    queryKey: queryKeys.reviews.preview(revisionId),
    queryFn: ({ signal }) => getSummaryPreview(revisionId, signal),
    // What is signed must be what is read: never show an old copy while a newer one loads.
    staleTime: 0,
  });
}

export function useSummaryPreview(revisionId: string) {
  return useQuery(getSummaryPreviewQueryOptions(revisionId));
}
