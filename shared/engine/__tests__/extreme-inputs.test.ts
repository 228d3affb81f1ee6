/**
 * The engine's public entry is safe on its own: raw documents far outside the study format's limits (which the
 * schema refuses) must end — with a result or with a plain RangeError — instead of looping in a solver without a
 * cap (before the fix: NaN costs made the Hungarian search loop forever, and a NaN or near-overflow state matrix
 * made ml-matrix's shifted QR iterate forever; each of these documents ran for more than 40 s).
 */
import { describe, expect, it } from "vitest";
import { optimalAssignment } from "../core/hungarian";
import { runSweep } from "../run-sweep";
import { parseStudy, type StudyDocument } from "../../schemas/study";
import { benchmarkDeck } from "./support/benchmark-deck";

function raw(edit: (s: any) => void): StudyDocument {
  const s: any = benchmarkDeck({ from: 0, to: 100, step: 1 });
  edit(s);
  return s as StudyDocument;
}

const cases: [string, StudyDocument][] = [
  ["mass 1e-300 kg/m", raw((s) => (s.structure.mass = 1e-300))],
  ["width 1e200 m", raw((s) => (s.deck.width = 1e200))],
  ["quasi-steady slopes 1e300 per rad", raw((s) => (s.aerodynamics = { model: "quasi-steady", liftSlope: 1e300, dragCoefficient: 1, momentSlope: 1e300 }))],
  ["mass and inertia 1e-300", raw((s) => ((s.structure.mass = 1e-300), (s.structure.inertia = 1e-300)))],
  ["mass 1e-100 kg/m (finite state matrix, NaN shapes later)", raw((s) => (s.structure.mass = 1e-100))],
];

describe("raw extreme inputs bypassing the schema", () => {
  it.each(cases)("%s: the schema refuses it, and runSweep ends with a result or a RangeError", (_, doc) => {
    expect(parseStudy(doc).ok).toBe(false);
    try {
      const result = runSweep(doc);
      expect(result.modes).toHaveLength(2);
      expect(result.modes[0].steps.length).toBeGreaterThanOrEqual(101);
    } catch (err) {
      expect(err).toBeInstanceOf(RangeError);
      expect((err as Error).message).toMatch(/outside any physical range|not a finite number|no augmenting path/);
    }
  });

  it("the optimal assignment refuses a NaN cost with a RangeError instead of searching forever", () => {
    const cost = Float64Array.of(0.1, Number.NaN, 0.3, 0.2, 0.5, 0.4);
    expect(() => optimalAssignment(cost, 2, 3)).toThrow(RangeError);
    expect(Array.from(optimalAssignment(Float64Array.of(0.1, 0.9, 0.3, 0.2, 0.5, 0.35), 2, 3))).toEqual([0, 2]);
  });
});
