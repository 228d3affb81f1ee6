import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { PageHeader } from "@/components/ui/page-header";
import { canUseWorkspace } from "@/lib/authorization";
import { ReviewQueue } from "@/features/review/components/review-queue";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canUseWorkspace);
    return null;
  };

export function ReviewsRoute() {
  return (
    <>
      <PageHeader
        title="Review queue"
        description="Study revisions submitted to you. Read each one's stability summary exactly as it will be signed, then sign it with your statement or return the revision with comments."
      />
      <ReviewQueue />
    </>
  );
}
