import type { QueryClient } from "@tanstack/react-query";
import { useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { PageHeader } from "@/components/ui/page-header";
import { canAdminister } from "@/lib/authorization";
import { DEV_MAILBOX_LIMIT, getDevMailboxQueryOptions } from "@/features/dev-mailbox/api/get-dev-mailbox";
import { DevMailbox } from "@/features/dev-mailbox/components/dev-mailbox";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canAdminister);
    const to = new URL(request.url).searchParams.get("to") ?? undefined;
    void queryClient.prefetchQuery(getDevMailboxQueryOptions({ to, limit: DEV_MAILBOX_LIMIT }));
    return null;
  };

/** The development mailbox (administrators): `?to=` narrows it to one recipient, `?message=` opens a message. */
export function DevMailboxRoute() {
  const [searchParams, setSearchParams] = useSearchParams();
  const to = searchParams.get("to") ?? undefined;

  return (
    <>
      <PageHeader
        title="Development mailbox"
        description="For development and test runs: what the local fake SMTP server received. These messages never left this machine."
      />
      <DevMailbox
        to={to}
        selectedId={searchParams.get("message") ?? undefined}
        onFilterChange={(next) => setSearchParams(next ? { to: next } : {})}
        onSelect={(id) =>
          setSearchParams(to ? { to, message: String(id) } : { message: String(id) }, { replace: true })
        }
      />
    </>
  );
}
