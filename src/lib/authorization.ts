import type { ProjectRole, User } from "@/types/api";

/**
 * What the client shows to whom. The server enforces every rule again (requireRole); these helpers only
 * hide what a role cannot use, so nobody meets a button that will answer 403.
 */

const WORKSPACE_ROLES: readonly ProjectRole[] = ["analyst", "reviewer"];

/** Analysts, reviewers and administrators work with projects and studies. */
export function canUseWorkspace(user: User): boolean {
  return user.isAdmin || user.memberships.some((m) => WORKSPACE_ROLES.includes(m.role));
}

/** Everyone invited to a project can read its signed summaries; the workspace roles read them in the project. */
export function canReadSignedSummaries(user: User): boolean {
  return user.isAdmin || user.memberships.length > 0;
}

export function canAdminister(user: User): boolean {
  return user.isAdmin;
}

export function roleInProject(user: User, projectId: string): ProjectRole | null {
  return user.memberships.find((m) => m.projectId === projectId)?.role ?? null;
}

const ROLE_LABELS: Record<ProjectRole, string> = {
  analyst: "Analyst",
  reviewer: "Reviewer",
  viewer: "Viewer",
};

export function roleLabel(role: ProjectRole | null, isAdmin = false): string {
  if (role) return ROLE_LABELS[role];
  return isAdmin ? "Administrator" : "No role";
}

/** A one-line description of the user's standing, shown beside the name in the app frame. */
export function standingLabel(user: User): string {
  if (user.isAdmin) return "Administrator";
  const roles = [...new Set(user.memberships.map((m) => m.role))];
  if (roles.length === 0) return "No project yet";
  return roles.map((r) => ROLE_LABELS[r]).join(" · ");
}

/** Where a user lands after signing in or opening the site root. */
export function homeFor(user: User, paths: { projects: string; signedSummaries: string }): string {
  return canUseWorkspace(user) ? paths.projects : paths.signedSummaries;
}
