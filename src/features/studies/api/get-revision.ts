import { queryOptions, useQueries, useQuery } from "@tanstack/react-query";
import type { RevisionDto } from "@shared/schemas/revisions";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** One revision with its full study document and stored result. Revisions never change, so the cache keeps them. */
export function getRevision(revisionId: string, signal?: AbortSignal): Promise<RevisionDto> {
  return api.get<RevisionDto>(apiPaths.revisions.detail(revisionId), { signal });
}

export function getRevisionQueryOptions(revisionId: string) {
  return queryOptions({
    queryKey: queryKeys.revisions.detail(revisionId),
    queryFn: ({ signal }) => getRevision(revisionId, signal),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useRevision(revisionId: string | null) {
  return useQuery({ ...getRevisionQueryOptions(revisionId ?? ""), enabled: revisionId !== null });
}

export function useRevisionList(revisionIds: readonly string[]) {
  return useQueries({ queries: revisionIds.map((id) => getRevisionQueryOptions(id)) });
}
