import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { ScreeningResult } from "@shared/criteria/screen-study";
import type { ScreeningOptions, ScreeningStudy } from "@shared/schemas/criteria";
import { apiPaths } from "@/config/paths";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export interface ScreeningInput {
  /** The study document (a whole `stillspan.study/1` document is fine: other fields are ignored). */
  study: ScreeningStudy;
  /** The project whose current criteria give the required speeds. */
  projectId?: string;
  options?: ScreeningOptions;
}

/** Screens a study for vortex shedding, galloping and divergence (POST, but a pure computation: nothing is stored). */
export function runScreening(input: ScreeningInput, signal?: AbortSignal): Promise<ScreeningResult> {
  const body: Record<string, unknown> = { study: input.study };
  if (input.projectId !== undefined) body.projectId = input.projectId;
  if (input.options !== undefined) body.options = input.options;
  return api.post<ScreeningResult>(apiPaths.screening, body, { signal });
}

/** Only the parts the screening reads go into the key, so editing the sweep range or the name does not refetch. */
function screeningKeyPart(input: ScreeningInput) {
  const { air, deck, structure, aerodynamics } = input.study;
  return { air, deck, structure, aerodynamics: aerodynamics ?? null, options: input.options ?? null };
}

export function getScreeningQueryOptions(input: ScreeningInput) {
  return queryOptions({
    queryKey: queryKeys.criteria.screening(input.projectId ?? null, screeningKeyPart(input)),
    queryFn: ({ signal }) => runScreening(input, signal),
    staleTime: Infinity,
  });
}

/** The screening of a study; pass `null` while there is no valid study to screen. */
export function useScreening(input: ScreeningInput | null) {
  return useQuery({
    ...getScreeningQueryOptions(input ?? { study: PLACEHOLDER_STUDY }),
    enabled: input !== null,
    placeholderData: keepPreviousData,
  });
}

const PLACEHOLDER_STUDY = {
  air: { density: 0 },
  deck: { width: 0, depth: 0 },
  structure: { mass: 0, inertia: 0, modes: [] },
} as unknown as ScreeningStudy;
