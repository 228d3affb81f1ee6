import { useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/query-keys";

/**
 * After a review write: every review query (the revision's review, the reviewer's queue, the summary previews, the
 * review states of studies and projects) and the summaries list are refetched.
 */
export function useInvalidateReview() {
  const queryClient = useQueryClient();
  return async () => {
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: queryKeys.reviews.all() }),
      queryClient.invalidateQueries({ queryKey: queryKeys.summaries.all() }),
    ]);
  };
}
