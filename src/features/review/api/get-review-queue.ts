import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ReviewQueueItemDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** Revisions in review assigned to the signed-in reviewer, oldest submission first. */
export function getReviewQueue(signal?: AbortSignal): Promise<ReviewQueueItemDto[]> {
  return api.get<ReviewQueueItemDto[]>(apiPaths.review.queue, { signal });
}

export function getReviewQueueQueryOptions() {
  return queryOptions({ queryKey: queryKeys.reviews.queue(), queryFn: ({ signal }) => getReviewQueue(signal) });
}

export function useReviewQueue() {
  return useQuery(getReviewQueueQueryOptions());
}
