import { queryOptions } from "@tanstack/react-query";
import type { JSONWebKeySet } from "jose";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** The server's published public keys (RFC 7517 JWK Set) that verify signed summaries. */
export function getJwks(signal?: AbortSignal): Promise<JSONWebKeySet> {
  return api.get<JSONWebKeySet>(apiPaths.jwks, { signal, redirectOnUnauthorized: false });
}

export function getJwksQueryOptions() {
  return queryOptions({ queryKey: queryKeys.signatures.jwks(), queryFn: ({ signal }) => getJwks(signal), staleTime: 5 * 60_000 });
}
