import { describe, expect, it } from "vitest";
import { inventedSummary } from "@shared/schemas/__tests__/fixtures/invented-summary";
import { demoReviewerStatement } from "../review";

describe("demo reviewer's statement", () => {
  it("names a failed margin with its value and never calls the deck stable with margin", () => {
    const margins = inventedSummary().margins.map((m) =>
      m.phenomenon === "divergence" ? { ...m, status: "fail" as const, margin: 0.99, criticalSpeedMps: 80.2 } : m,
    );
    const statement = demoReviewerStatement(margins);
    expect(statement).toContain("torsional divergence margin is 0.99, below the required speed of 81.0 m/s");
    expect(statement).toContain("concept stage only");
    expect(statement).toContain("Required speed met for flutter (margin 1.61).");
    expect(statement).not.toMatch(/stable with margin/i);
    expect(statement).not.toContain("Acceptable at this concept stage");
  });

  it("calls the margins adequate when every stability margin passes", () => {
    const statement = demoReviewerStatement(inventedSummary().margins);
    expect(statement).toContain("Required speed met for flutter (margin 1.61) and torsional divergence (margin 1.29).");
    expect(statement).toContain("Acceptable at this concept stage; to be confirmed by section-model tests.");
    expect(statement).toContain("Still open: vortex-shedding onset");
  });
});
