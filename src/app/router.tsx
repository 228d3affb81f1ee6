import { useQueryClient, type QueryClient } from "@tanstack/react-query";
import { useMemo } from "react";
import { createBrowserRouter, redirect, RouterProvider, type RouteObject } from "react-router-dom";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { homeHref, requireUser } from "@/app/routes/guards";
import { RouteErrorBoundary } from "@/app/routes/route-error-boundary";

/**
 * What the first page load shows while a route's module and loader run (React Router's hydration fallback):
 * a whole-page waiting line for top-level routes, a panel-sized one inside the app frame for its screens.
 */
function PageFallback() {
  return <LoadingBlock label="Loading Stillspan…" className="min-h-dvh" />;
}

function ScreenFallback() {
  return <LoadingBlock label="Loading…" />;
}

/**
 * Data routes. Each screen is its own lazily loaded module (heavy screens such as plots then cost nothing
 * until opened), guarded by its loader, and wrapped in its own error boundary so one failing screen leaves
 * the frame and navigation usable.
 */
export function createAppRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.auth.signIn.path,
      ErrorBoundary: RouteErrorBoundary,
      HydrateFallback: PageFallback,
      lazy: async () => {
        const { SignInRoute, clientLoader } = await import("@/app/routes/sign-in");
        return { Component: SignInRoute, loader: clientLoader(queryClient) };
      },
    },
    {
      path: paths.auth.acceptInvite.path,
      ErrorBoundary: RouteErrorBoundary,
      HydrateFallback: () => <LoadingBlock label="Loading…" className="min-h-dvh" />,
      lazy: async () => ({ Component: (await import("@/app/routes/accept-invite")).AcceptInviteRoute }),
    },
    {
      path: paths.auth.resetPassword.path,
      ErrorBoundary: RouteErrorBoundary,
      HydrateFallback: () => <LoadingBlock label="Loading…" className="min-h-dvh" />,
      lazy: async () => ({ Component: (await import("@/app/routes/reset-password")).ResetPasswordRoute }),
    },
    {
      path: paths.auth.verify.path,
      ErrorBoundary: RouteErrorBoundary,
      HydrateFallback: () => <LoadingBlock label="Loading…" className="min-h-dvh" />,
      lazy: async () => ({ Component: (await import("@/app/routes/verify")).VerifyRoute }),
    },
    {
      path: paths.home.path,
      ErrorBoundary: RouteErrorBoundary,
      HydrateFallback: PageFallback,
      lazy: async () => {
        const { AppRoot, clientLoader } = await import("@/app/routes/app/root");
        return { Component: AppRoot, loader: clientLoader(queryClient) };
      },
      children: [
        {
          index: true,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          // The loader always redirects; this only shows if that takes a moment.
          Component: () => <LoadingBlock label="Opening your start page…" />,
          loader: async ({ request }) => redirect(homeHref(await requireUser(queryClient, request))),
        },
        {
          path: paths.app.projects.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { ProjectsRoute, clientLoader } = await import("@/app/routes/app/projects");
            return { Component: ProjectsRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.project.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { ProjectRoute, clientLoader } = await import("@/app/routes/app/project");
            return { Component: ProjectRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.study.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { StudyRoute, clientLoader } = await import("@/app/routes/app/study");
            return { Component: StudyRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.studyRevisions.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { StudyRevisionsRoute, clientLoader } = await import("@/app/routes/app/study-revisions");
            return { Component: StudyRevisionsRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.compare.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { CompareRoute, clientLoader } = await import("@/app/routes/app/compare");
            return { Component: CompareRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.signedSummaries.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { SignedSummariesRoute, clientLoader } = await import("@/app/routes/app/signed-summaries");
            return { Component: SignedSummariesRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.summary.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { SummaryRoute, clientLoader } = await import("@/app/routes/app/summary");
            return { Component: SummaryRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.reviews.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { ReviewsRoute, clientLoader } = await import("@/app/routes/app/reviews");
            return { Component: ReviewsRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.summaryPreview.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { SummaryPreviewRoute, clientLoader } = await import("@/app/routes/app/summary-preview");
            return { Component: SummaryPreviewRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.admin.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { AdminRoute, clientLoader } = await import("@/app/routes/app/admin");
            return { Component: AdminRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: paths.app.devMailbox.path,
          ErrorBoundary: RouteErrorBoundary,
          HydrateFallback: ScreenFallback,
          lazy: async () => {
            const { DevMailboxRoute, clientLoader } = await import("@/app/routes/app/dev-mailbox");
            return { Component: DevMailboxRoute, loader: clientLoader(queryClient) };
          },
        },
        {
          path: "*",
          ErrorBoundary: RouteErrorBoundary,
          lazy: async () => {
            const { NotFoundRoute } = await import("@/app/routes/app/not-found");
            return { Component: NotFoundRoute };
          },
        },
      ],
    },
  ];
}

export function AppRouter() {
  const queryClient = useQueryClient();
  const router = useMemo(() => createBrowserRouter(createAppRoutes(queryClient)), [queryClient]);
  return <RouterProvider router={router} />;
}
