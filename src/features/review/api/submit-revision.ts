import { useMutation } from "@tanstack/react-query";
import type { RevisionReviewDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { useInvalidateReview } from "@/features/review/hooks/use-invalidate-review";

/** Submits the revision to a reviewer of the project (analysts). */
export function submitRevision(revisionId: string, body: { reviewerId: string; note?: string }): Promise<RevisionReviewDto> {
  return api.post<RevisionReviewDto>(apiPaths.review.submit(revisionId), body);
}

export function useSubmitRevision(revisionId: string) {
  const invalidate = useInvalidateReview();
  return useMutation({ mutationFn: (body: { reviewerId: string; note?: string }) => submitRevision(revisionId, body), onSuccess: invalidate });
}
