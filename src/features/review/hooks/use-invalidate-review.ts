import { useQueryClient, type QueryKey } from "@tanstack/react-query";
import { queryKeys } from "@/lib/query-keys";

const sameKey = (a: QueryKey, b: QueryKey) => a.length === b.length && a.every((part, i) => part === b[i]);

/**
 * After a review write: every review query (the revision's review, the reviewer's queue, the summary previews, the
 * review states of studies and projects) and the summaries list are refetched — except `keep`, a query the write
 * has ended (the preview of a revision just signed no longer exists: asking again would only be refused).
 */
export function useInvalidateReview(keep?: QueryKey) {
  const queryClient = useQueryClient();
  return async () => {
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: queryKeys.reviews.all(), predicate: (query) => !keep || !sameKey(query.queryKey, keep) }),
      queryClient.invalidateQueries({ queryKey: queryKeys.summaries.all() }),
    ]);
  };
}
