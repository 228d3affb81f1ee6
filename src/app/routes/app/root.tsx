import type { QueryClient } from "@tanstack/react-query";
import { Navigate, Outlet, useNavigate, useNavigation, type LoaderFunctionArgs } from "react-router-dom";
import { AppFrame, type NavItem } from "@/components/ui/app-frame";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { canAdminister, canReadSignedSummaries, canUseWorkspace, standingLabel } from "@/lib/authorization";
import type { User } from "@/types/api";
import { useMe } from "@/features/auth/api/get-me";
import { useSignOut } from "@/features/auth/api/sign-out";
import { requireUser } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };

/**
 * The sections a user may open. Analysts and reviewers work in projects (studies and comparison join them);
 * an owner's representative reads signed summaries only; reviewers also have their review queue; administrators
 * also manage accounts.
 */
export function navigationFor(user: User): NavItem[] {
  const items: NavItem[] = [];
  if (canUseWorkspace(user)) items.push({ to: paths.app.projects.getHref(), label: "Projects" });
  if (user.memberships.some((m) => m.role === "reviewer")) items.push({ to: paths.app.reviews.getHref(), label: "Review queue" });
  if (canReadSignedSummaries(user)) items.push({ to: paths.app.signedSummaries.getHref(), label: "Signed summaries" });
  if (canAdminister(user)) items.push({ to: paths.app.admin.getHref(), label: "Admin", end: true });
  if (canAdminister(user)) items.push({ to: paths.app.devMailbox.getHref(), label: "Mailbox" });
  return items;
}

export function AppRoot() {
  const me = useMe();
  const navigation = useNavigation();
  const navigate = useNavigate();
  const signOut = useSignOut({ onSuccess: () => navigate(paths.auth.signIn.getHref(), { replace: true }) });

  if (me.isPending) return <LoadingBlock label="Checking your session…" className="min-h-dvh" />;
  if (me.isError) {
    return (
      <div className="mx-auto max-w-2xl p-6">
        <ErrorPanel
          title="Your session could not be checked"
          message={me.error.message}
          onRetry={() => void me.refetch()}
          isRetrying={me.isFetching}
        />
      </div>
    );
  }
  if (!me.data) return <Navigate to={paths.auth.signIn.getHref()} replace />;

  const user = me.data;
  return (
    <AppFrame
      navItems={navigationFor(user)}
      user={{ name: user.name, email: user.email, standing: standingLabel(user) }}
      onSignOut={() => signOut.mutate()}
      isSigningOut={signOut.isPending}
      isNavigating={navigation.state === "loading"}
    >
      {signOut.isError ? (
        <ErrorPanel
          className="mb-4"
          title="Sign-out did not complete"
          message={`${signOut.error.message} You are still signed in.`}
          onRetry={() => signOut.mutate()}
        />
      ) : null}
      <Outlet />
    </AppFrame>
  );
}
