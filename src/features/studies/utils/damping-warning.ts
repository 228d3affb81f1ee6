import { HIGH_DAMPING_RATIO, MAX_DAMPING_RATIO } from "@shared/schemas/study";

/**
 * A warning for a structural damping ratio the study format accepts but that is unusual for a bridge deck
 * (above 0.05, up to the format's limit of 0.2 — above that the schema refuses it), or null. Steel and composite
 * decks are typically around 0.3–1 % of critical (common practice), so 0.05 or more is most often a percentage
 * typed where a ratio belongs.
 */
export function dampingWarning(ratio: number | null | undefined): string | null {
  if (typeof ratio !== "number" || !Number.isFinite(ratio)) return null;
  if (!(ratio > HIGH_DAMPING_RATIO) || ratio > MAX_DAMPING_RATIO) return null;
  const percent = Number((ratio * 100).toPrecision(4));
  return `${percent} % of critical is unusually high for a bridge deck. Damping is a ratio: 0.005 is 0.5 %.`;
}
