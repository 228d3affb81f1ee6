import { useMutation } from "@tanstack/react-query";
import type { RevisionReviewDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { useInvalidateReview } from "@/features/review/hooks/use-invalidate-review";

/** Adds a comment to the revision (analysts and reviewers). */
export function addComment(revisionId: string, body: { body: string }): Promise<RevisionReviewDto> {
  return api.post<RevisionReviewDto>(apiPaths.review.comments(revisionId), body);
}

export function useAddComment(revisionId: string) {
  const invalidate = useInvalidateReview();
  return useMutation({ mutationFn: (body: { body: string }) => addComment(revisionId, body), onSuccess: invalidate });
}
