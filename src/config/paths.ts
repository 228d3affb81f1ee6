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
    acceptInvite: {
      path: "/accept-invite",
      getHref: (token?: string) => (token ? `/accept-invite?token=${encodeURIComponent(token)}` : "/accept-invite"),
    },
    resetPassword: {
      path: "/reset-password",
      getHref: (token?: string) => (token ? `/reset-password?token=${encodeURIComponent(token)}` : "/reset-password"),
    },
    /** The public page that checks a signed summary by the verification code printed on its PDF. */
    verify: {
      path: "/verify/:code?",
      getHref: (code?: string) => (code ? `/verify/${encodeURIComponent(code)}` : "/verify"),
    },
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
    study: {
      path: "/projects/:projectId/studies/:studyId",
      getHref: (projectId: string, studyId: string, revision?: number) =>
        `/projects/${encodeURIComponent(projectId)}/studies/${encodeURIComponent(studyId)}${revision ? `?revision=${revision}` : ""}`,
    },
    studyRevisions: {
      path: "/projects/:projectId/studies/:studyId/revisions",
      getHref: (projectId: string, studyId: string) =>
        `/projects/${encodeURIComponent(projectId)}/studies/${encodeURIComponent(studyId)}/revisions`,
    },
    compare: {
      path: "/projects/:projectId/compare",
      /** `items`: revision ids to overlay (2–4). */
      getHref: (projectId: string, revisionIds: readonly string[] = []) =>
        `/projects/${encodeURIComponent(projectId)}/compare${revisionIds.length ? `?revisions=${revisionIds.map(encodeURIComponent).join(",")}` : ""}`,
    },
    signedSummaries: {
      path: "/signed-summaries",
      getHref: () => "/signed-summaries",
    },
    summary: {
      path: "/summaries/:summaryId",
      getHref: (summaryId: string) => `/summaries/${encodeURIComponent(summaryId)}`,
    },
    reviews: {
      path: "/reviews",
      getHref: () => "/reviews",
    },
    summaryPreview: {
      path: "/reviews/:revisionId/summary",
      /** The summary of a revision as it would be signed now: read here, then sign or return. */
      getHref: (revisionId: string) => `/reviews/${encodeURIComponent(revisionId)}/summary`,
    },
    admin: {
      path: "/admin",
      /** `projectId`: the project whose members the page opens on. */
      getHref: (projectId?: string) => (projectId ? `/admin?project=${encodeURIComponent(projectId)}` : "/admin"),
    },
    devMailbox: {
      path: "/admin/mailbox",
      /** `to`: show only the messages to this recipient. */
      getHref: (to?: string) => (to ? `/admin/mailbox?to=${encodeURIComponent(to)}` : "/admin/mailbox"),
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
    members: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/members`,
    member: (projectId: string, userId: string) =>
      `/api/projects/${encodeURIComponent(projectId)}/members/${encodeURIComponent(userId)}`,
    invitations: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/invitations`,
    alternatives: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/alternatives`,
    comparison: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/comparison`,
    criteria: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/criteria`,
    criteriaHistory: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/criteria/history`,
    reviewStates: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/review-states`,
  },
  alternatives: {
    studies: (alternativeId: string) => `/api/alternatives/${encodeURIComponent(alternativeId)}/studies`,
    datasets: (alternativeId: string) => `/api/alternatives/${encodeURIComponent(alternativeId)}/datasets`,
  },
  datasets: {
    detail: (datasetId: string) => `/api/datasets/${encodeURIComponent(datasetId)}`,
  },
  studies: {
    detail: (studyId: string) => `/api/studies/${encodeURIComponent(studyId)}`,
    revisions: (studyId: string) => `/api/studies/${encodeURIComponent(studyId)}/revisions`,
    import: (studyId: string) => `/api/studies/${encodeURIComponent(studyId)}/import`,
    reviewStates: (studyId: string) => `/api/studies/${encodeURIComponent(studyId)}/review-states`,
  },
  revisions: {
    detail: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}`,
    diff: (fromId: string, toId: string) =>
      `/api/revisions/${encodeURIComponent(fromId)}/diff/${encodeURIComponent(toId)}`,
    rerun: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/rerun`,
    export: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/export`,
    /** Every solved step of the revision's sweep, as a file download. */
    steps: (revisionId: string, format: "csv" | "json") => `/api/revisions/${encodeURIComponent(revisionId)}/steps.${format}`,
  },
  users: {
    list: "/api/users",
    detail: (userId: string) => `/api/users/${encodeURIComponent(userId)}`,
  },
  sweep: "/api/sweep",
  /** POST a study document: every solved step of its sweep, as a file download. */
  sweepSteps: (format: "csv" | "json") => `/api/sweep/steps.${format}`,
  review: {
    queue: "/api/review-queue",
    state: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/review`,
    summaryPreview: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/summary-preview`,
    submit: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/submit`,
    return: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/return`,
    sign: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/sign`,
    reviewer: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/reviewer`,
    comments: (revisionId: string) => `/api/revisions/${encodeURIComponent(revisionId)}/comments`,
  },
  summaries: {
    list: "/api/summaries",
    detail: (summaryId: string) => `/api/summaries/${encodeURIComponent(summaryId)}`,
    pdf: (summaryId: string) => `/api/summaries/${encodeURIComponent(summaryId)}/pdf`,
  },
  jwks: "/.well-known/jwks.json",
  signatures: {
    byCode: (code: string) => `/api/signatures/by-code/${encodeURIComponent(code)}`,
  },
  invitations: {
    /** Creating one is per project: `projects.invitations(projectId)`. */
    accept: "/api/invitations/accept",
  },
  passwordReset: {
    request: "/api/auth/password-reset",
    confirm: "/api/auth/password-reset/confirm",
  },
  screening: "/api/screening",
  /** What the local fake SMTP server received (administrators; 404 when real SMTP is configured). */
  devMailbox: (query: { to?: string; limit?: number } = {}) => {
    const search = new URLSearchParams();
    if (query.to) search.set("to", query.to);
    if (query.limit !== undefined) search.set("limit", String(query.limit));
    const qs = search.toString();
    return qs ? `/api/dev/mailbox?${qs}` : "/api/dev/mailbox";
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
