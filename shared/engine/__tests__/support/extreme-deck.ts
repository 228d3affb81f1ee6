import type { StudyDocument } from "../../../schemas/study";
import { createFlatPlateModel } from "../../aero/flat-plate";
import { benchmarkDeck } from "./benchmark-deck";

/**
 * Extreme but valid inputs (mass ratio m/(ρB²) ≈ 2e-10, radius of gyration 1e-6 m on a 1,000 m deck) that make
 * the tracker refine at many intervals: about 3,100 solved speeds over this 2,001-speed grid, about 26,000 at
 * the format's finest grid (`sweep.step` 0.025 m/s over 0–500 m/s). Derivatives of the invented demo twin box
 * (the demo seed's table; invented data, used only to drive the tracker and the server's limits).
 */
export function extremeDeck(sweep: { from?: number; to?: number; step?: number } = {}): StudyDocument {
  return {
    ...EXTREME,
    sweep: { from: sweep.from ?? 0, to: sweep.to ?? 500, step: sweep.step ?? 0.25 },
  };
}

const EXTREME: StudyDocument = {
  format: "stillspan.study/1",
  name: "extreme but valid inputs (test only)",
  air: { density: 5 },
  deck: { width: 1000, depth: 3 },
  structure: {
    mass: 0.001,
    inertia: 1e-9,
    modes: [
      { id: "VS1", dof: "heave", frequency: 0.095, damping: 0.004 },
      { id: "TS1", dof: "torsion", frequency: 0.248, damping: 0.004 },
    ],
  },
  aerodynamics: {
    model: "tabulated",
    interpolation: "monotone-cubic",
    reducedVelocity: [2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16],
    H1: [-0.94, -1.46, -2.01, -2.6, -3.21, -3.86, -4.52, -5.22, -5.93, -6.66, -7.41, -8.17, -8.95, -9.73, -10.53],
    H2: [-0.57, -0.81, -1, -1.15, -1.24, -1.27, -1.25, -1.18, -1.06, -0.89, -0.67, -0.41, -0.11, 0.23, 0.61],
    H3: [-0.35, -0.8, -1.46, -2.33, -3.44, -4.79, -6.39, -8.25, -10.37, -12.77, -15.45, -18.41, -21.65, -25.17, -28.99],
    H4: [0.86, 0.77, 0.66, 0.54, 0.41, 0.28, 0.15, 0.01, -0.12, -0.25, -0.38, -0.51, -0.63, -0.75, -0.87],
    A1: [0.23, 0.36, 0.5, 0.65, 0.8, 0.96, 1.13, 1.3, 1.48, 1.66, 1.85, 2.04, 2.23, 2.43, 2.63],
    A2: [-0.078, -0.134, -0.205, -0.294, -0.4, -0.526, -0.67, -0.832, -1.011, -1.208, -1.419, -1.647, -1.888, -2.143, -2.411],
    A3: [0.127, 0.234, 0.389, 0.596, 0.859, 1.178, 1.557, 1.997, 2.501, 3.069, 3.703, 4.404, 5.171, 6.007, 6.911],
    A4: [0.018, 0.037, 0.059, 0.084, 0.111, 0.138, 0.166, 0.194, 0.222, 0.249, 0.276, 0.303, 0.328, 0.353, 0.378],
  },
  sweep: { from: 0, to: 500, step: 0.25 },
};

/**
 * The heaviest kind of valid study for the server's limits: the benchmark deck (docs/conventions.md §Benchmark deck)
 * with Theodorsen's thin-plate derivatives tabulated at 10,000 rows (Ur 1–60, linear interpolation, 4 decimals).
 * The tracker visits every table row each branch passes (docs/method-and-validation.md), so over 0–500 m/s each
 * branch adds about 8,000 speeds to the grid: about 36,000 solved speeds at step 0.025 m/s (over the API's limit of
 * 30,000) and about 26,000 at 0.05 m/s (under it), some seconds of computing either way. The document is ~0.7 MB.
 */
export function denseTableDeck(step: number): StudyDocument {
  const rows = 10_000;
  const plate = createFlatPlateModel();
  const reducedVelocity: number[] = [];
  const columns = { H1: [], H2: [], H3: [], H4: [], A1: [], A2: [], A3: [], A4: [] } as Record<
    "H1" | "H2" | "H3" | "H4" | "A1" | "A2" | "A3" | "A4",
    number[]
  >;
  const round = (v: number) => Math.round(v * 1e4) / 1e4;
  for (let i = 0; i < rows; i++) {
    const ur = round(1 + (59 * i) / (rows - 1));
    reducedVelocity.push(ur);
    const d = plate.derivatives((2 * Math.PI) / ur);
    for (const key of Object.keys(columns) as (keyof typeof columns)[]) columns[key].push(round(d[key]));
  }
  return {
    ...benchmarkDeck({ from: 0, to: 500, step }),
    name: "Benchmark deck, thin plate tabulated at 10,000 rows (test only)",
    aerodynamics: { model: "tabulated", interpolation: "linear", reducedVelocity, ...columns },
  };
}
