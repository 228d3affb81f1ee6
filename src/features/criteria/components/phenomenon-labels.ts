import type { Phenomenon } from "@shared/schemas/criteria";

export const PHENOMENON_LABEL: Record<Phenomenon, string> = {
  flutter: "Flutter",
  divergence: "Torsional divergence",
  vortexOnset: "Vortex-shedding onset",
  gallopingOnset: "Galloping onset",
};
