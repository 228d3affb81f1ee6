import { useQuery } from "@tanstack/react-query";
import { canonicalJson } from "@shared/canonical-json";
import type { SignedSummaryPayload } from "@shared/schemas/summary";
import { verifySummary } from "@shared/verify-summary";
import { queryKeys } from "@/lib/query-keys";
import { getJwksQueryOptions } from "@/features/summaries/api/get-jwks";

export type Verification =
  | { status: "checking" }
  | { status: "verified"; kid: string }
  | { status: "failed"; reason: string };

/**
 * Checks a signed summary here, in the browser: the JWS against the published JWKS (EdDSA, the key its kid
 * names), its payload in RFC 8785 canonical form and matching the summary schema — the same routine the server's
 * POST /api/signatures/verify runs — and that what the page shows is exactly the signed content.
 */
export function useSummaryVerification(summaryId: string, jws: string, shown: SignedSummaryPayload): Verification {
  const jwks = useQuery(getJwksQueryOptions());
  const check = useQuery({
    queryKey: queryKeys.signatures.verify(summaryId, jws),
    enabled: jwks.isSuccess,
    staleTime: Infinity,
    queryFn: async (): Promise<Verification> => {
      const result = await verifySummary(jws, jwks.data!);
      if (!result.valid) return { status: "failed", reason: result.reason };
      if (canonicalJson(result.summary) !== canonicalJson(shown)) {
        return { status: "failed", reason: "the signature is valid, but the page's numbers differ from the signed content" };
      }
      return { status: "verified", kid: result.kid };
    },
  });
  if (jwks.isError) return { status: "failed", reason: `the published keys could not be read (${jwks.error.message})` };
  if (check.isError) return { status: "failed", reason: check.error.message };
  return check.data ?? { status: "checking" };
}
