import { queryOptions, useQuery } from "@tanstack/react-query";
import type { RevisionReviewDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** A revision's review: state, request, comments, history and signature. */
export function getRevisionReview(revisionId: string, signal?: AbortSignal): Promise<RevisionReviewDto> {
  return api.get<RevisionReviewDto>(apiPaths.review.state(revisionId), { signal });
}

export function getRevisionReviewQueryOptions(revisionId: string) {
  return queryOptions({
    queryKey: queryKeys.reviews.revision(revisionId),
    queryFn: ({ signal }) => getRevisionReview(revisionId, signal),
  });
}

export function useRevisionReview(revisionId: string) {
  return useQuery(getRevisionReviewQueryOptions(revisionId));
}
