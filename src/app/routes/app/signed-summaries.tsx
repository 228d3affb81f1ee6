import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { canReadSignedSummaries } from "@/lib/authorization";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canReadSignedSummaries);
    return null;
  };

export function SignedSummariesRoute() {
  return (
    <>
      <PageHeader
        title="Signed summaries"
        description="Stability summaries signed by the project's reviewing engineer, for the projects you are invited to."
      />
      <Card title="Summaries" subtitle="None yet">
        <p className="max-w-prose text-ink-700">
          No summary has been signed yet. When a reviewer signs the stability summary of a study, it appears here
          with its critical speeds, margins and the signature's details.
        </p>
      </Card>
    </>
  );
}
