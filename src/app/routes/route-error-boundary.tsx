import { isRouteErrorResponse, Link, useRouteError } from "react-router-dom";
import { ErrorPanel } from "@/components/ui/error-panel";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";

function describe(error: unknown): { title: string; message: string; code?: string } {
  if (isRouteErrorResponse(error)) {
    if (error.status === 404) return { title: "Page not found", message: "There is no page at this address." };
    return { title: `Error ${error.status}`, message: error.statusText || "The page could not be shown." };
  }
  if (error instanceof ApiError) return { title: "The server refused", message: error.message, code: error.code };
  // A stale tab after a new release can ask for a code chunk that no longer exists.
  if (error instanceof TypeError && /dynamically imported module|Importing a module script/i.test(error.message)) {
    return { title: "Stillspan was updated", message: "Reload the page to load the new version." };
  }
  return { title: "This screen failed", message: "An unexpected error stopped this screen. Reload to try again." };
}

/** Shown in place of a route that threw while loading or rendering; the rest of the app keeps working. */
export function RouteErrorBoundary() {
  const error = useRouteError();
  const { title, message, code } = describe(error);
  if (import.meta.env.DEV) console.error(error);
  return (
    <div className="mx-auto max-w-2xl space-y-3 py-6">
      <ErrorPanel title={title} message={message} code={code} onRetry={() => window.location.reload()} />
      <p className="text-sm">
        <Link to={paths.home.getHref()} className="text-tide-700 hover:underline">
          Go to the start page
        </Link>
      </p>
    </div>
  );
}
