/**
 * Every URL the client uses — pages and API endpoints — comes from here, so a route can move in one edit.
 * `path` is the router pattern; `getHref` builds a concrete link.
 */
export const paths = {
  home: {
    path: "/",
    getHref: () => "/",
  },
  auth: {
    signIn: {
      path: "/sign-in",
      getHref: (redirectTo?: string | null) =>
        redirectTo && redirectTo !== "/" ? `/sign-in?redirectTo=${encodeURIComponent(redirectTo)}` : "/sign-in",
    },
  },
  app: {
    projects: {
      path: "/projects",
      getHref: () => "/projects",
    },
    project: {
      path: "/projects/:projectId",
      getHref: (projectId: string) => `/projects/${encodeURIComponent(projectId)}`,
    },
    signedSummaries: {
      path: "/signed-summaries",
      getHref: () => "/signed-summaries",
    },
    admin: {
      path: "/admin",
      getHref: () => "/admin",
    },
  },
} as const;

/** API endpoints, relative to the site root (served by Express; proxied by Vite in development). */
export const apiPaths = {
  health: "/api/health",
  auth: {
    signIn: "/api/auth/sign-in",
    signOut: "/api/auth/sign-out",
    me: "/api/auth/me",
  },
  projects: {
    list: "/api/projects",
    detail: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}`,
  },
} as const;

/**
 * Only same-site paths are accepted as a place to return to after signing in, so a crafted
 * `?redirectTo=https://elsewhere` link cannot send the user off the site.
 */
export function safeRedirectTarget(value: string | null | undefined): string | null {
  if (!value || !value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return null;
  if (value.startsWith(paths.auth.signIn.path)) return null;
  return value;
}
