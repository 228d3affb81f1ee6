import { useMutation } from "@tanstack/react-query";
import type { RevisionReviewDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { useInvalidateReview } from "@/features/review/hooks/use-invalidate-review";

/** Returns the revision with comments, unsigned (reviewers). */
export function returnRevision(revisionId: string, body: { comments: string }): Promise<RevisionReviewDto> {
  return api.post<RevisionReviewDto>(apiPaths.review.return(revisionId), body);
}

export function useReturnRevision(revisionId: string) {
  const invalidate = useInvalidateReview();
  return useMutation({ mutationFn: (body: { comments: string }) => returnRevision(revisionId, body), onSuccess: invalidate });
}
