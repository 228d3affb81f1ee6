import { describe, expect, it } from "vitest";
import { createAlternativeSchema, patchAlternativeSchema } from "../alternatives";
import { DECK_DEPTH_LIMITS_M, DECK_WIDTH_LIMITS_M, parseStudy } from "../study";
import { benchmarkDeck } from "../../engine/__tests__/support/benchmark-deck";

const alternative = (deckWidthM: number, deckDepthM: number) => ({ name: "A", deckWidthM, deckDepthM });
const messages = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  r.error?.issues.map((i) => `${i.path.join(".")}: ${i.message}`) ?? [];

describe("deck alternative lengths follow the study format's limits", () => {
  it("refuses a width below 0.01 m and a depth below 0.001 m, as a study does, naming the field and limit", () => {
    const r = createAlternativeSchema.safeParse(alternative(0.005, 0.0005));
    expect(messages(r)).toEqual(["deckWidthM: must be at least 0.01 m", "deckDepthM: must be at least 0.001 m"]);
    expect(messages(patchAlternativeSchema.safeParse({ deckWidthM: 1001 }))).toEqual(["deckWidthM: must be at most 1000 m"]);
  });

  it.each([
    [DECK_WIDTH_LIMITS_M.min, DECK_DEPTH_LIMITS_M.min],
    [DECK_WIDTH_LIMITS_M.max, DECK_DEPTH_LIMITS_M.max],
  ])("accepts the limits B = %s m, D = %s m, and a study with them is valid too", (width, depth) => {
    expect(createAlternativeSchema.safeParse(alternative(width, depth)).success).toBe(true);
    const study = benchmarkDeck();
    expect(parseStudy({ ...study, deck: { width, depth } }).ok).toBe(true);
  });
});
