import { useMutation } from "@tanstack/react-query";
import type { RevisionReviewDto } from "@shared/schemas/review";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { useInvalidateReview } from "@/features/review/hooks/use-invalidate-review";

interface ReassignReviewerInput {
  reviewerId: string;
  note?: string;
}

/** Hands a revision in review to another reviewer of the project (administrators). */
export function reassignReviewer(revisionId: string, body: ReassignReviewerInput): Promise<RevisionReviewDto> {
  return api.post<RevisionReviewDto>(apiPaths.review.reviewer(revisionId), { ...body });
}

export function useReassignReviewer(revisionId: string) {
  const invalidate = useInvalidateReview();
  return useMutation({ mutationFn: (body: ReassignReviewerInput) => reassignReviewer(revisionId, body), onSuccess: invalidate });
}
