import { describe, expect, it } from "vitest";
import invented from "../../schemas/__tests__/fixtures/invented-deck-study.json";
import type { ScreeningStudy } from "../../schemas/criteria";
import type { SweepResult } from "../../schemas/result";
import { DEFAULT_REQUIREMENTS } from "../default-requirements";
import { requiredSpeeds } from "../required-speeds";
import { screenStudy } from "../screen-study";
import { sweepMargins } from "../sweep-margins";

const required = requiredSpeeds(DEFAULT_REQUIREMENTS, 40); // flutter 48, divergence 80, onsets 50 m/s
const step = (speed: number) => ({ speed, frequency: 0.2, damping: 0.01, re: -0.01, im: 1.2, participation: { V1: 1 }, mac: 1, confidence: 1 });
const sweep = (flutter: number | null, divergence: number | null): Pick<SweepResult, "flutter" | "divergence" | "modes"> => ({
  flutter: flutter === null ? null : { speed: flutter, frequency: 0.25, mode: "T1", reducedVelocity: 7, kind: "coupled" },
  divergence: divergence === null ? null : { speed: divergence },
  modes: [{ id: "V1", steps: [step(1), step(60), step(120)] }],
});

describe("sweepMargins", () => {
  it("takes flutter and divergence from the sweep", () => {
    const margins = sweepMargins(sweep(62, 95), required);
    expect(margins.flutter.margin).toBeCloseTo(62 / 48, 12);
    expect(margins.divergence).toMatchObject({ status: "pass", criticalSpeedMps: 95 });
    expect(margins.vortexOnset.status).toBe("not-evaluated");
  });

  it("reads a sweep without flutter as 'none up to the highest swept speed' (lower bound)", () => {
    const margins = sweepMargins(sweep(null, null), required);
    expect(margins.flutter).toMatchObject({ status: "pass", marginIsLowerBound: true });
    expect(margins.flutter.margin).toBeCloseTo(120 / 48, 12);
    expect(margins.divergence.status).toBe("not-evaluated");
  });

  it("falls back on the screening's closed-form divergence beyond the swept range, and adds the onsets", () => {
    const screening = screenStudy(invented as unknown as ScreeningStudy, undefined, { strouhalNumber: 0.11 });
    const margins = sweepMargins(sweep(62, null), required, screening);
    expect(margins.divergence.criticalSpeedMps).toBeCloseTo(screening.divergence.speedMps!, 12);
    expect(margins.vortexOnset.criticalSpeedMps).toBeCloseTo((3.6 * 0.124) / 0.11, 12);
    expect(margins.vortexOnset.status).toBe("investigate"); // 4.06 m/s < 50 m/s: lock-in possible, not a failure
    expect(margins.gallopingOnset.status).toBe("not-evaluated"); // B/D = 7.6: no a_G, no static coefficients
    expect(margins.gallopingOnset.statement).toMatch(/covered by the flutter sweep/);
  });

  it("takes the galloping onset from the screening when a_G is given with its source", () => {
    const screening = screenStudy(invented as unknown as ScreeningStudy, undefined, { gallopingFactor: 1.5, gallopingFactorBasis: "test value" });
    const margins = sweepMargins(sweep(62, null), required, screening);
    expect(margins.gallopingOnset.criticalSpeedMps).toBeCloseTo(screening.galloping.standard!.onsetSpeedMps, 12);
    expect(margins.gallopingOnset.status).toBe(screening.galloping.standard!.onsetSpeedMps >= 50 ? "pass" : "fail");
  });
});
