/**
 * The assessment is bookkeeping over what the engine reported: these tests check that it copies the engine's
 * numbers, names each figure's basis, picks the divergence figure the margin uses by its stated rule, and gives
 * results stored before engine 1.1.0 the same figures. Engine check values live in shared/engine/__tests__.
 */
import { describe, expect, it } from "vitest";
import { DEFAULT_REQUIREMENTS } from "../../criteria/default-requirements";
import { evaluateCriteria } from "../../criteria/evaluate-criteria";
import { createFlatPlateModel } from "../../engine/aero/flat-plate";
import { runSweep } from "../../engine/run-sweep";
import { benchmarkDeck } from "../../engine/__tests__/support/benchmark-deck";
import { inventedDeckB } from "../../engine/__tests__/support/invented-deck-b";
import { assessmentSchema } from "../../schemas/assessment";
import type { ProjectCriteria } from "../../schemas/criteria";
import type { SweepResult } from "../../schemas/result";
import type { StudyDocument } from "../../schemas/study";
import { assessRevision } from "../assess-revision";

/** Invented design wind (v_b 28 m/s, category 0, deck at 62 m, v_m ≈ 43.4 m/s) with the default factors. */
const criteria: ProjectCriteria = {
  wind: { basicSpeed: 28, probability: { kind: "return-period", years: 50 }, terrain: { kind: "category", category: "0" }, deckHeight: 62, orographyFactor: 1 },
  requirements: DEFAULT_REQUIREMENTS,
};
const required = evaluateCriteria(criteria).required;

const deckB = inventedDeckB();
const resultB = runSweep(deckB);

/** A result as engine 1.0 stored it: no insideTestedRange, no divergenceOutsideSweep, no warning branches. */
function asStoredBefore(result: SweepResult): SweepResult {
  const old = structuredClone(result) as SweepResult & Record<string, unknown>;
  delete old.divergenceOutsideSweep;
  if (old.flutter) delete old.flutter.insideTestedRange;
  old.warnings = old.warnings.map(({ branch: _b, branches: _s, reducedVelocities: _r, ...w }) => w);
  return old;
}

describe("assessRevision on the invented deck B", () => {
  const a = assessRevision({ document: deckB, result: resultB, criteria: { version: 3, criteria } });

  it("is a valid stillspan.assessment/1 keyed by the criteria version and the sweep's engine", () => {
    expect(assessmentSchema.safeParse(a).success).toBe(true);
    expect(a.computedFrom).toEqual({ assessor: "1", criteriaVersion: 3, results: [{ kind: "sweep", engineVersion: resultB.engine }] });
  });

  it("states the engine's flutter point, within the tested range", () => {
    expect(a.flutter).toMatchObject({ found: true, speedMps: resultB.flutter!.speed, branch: "TS1", kind: resultB.flutter!.kind });
    if (!a.flutter.found) throw new Error("flutter expected");
    expect(a.flutter.testedRange).toMatchObject({ status: "within", tableReducedVelocity: [2, 16], beyondBy: null });
    expect(a.flutter.statement).toContain("within the tested range");
    expect(a.flutter.statement).toContain(`${resultB.flutter!.speed.toFixed(2)} m/s`);
  });

  it("names both divergence figures by their basis and puts the margin on the lower one, saying why", () => {
    const statics = resultB.warnings.find((w) => w.code === "static-instability")!;
    expect(a.divergence.closedForm).toMatchObject({ speedMps: resultB.divergence!.speed, withinSweep: true });
    expect(a.divergence.closedForm.slopeSource).toContain("K²A3* at the largest reduced velocity Ur = 16");
    expect(a.divergence.closedForm.basis).toContain("E.4.3");
    expect(a.divergence.staticInstability).toMatchObject({ speedMps: statics.speeds![0], branch: "VS1" });
    expect(a.divergence.governing).toBe("closed-form");
    expect(a.divergence.governingSpeedMps).toBe(Math.min(resultB.divergence!.speed, statics.speeds![0]));
    expect(a.divergence.marginBasis).toMatch(/uses the closed form \(88\.\d\d m\/s\), the lower of the two figures/);
    expect(a.margins!.divergence.criticalSpeedMps).toBe(a.divergence.governingSpeedMps);
    expect(a.margins!.divergence.statement).toContain(a.divergence.marginBasis);
  });

  it("gives each stability margin as critical ÷ required, and the vortex-shedding onset as a screening result", () => {
    expect(a.margins!.flutter.margin).toBeCloseTo(resultB.flutter!.speed / required.flutter.requiredSpeedMps, 12);
    expect(a.margins!.flutter.status).toBe("pass");
    expect(a.margins!.divergence.margin).toBeCloseTo(a.divergence.governingSpeedMps! / required.divergence.requiredSpeedMps, 12);
    expect(Object.keys(a.margins!)).toEqual(["flutter", "divergence", "gallopingOnset"]);
    expect(a.vortexShedding.status).toBe("investigate");
    expect(a.vortexShedding.thresholdSpeedMps).toBeCloseTo(required.vortexOnset.requiredSpeedMps, 12);
    expect(a.vortexShedding.statement).toMatch(/not a stability limit/);
    expect(a.vortexShedding.statement).not.toMatch(/margin/);
    expect(a.verdict).toBe("pass");
  });

  it("counts every warning, one entry each, with the branch of each extrapolated range", () => {
    expect(a.warningCount).toBe(resultB.warnings.length);
    expect(a.warnings.map((w) => w.code)).toEqual(resultB.warnings.map((w) => w.code));
    const extrapolated = a.warnings.filter((w) => w.code === "extrapolated-derivatives");
    expect(new Set(extrapolated.map((w) => w.branch))).toEqual(new Set(["VS1", "TS1"]));
    expect(extrapolated.every((w) => w.speeds !== null && w.explanation !== null)).toBe(true);
  });

  it("gives a result stored before engine 1.1.0 the same figures", () => {
    const old = assessRevision({ document: deckB, result: asStoredBefore(resultB), criteria: { version: 3, criteria } });
    expect(old.flutter).toEqual(a.flutter);
    expect(old.divergence).toEqual(a.divergence);
    expect(old.margins).toEqual(a.margins);
  });
});

