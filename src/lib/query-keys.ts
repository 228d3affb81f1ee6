/**
 * Every TanStack Query key of the client, one home each. A feature's `queryOptions` take their key from here, and a
 * mutation that must refresh what another feature shows invalidates through the same function: features never
 * import each other, and a key typed out twice drifts apart. Keys are arrays that start with the resource
 * (`["studies", "detail", id]`); a shorter key is a prefix that matches every key below it.
 * ESLint refuses an array literal as a `queryKey` anywhere else.
 */
export const queryKeys = {
  me: () => ["auth", "me"] as const,
  users: {
    list: () => ["users", "list"] as const,
  },
  projects: {
    list: () => ["projects", "list"] as const,
    detail: (projectId: string) => ["projects", "detail", projectId] as const,
    members: (projectId: string) => ["projects", "members", projectId] as const,
  },
  criteria: {
    detail: (projectId: string) => ["criteria", "detail", projectId] as const,
    history: (projectId: string) => ["criteria", "history", projectId] as const,
    /** Prefix of every screening answer (they depend on the project's criteria). */
    screenings: () => ["criteria", "screening"] as const,
    /** `input`: only the parts of the request the screening reads. */
    screening: (projectId: string | null, input: unknown) => ["criteria", "screening", projectId, input] as const,
  },
  comparison: (projectId: string) => ["comparison", projectId] as const,
  alternatives: {
    list: (projectId: string) => ["alternatives", "list", projectId] as const,
  },
  studies: {
    /** Prefix of every study and its revision list (each revision carries its assessment). */
    all: () => ["studies"] as const,
    list: (alternativeId: string) => ["studies", "list", alternativeId] as const,
    detail: (studyId: string) => ["studies", "detail", studyId] as const,
    revisions: (studyId: string) => ["studies", "revisions", studyId] as const,
  },
  revisions: {
    /** Prefix of every revision (each carries its assessment against the project's current criteria). */
    all: () => ["revisions"] as const,
    detail: (revisionId: string) => ["revisions", "detail", revisionId] as const,
    diff: (fromId: string, toId: string) => ["revisions", "diff", fromId, toId] as const,
  },
  datasets: {
    list: (alternativeId: string) => ["datasets", "list", alternativeId] as const,
  },
  reviews: {
    /** Prefix of every review key: a review write, or a new revision (it supersedes older ones), refreshes them all. */
    all: () => ["reviews"] as const,
    queue: () => ["reviews", "queue"] as const,
    revision: (revisionId: string) => ["reviews", "revision", revisionId] as const,
    preview: (revisionId: string) => ["reviews", "preview", revisionId] as const,
    studyStates: (studyId: string) => ["reviews", "states", "study", studyId] as const,
    projectStates: (projectId: string) => ["reviews", "states", "project", projectId] as const,
  },
  summaries: {
    /** Prefix of the list and of every signed summary (a signature adds one). */
    all: () => ["summaries"] as const,
    list: () => ["summaries", "list"] as const,
    detail: (summaryId: string) => ["summaries", "detail", summaryId] as const,
  },
  signatures: {
    jwks: () => ["signatures", "jwks"] as const,
    verify: (summaryId: string, jws: string) => ["signatures", "verify", summaryId, jws] as const,
    /** The public check of a summary by the verification code on its PDF. */
    byCode: (code: string) => ["signatures", "by-code", code] as const,
  },
  devMailbox: {
    list: (filter: { to: string | null; limit: number }) => ["dev-mailbox", "list", filter] as const,
  },
};
