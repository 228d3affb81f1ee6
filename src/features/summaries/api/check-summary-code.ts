import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SummaryCheckDto } from "@shared/schemas/verification";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** The summary on record with this verification code, checked by the server against its published keys (no sign-in). */
export function checkSummaryCode(code: string, signal?: AbortSignal): Promise<SummaryCheckDto> {
  return api.get<SummaryCheckDto>(apiPaths.signatures.byCode(code), { signal, redirectOnUnauthorized: false });
}

export function useSummaryCodeCheck(code: string | null) {
  return useQuery({
    ...queryOptions({ queryKey: queryKeys.signatures.byCode(code ?? ""), queryFn: ({ signal }) => checkSummaryCode(code!, signal) }),
    enabled: code !== null && code !== "",
  });
}
