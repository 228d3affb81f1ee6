import { useMutation } from "@tanstack/react-query";
import type { SignReviewInput } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { useInvalidateReview } from "@/features/review/hooks/use-invalidate-review";

/**
 * Signs the revision's stability summary with the reviewer's statement (the assigned reviewer; never the author),
 * carrying the hash of the summary preview that was read: the server refuses (409) a summary that changed since.
 */
export function signRevision(revisionId: string, body: SignReviewInput): Promise<{ summaryId: string }> {
  return api.post<{ summaryId: string }>(apiPaths.review.sign(revisionId), body);
}

export function useSignRevision(revisionId: string) {
  const invalidate = useInvalidateReview(queryKeys.reviews.preview(revisionId));
  return useMutation({ mutationFn: (body: SignReviewInput) => signRevision(revisionId, body), onSuccess: invalidate });
}
