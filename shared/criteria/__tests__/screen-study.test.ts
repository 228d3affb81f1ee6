import { describe, expect, it } from "vitest";
import invented from "../../schemas/__tests__/fixtures/invented-deck-study.json";
import { screeningRequestSchema, type ProjectCriteriaInput, type ScreeningStudy } from "../../schemas/criteria";
import { formatStudyIssues } from "../../schemas/study";
import { DEFAULT_REQUIREMENTS } from "../default-requirements";
import { screenStudy } from "../screen-study";

// Invented demo deck (shared/schemas/__tests__/fixtures): B = 27.5 m, D = 3.6 m, m = 15 200 kg/m,
// I = 1.45e6 kg·m²/m, V1 0.124 Hz ζ 0.5 %, T1 0.342 Hz ζ 0.4 %, ρ = 1.225, tabulated derivatives.
const study = invented as unknown as ScreeningStudy;
const criteria: ProjectCriteriaInput = {
  wind: { basicSpeed: 26, probability: { kind: "return-period", years: 100 }, terrain: { kind: "category", category: "0" }, deckHeight: 55 },
  requirements: DEFAULT_REQUIREMENTS,
};

describe("screenStudy on the invented deck", () => {
  const result = screenStudy(study, criteria, { strouhalNumber: 0.11, strouhalBasis: "invented section-model value" });

  it("computes v_crit = D n / St per mode with b = D for torsion too, and flags lock-in against 1.25 v_m", () => {
    const [v1, t1] = result.vortexShedding.modes;
    expect(v1.onsetSpeedMps).toBeCloseTo((3.6 * 0.124) / 0.11, 12);
    expect(t1.onsetSpeedMps).toBeCloseTo((3.6 * 0.342) / 0.11, 12);
    expect(v1.referenceLengthM).toBe(3.6);
    const required = result.required!.vortexOnset.requiredSpeedMps;
    expect(v1.lockIn).toBe(v1.onsetSpeedMps! < required ? "possible" : "not-expected");
    expect(v1.lockIn).toBe("possible"); // 4.06 m/s onset against ~52 m/s: a low-frequency deck sheds in the design range
    expect(v1.statement).toMatch(/E\.1\.2\(2\)/);
    // Lock-in below the design range is a call for amplitude and acceleration checks, not a failed deck.
    expect(result.margins!.vortexOnset.status).toBe("investigate");
    expect(result.margins!.vortexOnset.criticalSpeedMps).toBeCloseTo(v1.onsetSpeedMps!, 12);
    expect(result.margins!.vortexOnset.statement).toMatch(/Lowest onset: mode V1 \(heave\)/);
  });

  it("clears vortex shedding when every onset is above the required speed", () => {
    // St = 0.004 is no real deck's value: it only lifts both onsets (D n / St ≥ 111 m/s) above 1.25 v_m ≈ 50 m/s.
    const high = screenStudy(study, criteria, { strouhalNumber: 0.004, strouhalBasis: "test value" });
    expect(high.vortexShedding.modes.every((mode) => mode.lockIn === "not-expected")).toBe(true);
    expect(high.margins!.vortexOnset.status).toBe("clear");
  });

  it("uses the translational Scruton number for heave and the inertia form for torsion", () => {
    const [v1, t1] = result.vortexShedding.modes;
    expect(v1.scruton.form).toBe("translational");
    expect(v1.scruton.value).toBeCloseTo((2 * 2 * Math.PI * 0.005 * 15200) / (1.225 * 3.6 ** 2), 10);
    expect(t1.scruton.form).toBe("torsional");
    expect(t1.scruton.value).toBeCloseTo((2 * 2 * Math.PI * 0.004 * 1.45e6) / (1.225 * 27.5 ** 4), 12);
    expect(t1.scruton.source).toMatch(/common practice/);
  });

  it("does not evaluate galloping for B/D = 7.6 without a_G or static coefficients, and says what would do", () => {
    expect(result.galloping.standard).toBeNull();
    expect(result.galloping.denHartog).toBeNull();
    expect(result.galloping.governing).toBeNull();
    expect(result.galloping.critical).toMatchObject({ kind: "not-evaluated" });
    const margin = result.margins!.gallopingOnset;
    expect(margin).toMatchObject({ status: "not-evaluated", margin: null, criticalSpeedMps: null });
    expect(margin.statement).toMatch(/outside the range of EN 1991-1-4 Table E\.7/);
    expect(margin.statement).toMatch(/give a_G with its source, or a static-coefficient data set/);
    // The study's measured H1* already carries the heave damping whose loss is galloping.
    expect(margin.statement).toMatch(/covered by the flutter sweep through the measured H1\*/);
  });

  it("evaluates galloping by the standard's formula with an a_G given with its source", () => {
    const given = screenStudy(study, criteria, { gallopingFactor: 2, gallopingFactorBasis: "invented static tests, for the demo" });
    expect(given.galloping.governing).toBe("standard");
    expect(given.galloping.standard).toMatchObject({ factor: 2, factorOrigin: "input", factorSource: "invented static tests, for the demo" });
    const sc = (2 * 2 * Math.PI * 0.005 * 15200) / (1.225 * 3.6 ** 2);
    const byHand = (2 * sc * 0.124 * 3.6) / 2; // EN 1991-1-4 E.2.2, Expr. (E.18)
    expect(given.galloping.standard!.onsetSpeedMps).toBeCloseTo(byHand, 10);
    expect(given.margins!.gallopingOnset.criticalSpeedMps).toBeCloseTo(byHand, 10);
    expect(given.margins!.gallopingOnset.status).toBe(byHand >= given.required!.gallopingOnset.requiredSpeedMps ? "pass" : "fail");
  });

  it("carries the cautions and every check's sources", () => {
    expect(result.cautions.join(" ")).toMatch(/indicative/);
    expect(result.cautions.join(" ")).toMatch(/licensed engineer/);
    expect(result.galloping.sources.join(" ")).toMatch(/Den Hartog/);
  });
});

