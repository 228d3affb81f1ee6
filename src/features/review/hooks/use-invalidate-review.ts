import { useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/query-keys";
import { getRevisionReviewQueryOptions } from "@/features/review/api/get-revision-review";
import { getReviewQueueQueryOptions } from "@/features/review/api/get-review-queue";

/** After a review write: the revision's review, the reviewer's queue and the summaries list are refetched. */
export function useInvalidateReview(revisionId: string) {
  const queryClient = useQueryClient();
  return async () => {
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: getRevisionReviewQueryOptions(revisionId).queryKey }),
      queryClient.invalidateQueries({ queryKey: getReviewQueueQueryOptions().queryKey }),
      queryClient.invalidateQueries({ queryKey: queryKeys.summaries.all() }),
    ]);
  };
}
