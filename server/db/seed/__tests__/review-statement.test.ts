import { describe, expect, it } from "vitest";
import { assessRevision } from "@shared/assessment/assess-revision";
import { DEFAULT_REQUIREMENTS } from "@shared/criteria/default-requirements";
import { runSweep } from "@shared/engine/run-sweep";
import { inventedDeckB } from "@shared/engine/__tests__/support/invented-deck-b";
import { demoReviewerStatement } from "../review";

const document = inventedDeckB();
const assessment = assessRevision({
  document,
  result: runSweep(document),
  criteria: {
    version: 1,
    criteria: {
      wind: { basicSpeed: 28, probability: { kind: "return-period", years: 50 }, terrain: { kind: "category", category: "0" }, deckHeight: 62, orographyFactor: 1 },
      requirements: DEFAULT_REQUIREMENTS,
    },
  },
});

describe("demo reviewer's statement", () => {
  it("names a failed margin with its value and never calls the deck stable with margin", () => {
    const margins = { ...assessment.margins!, divergence: { ...assessment.margins!.divergence, status: "fail" as const, margin: 0.99 } };
    const statement = demoReviewerStatement({ ...assessment, margins });
    expect(statement).toContain(
      `torsional divergence margin is 0.99, below the required speed of ${margins.divergence.requiredSpeedMps.toFixed(2)} m/s`,
    );
    expect(statement).toContain("concept stage only");
    expect(statement).toContain(`Required speed met for flutter (margin ${assessment.margins!.flutter.margin!.toFixed(2)}).`);
    expect(statement).not.toMatch(/stable with margin/i);
    expect(statement).not.toContain("Acceptable at this concept stage");
  });

  it("calls the margins adequate when every stability margin passes, and carries vortex shedding forward", () => {
    const statement = demoReviewerStatement(assessment);
    const m = assessment.margins!;
    expect(statement).toContain(
      `Required speed met for flutter (margin ${m.flutter.margin!.toFixed(2)}) and torsional divergence (margin ${m.divergence.margin!.toFixed(2)}).`,
    );
    expect(statement).toContain("Acceptable at this concept stage; to be confirmed by section-model tests.");
    expect(statement).toContain("Still open: vortex-shedding onset");
  });
});
