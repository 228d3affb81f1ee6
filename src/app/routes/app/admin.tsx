import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { canAdminister } from "@/lib/authorization";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canAdminister);
    return null;
  };

export function AdminRoute() {
  return (
    <>
      <PageHeader title="Admin" description="Accounts, project membership and signing keys." />
      <Card title="Accounts and membership" subtitle="Not yet available in the browser">
        <p className="max-w-prose text-ink-700">
          Account and membership management is not in this release. Projects and their members are created by the
          server's seed and command-line tools for now.
        </p>
      </Card>
    </>
  );
}
