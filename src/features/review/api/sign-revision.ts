import { useMutation } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { useInvalidateReview } from "@/features/review/hooks/use-invalidate-review";

/** Signs the revision's stability summary with the reviewer's statement (reviewers; never the author). */
export function signRevision(revisionId: string, body: { statement: string }): Promise<{ summaryId: string }> {
  return api.post<{ summaryId: string }>(apiPaths.review.sign(revisionId), body);
}

export function useSignRevision(revisionId: string) {
  const invalidate = useInvalidateReview(revisionId);
  return useMutation({ mutationFn: (body: { statement: string }) => signRevision(revisionId, body), onSuccess: invalidate });
}
