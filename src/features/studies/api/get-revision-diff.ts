import { queryOptions, useQuery } from "@tanstack/react-query";
import type { RevisionDiffDto } from "@shared/schemas/revisions";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export function getRevisionDiff(fromId: string, toId: string, signal?: AbortSignal): Promise<RevisionDiffDto> {
  return api.get<RevisionDiffDto>(apiPaths.revisions.diff(fromId, toId), { signal });
}

export function getRevisionDiffQueryOptions(fromId: string, toId: string) {
  return queryOptions({
    queryKey: queryKeys.revisions.diff(fromId, toId),
    queryFn: ({ signal }) => getRevisionDiff(fromId, toId, signal),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useRevisionDiff(fromId: string | null, toId: string | null) {
  return useQuery({
    ...getRevisionDiffQueryOptions(fromId ?? "", toId ?? ""),
    enabled: fromId !== null && toId !== null && fromId !== toId,
  });
}
