import type { StudyDocument } from "../../../schemas/study";

const UR = [2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16];

/**
 * The invented demo's alternative B, third revision (invented data, used only to drive the engine): a single box
 * whose flutter derivatives are tabulated at Ur = 2 … 16. Its heave branch leaves the table (Ur > 16) near 49 m/s,
 * its torsional branch only near 80 m/s, above the flutter speed.
 */
export function inventedDeckB(): StudyDocument {
  return {
    format: "stillspan.study/1",
    name: "invented demo deck B, revision 3 (test only)",
    air: { density: 1.225 },
    deck: { width: 29.6, depth: 3.1 },
    structure: {
      mass: 17650,
      inertia: 1.71e6,
      modes: [
        { id: "VS1", dof: "heave", frequency: 0.104, damping: 0.004 },
        { id: "TS1", dof: "torsion", frequency: 0.271, damping: 0.004 },
      ],
    },
    aerodynamics: {
      model: "tabulated",
      interpolation: "monotone-cubic",
      reducedVelocity: [...UR],
      H1: [-0.78, -1.21, -1.67, -2.15, -2.67, -3.21, -3.76, -4.34, -4.94, -5.55, -6.17, -6.8, -7.45, -8.1, -8.77],
      H2: [-0.43, -0.61, -0.75, -0.86, -0.93, -0.95, -0.94, -0.88, -0.79, -0.67, -0.5, -0.31, -0.08, 0.18, 0.46],
      H3: [-0.38, -0.88, -1.61, -2.58, -3.8, -5.29, -7.06, -9.12, -11.47, -14.12, -17.08, -20.34, -23.92, -27.82, -32.04],
      H4: [0.57, 0.51, 0.44, 0.36, 0.27, 0.19, 0.1, 0.01, -0.08, -0.17, -0.25, -0.34, -0.42, -0.5, -0.58],
      A1: [0.22, 0.34, 0.47, 0.61, 0.76, 0.91, 1.07, 1.23, 1.4, 1.57, 1.75, 1.93, 2.11, 2.3, 2.48],
      A2: [-0.043, -0.073, -0.112, -0.16, -0.218, -0.271, -0.301, -0.31, -0.295, -0.259, -0.198, -0.114, -0.006, 0.127, 0.285],
      A3: [0.141, 0.26, 0.432, 0.662, 0.954, 1.309, 1.73, 2.219, 2.779, 3.41, 4.114, 4.893, 5.745, 6.674, 7.679],
      A4: [0.014, 0.029, 0.047, 0.067, 0.088, 0.11, 0.133, 0.155, 0.178, 0.199, 0.221, 0.242, 0.262, 0.282, 0.302],
    },
    sweep: { from: 1, to: 120, step: 0.5 },
  };
}
