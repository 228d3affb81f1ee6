import { describe, expect, it } from "vitest";
import { inventedSummary } from "@shared/schemas/__tests__/fixtures/invented-summary";
import type { SummaryBranchDto } from "@shared/schemas/review";
import { dampingAxisRange } from "@/lib/damping-frame";
import { dampingFigure } from "@/features/summaries/utils/summary-figures";

/**
 * Invented branches: heave damping growing to 40 %, a torsion branch crossing zero at 60 m/s, and a branch that
 * becomes a real pole (f = 0, ζ = ±1) above 80 m/s.
 */
function inventedBranches(): SummaryBranchDto[] {
  const speeds = Array.from({ length: 51 }, (_, i) => i * 2);
  return [
    { id: "V1", steps: speeds.map((u) => ({ speed: u, frequency: 0.12, damping: 0.005 + 0.004 * u })) },
    { id: "T1", steps: speeds.map((u) => ({ speed: u, frequency: 0.3, damping: 0.01 * (1 - u / 60) })) },
    {
      id: "V2",
      steps: speeds.map((u) => (u > 80 ? { speed: u, frequency: 0, damping: -1 } : { speed: u, frequency: 0.5, damping: 0.02 })),
    },
  ] as SummaryBranchDto[];
}

describe("summary damping plot", () => {
  const figure = dampingFigure(inventedSummary(), inventedBranches());
  const range = (figure.layout.yaxis as { range: [number, number] }).range;

  it("frames the plot around zero, so the flutter crossing is not flattened by large heave damping", () => {
    expect(range[0]).toBeLessThan(0);
    expect(range[1]).toBeGreaterThan(0);
    expect(range[1] - range[0]).toBeLessThan(25);
  });

  it("breaks the curve where a branch becomes a real pole", () => {
    const v2 = figure.data[2] as { x: number[]; y: (number | null)[] };
    expect(v2.y[v2.x.indexOf(80)]).toBeCloseTo(2);
    expect(v2.y[v2.x.indexOf(82)]).toBeNull();
    expect(v2.y.filter((y) => y === null)).toHaveLength(10);
  });

  it("uses the framing shared with the workspace's plot (src/lib/damping-frame) for the same poles", () => {
    expect(range).toEqual(dampingAxisRange(inventedBranches().flatMap((b) => b.steps)));
  });
});
