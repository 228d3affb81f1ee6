import { describe, expect, it } from "vitest";
import { DEFAULT_REQUIREMENTS } from "../default-requirements";
import { evaluateCriteria } from "../evaluate-criteria";
import { computeMargins } from "../margins";
import { requiredSpeeds } from "../required-speeds";

describe("required speeds", () => {
  it("multiplies factor, gust and angle factors with v_m and keeps each basis", () => {
    const required = requiredSpeeds(
      {
        ...DEFAULT_REQUIREMENTS,
        flutter: {
          factor: 1.4,
          basis: "specification X",
          gustFactor: { value: 1.1, basis: "span factor of spec X" },
          angleFactor: { value: 1.05, basis: "angle factor of spec X" },
        },
      },
      40,
    );
    expect(required.flutter.requiredSpeedMps).toBeCloseTo(1.4 * 1.1 * 1.05 * 40, 12);
    expect(required.flutter.basis).toEqual([
      "specification X",
      "Gust / span factor 1.1: span factor of spec X",
      "Angle-of-attack factor 1.05: angle factor of spec X",
    ]);
    expect(required.divergence.requiredSpeedMps).toBeCloseTo(80, 12);
    expect(required.vortexOnset.requiredSpeedMps).toBeCloseTo(50, 12);
    expect(required.gallopingOnset.gustFactor).toBeNull();
  });

  it("defaults state their basis, and say 'from memory' where the value is recalled", () => {
    for (const requirement of Object.values(DEFAULT_REQUIREMENTS)) {
      expect(requirement.basis).toMatch(/from memory/);
    }
    expect(DEFAULT_REQUIREMENTS.divergence.basis).toMatch(/E\.4\.3/);
    expect(DEFAULT_REQUIREMENTS.vortexOnset.basis).toMatch(/1\.25/);
  });

  it("evaluateCriteria chains the design wind and the required speeds", () => {
    const { designWind, required } = evaluateCriteria({
      wind: {
        basicSpeed: 26,
        probability: { kind: "return-period", years: 50 },
        terrain: { kind: "category", category: "II" },
        deckHeight: 60,
      },
    });
    expect(required.flutter.requiredSpeedMps).toBeCloseTo(1.2 * designWind.meanSpeedMps, 12);
  });
});

describe("margins = critical / required", () => {
  const required = requiredSpeeds(DEFAULT_REQUIREMENTS, 40); // flutter 48, divergence 80, vortex/galloping 50 m/s

  it("passes at margin ≥ 1 and fails below", () => {
    const margins = computeMargins(
      { flutter: { kind: "speed", speedMps: 60 }, divergence: { kind: "speed", speedMps: 70 } },
      required,
    );
    expect(margins.flutter).toMatchObject({ status: "pass", criticalSpeedMps: 60 });
    expect(margins.flutter.margin).toBeCloseTo(1.25, 12);
    expect(margins.divergence.status).toBe("fail");
    expect(margins.divergence.margin).toBeCloseTo(0.875, 12);
    expect(margins.divergence.statement).toMatch(/70\.00 m\/s < required 80\.00 m\/s/);
    expect(margins.vortexOnset.status).toBe("not-evaluated");
  });

  it("treats 'none found up to U' as a lower bound: pass when U ≥ required, else undetermined", () => {
    const margins = computeMargins(
      { flutter: { kind: "above", speedMps: 120 }, divergence: { kind: "above", speedMps: 60 } },
      required,
    );
    expect(margins.flutter).toMatchObject({ status: "pass", marginIsLowerBound: true });
    expect(margins.divergence).toMatchObject({ status: "undetermined", marginIsLowerBound: true });
    expect(margins.divergence.statement).toMatch(/extend the range/);
  });

  it("vortex-shedding onset below the required speed is 'investigate' (amplitudes, accelerations), never 'fail'", () => {
    const margins = computeMargins({ vortexOnset: { kind: "speed", speedMps: 3.5 } }, required);
    expect(margins.vortexOnset).toMatchObject({ status: "investigate", criticalSpeedMps: 3.5 });
    expect(margins.vortexOnset.margin).toBeCloseTo(3.5 / 50, 12);
    expect(margins.vortexOnset.statement).toMatch(/3\.50 m\/s < required 50\.00 m\/s/);
    expect(margins.vortexOnset.statement).toMatch(/E\.1\.5/);
    expect(margins.vortexOnset.statement).toMatch(/accelerations/);
    expect(margins.vortexOnset.statement).toMatch(/not a stability limit/i);
  });

  it("vortex-shedding onset at or above the required speed is 'clear' (E.1.2(2): need not be investigated)", () => {
    const margins = computeMargins({ vortexOnset: { kind: "speed", speedMps: 50 } }, required);
    expect(margins.vortexOnset.status).toBe("clear");
    expect(margins.vortexOnset.statement).toMatch(/need not be investigated/);
    expect(computeMargins({ vortexOnset: { kind: "speed", speedMps: 49.9 } }, required).vortexOnset.status).toBe("investigate");
  });

  it("galloping stays a stability check (pass / fail) and 'not-evaluated' carries its reason", () => {
    expect(computeMargins({ gallopingOnset: { kind: "speed", speedMps: 40 } }, required).gallopingOnset.status).toBe("fail");
    expect(computeMargins({ gallopingOnset: { kind: "speed", speedMps: 60 } }, required).gallopingOnset.status).toBe("pass");
    const unknown = computeMargins({ gallopingOnset: { kind: "not-evaluated", reason: "no a_G for this section." } }, required, {
      gallopingOnset: "Covered by the sweep.",
    });
    expect(unknown.gallopingOnset).toMatchObject({ status: "not-evaluated", margin: null, criticalSpeedMps: null });
    expect(unknown.gallopingOnset.statement).toBe("Galloping onset: not evaluated — no a_G for this section. Covered by the sweep.");
  });

  it("passes a phenomenon that cannot occur, with its reason and no ratio", () => {
    const margins = computeMargins({ divergence: { kind: "none", reason: "dC_M/dα ≤ 0." } }, required);
    expect(margins.divergence).toMatchObject({ status: "pass", margin: null });
    expect(margins.divergence.statement).toMatch(/dC_M\/dα ≤ 0/);
  });
});