describe("assessRevision: tested range, bases and missing criteria", () => {
  /** The benchmark deck with thin-plate derivatives tabulated up to Ur 8: its flutter pole lies beyond the last row. */
  function truncatedPlate(): StudyDocument {
    const ur = Array.from({ length: 29 }, (_, i) => 1 + i * 0.25);
    const plate = createFlatPlateModel();
    const rows = ur.map((u) => plate.derivatives((2 * Math.PI) / u));
    const col = (n: keyof (typeof rows)[number]) => rows.map((r) => r[n]);
    return {
      ...benchmarkDeck({ to: 120 }),
      aerodynamics: {
        model: "tabulated", interpolation: "monotone-cubic", reducedVelocity: ur,
        H1: col("H1"), H2: col("H2"), H3: col("H3"), H4: col("H4"), A1: col("A1"), A2: col("A2"), A3: col("A3"), A4: col("A4"),
      },
    };
  }

  it("says in words how far beyond the tested range a flutter point lies", () => {
    const document = truncatedPlate();
    const result = runSweep(document);
    for (const r of [result, asStoredBefore(result)]) {
      const a = assessRevision({ document, result: r, criteria: { version: 1, criteria } });
      if (!a.flutter.found) throw new Error("flutter expected");
      expect(a.flutter.testedRange.status).toBe("beyond");
      expect(a.flutter.testedRange.beyondBy).toBeCloseTo(result.flutter!.reducedVelocity - 8, 12);
      expect(a.flutter.statement).toMatch(/beyond it by ΔUr \d+\.\d+ \(Ur \d+\.\d+ at flutter; tested Ur 1–8\)/);
      expect(a.margins!.flutter.statement).toContain("beyond it by");
    }
  });

  it("uses the sweep's static instability when it is the lower figure", () => {
    const result = structuredClone(resultB);
    const statics = result.warnings.find((w) => w.code === "static-instability")!;
    statics.speeds = [80];
    statics.branches = ["VS1"];
    const a = assessRevision({ document: deckB, result, criteria: { version: 1, criteria } });
    expect(a.divergence.governing).toBe("static-instability");
    expect(a.margins!.divergence.criticalSpeedMps).toBe(80);
    expect(a.divergence.marginBasis).toMatch(/uses the sweep's static instability \(80\.00 m\/s\)/);
  });

  it("states the closed form beyond the sweep, and no-criteria without margins", () => {
    const document = benchmarkDeck({ to: 80 });
    const result = runSweep(document);
    const a = assessRevision({ document, result, criteria: null });
    expect(a.divergence.closedForm.withinSweep).toBe(false);
    expect(a.divergence.closedForm.speedMps).toBe(result.divergenceOutsideSweep!.speed);
    expect(a.divergence.closedForm.statement).toContain("beyond the swept range");
    expect(a.divergence.closedForm.slopeSource).toContain("π/2");
    expect(a.flutter.found && a.flutter.testedRange.status).toBe("no-table");
    expect(a).toMatchObject({ margins: null, verdict: "no-criteria", designWind: null, computedFrom: { criteriaVersion: null } });
    expect(a.criteriaNote).toMatch(/no design wind/);
  });

  it("without air: no divergence, no screening, and says why", () => {
    const document = benchmarkDeck({ density: 0, to: 20, step: 1 });
    const a = assessRevision({ document, result: runSweep(document), criteria: { version: 1, criteria } });
    expect(a.divergence).toMatchObject({ governing: "none", governingSpeedMps: null });
    expect(a.margins!.divergence.status).toBe("pass");
    expect(a.vortexShedding.status).toBe("not-evaluated");
    expect(a.margins!.gallopingOnset.status).toBe("not-evaluated");
  });
});
