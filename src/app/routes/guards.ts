import type { QueryClient } from "@tanstack/react-query";
import { redirect } from "react-router-dom";
import { paths, safeRedirectTarget } from "@/config/paths";
import { homeFor } from "@/lib/authorization";
import type { User } from "@/types/api";
import { getMeQueryOptions } from "@/features/auth/api/get-me";

/** The signed-in user, or a redirect to the sign-in page that returns here afterwards. */
export async function requireUser(queryClient: QueryClient, request: Request): Promise<User> {
  const me = await queryClient.ensureQueryData(getMeQueryOptions());
  if (!me) {
    const url = new URL(request.url);
    throw redirect(paths.auth.signIn.getHref(safeRedirectTarget(`${url.pathname}${url.search}`)));
  }
  return me;
}

export function homeHref(user: User): string {
  return homeFor(user, {
    projects: paths.app.projects.getHref(),
    signedSummaries: paths.app.signedSummaries.getHref(),
  });
}

/** Sends a user whose role has no use for this screen to their own start page (the API would answer 403). */
export async function requireAccess(
  queryClient: QueryClient,
  request: Request,
  allowed: (user: User) => boolean,
): Promise<User> {
  const me = await requireUser(queryClient, request);
  if (!allowed(me)) throw redirect(homeHref(me));
  return me;
}