describe("screenStudy with quasi-steady aerodynamics", () => {
  it("lets Den Hartog govern galloping and reports 'not possible' when dC_L/dα + C_D ≥ 0", () => {
    const quasi = { ...study, aerodynamics: { model: "quasi-steady" as const, liftSlope: 5.2, dragCoefficient: 0.08, momentSlope: 1.1 } };
    const result = screenStudy(quasi, criteria);
    expect(result.galloping.governing).toBe("den-hartog");
    expect(result.galloping.critical).toMatchObject({ kind: "none" });
    expect(result.margins!.gallopingOnset.status).toBe("pass");
  });

  it("gives a Den Hartog onset when the section is galloping-prone", () => {
    const quasi = { ...study, aerodynamics: { model: "quasi-steady" as const, liftSlope: -4, dragCoefficient: 0.5, momentSlope: 1.1 } };
    const result = screenStudy(quasi, criteria);
    const expected = (4 * 15200 * 0.005 * 2 * Math.PI * 0.124) / (1.225 * 27.5 * 3.5);
    expect(result.galloping.critical).toMatchObject({ kind: "speed" });
    expect(result.galloping.denHartog!.onsetSpeedMps).toBeCloseTo(expected, 10);
    expect(result.galloping.governing).toBe("den-hartog");
    expect(result.galloping.standard).toBeNull(); // no a_G is assumed for the deck; Den Hartog alone evaluates it
    expect(result.margins!.gallopingOnset).toMatchObject({ status: expected >= result.required!.gallopingOnset.requiredSpeedMps ? "pass" : "fail" });
    expect(result.margins!.gallopingOnset.criticalSpeedMps).toBeCloseTo(expected, 10);
    expect(result.margins!.gallopingOnset.statement).toMatch(/quasi-steady H1\*/);
  });

  it("evaluates Den Hartog from static coefficients given with the request, beside a tabulated sweep", () => {
    const result = screenStudy(study, criteria, { liftSlope: -4, dragCoefficient: 0.5 });
    const expected = (4 * 15200 * 0.005 * 2 * Math.PI * 0.124) / (1.225 * 27.5 * 3.5);
    expect(result.galloping.governing).toBe("den-hartog");
    expect(result.margins!.gallopingOnset.criticalSpeedMps).toBeCloseTo(expected, 10);
    expect(result.margins!.gallopingOnset.status).not.toBe("not-evaluated");
  });

  it("without criteria gives onsets but no required speeds or margins", () => {
    const result = screenStudy(study);
    expect(result.margins).toBeNull();
    expect(result.vortexShedding.modes[0].lockIn).toBe("not-evaluated");
    expect(result.vortexShedding.strouhal.origin).toBe("table");
  });
});

describe("screening request schema", () => {
  /** JSON paths of the request's issues (formatStudyIssues), or null when it is valid. */
  const issuePaths = (request: unknown): string[] | null => {
    const result = screeningRequestSchema.safeParse(request);
    return result.success ? null : formatStudyIssues(result.error).map((issue) => issue.path);
  };

  it("refuses an a_G without its source", () => {
    expect(issuePaths({ study: invented, criteria, options: { gallopingFactor: 2 } })).toContain("$.options.gallopingFactorBasis");
  });

  it("accepts a full study document and rejects bad input with JSON paths", () => {
    expect(issuePaths({ study: invented, criteria })).toBeNull();
    const paths = issuePaths({
      study: { ...invented, air: { density: 0 } },
      criteria: { ...criteria, wind: { ...criteria.wind, deckHeight: 250 } },
      options: { liftSlope: -3 },
    });
    expect(paths).toContain("$.study.air.density");
    expect(paths).toContain("$.criteria.wind.deckHeight");
    expect(paths).toContain("$.options.dragCoefficient");
  });
});
