import { describe, expect, it } from "vitest";
import { createAeroModel } from "../aero/create-aero-model";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";
import { benchmarkDeck, relativeError } from "./support/benchmark-deck";
import { determinantFlutterSpeed } from "./support/flutter-determinant";

// Two independent routes to the same flutter speed: the sweep (p-k, tracking, Brent) against the
// frequency-domain flutter determinant det Z(U, ω) = 0 over real (U, ω) (support/flutter-determinant.ts).
// Agreement required: 0.1 %.

/** A tabulated deck (test data): flat-plate-like lift, reduced torsional damping at high Ur. */
function tabulatedDeck(): StudyDocument {
  const ur = [2, 4, 6, 8, 10, 12, 14, 16, 20, 24];
  const plate = createAeroModel({ model: "flat-plate" });
  const d = ur.map((u) => plate.derivatives((2 * Math.PI) / u));
  return {
    ...benchmarkDeck({ from: 5, to: 120, step: 0.5 }),
    aerodynamics: {
      model: "tabulated",
      interpolation: "monotone-cubic",
      reducedVelocity: ur,
      H1: d.map((x) => 0.8 * x.H1),
      H2: d.map((x) => 0.8 * x.H2),
      H3: d.map((x) => 0.8 * x.H3),
      H4: d.map((x) => 0.8 * x.H4),
      A1: d.map((x) => x.A1),
      A2: d.map((x, i) => x.A2 + 0.01 * ur[i]),
      A3: d.map((x) => x.A3),
      A4: d.map((x) => x.A4),
    },
  };
}

describe("flutter speed by two independent routes", () => {
  it.each([
    { name: "flat plate, benchmark deck", study: benchmarkDeck() },
    { name: "flat plate, benchmark deck, ζ = 0, f_h = 0.2 Hz", study: benchmarkDeck({ damping: 0, heaveHz: 0.2 }) },
    {
      name: "flat plate, close frequencies f_α/f_h = 1.05, ζ = 0",
      study: benchmarkDeck({ heaveHz: 0.278 / 1.05, damping: 0, density: 1.225, from: 0, step: 0.25 }),
    },
    { name: "tabulated (monotone cubic) deck", study: tabulatedDeck() },
  ])("$name: sweep and det Z = 0 agree to 0.1 %", ({ study }) => {
    const sweep = runSweep(study).flutter?.speed;
    const ur = study.aerodynamics.model === "tabulated" ? study.aerodynamics.reducedVelocity : [1, 60];
    // K range of the data (inside the table, so that no extrapolation enters the comparison)
    const determinant = determinantFlutterSpeed(study, createAeroModel(study.aerodynamics), [
      (2 * Math.PI) / ur[ur.length - 1],
      (2 * Math.PI) / ur[0],
    ]);
    expect(sweep, "sweep flutter").toBeDefined();
    expect(determinant, "determinant flutter").not.toBeNull();
    const error = relativeError(sweep!, determinant!);
    expect(error, `sweep ${sweep} m/s vs determinant ${determinant} m/s`).toBeLessThan(1e-3);
  });
});
