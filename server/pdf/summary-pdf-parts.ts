/** Labels and sections every summary format prints the same way. */
import type { PdfWriter } from "./pdf-writer.js";

export const PHENOMENON_LABEL = {
  flutter: "Flutter",
  divergence: "Torsional divergence",
  vortexOnset: "Vortex-shedding onset",
  gallopingOnset: "Galloping onset",
} as const;

export const STATUS_LABEL = {
  pass: "PASS",
  fail: "FAIL",
  undetermined: "UNDETERMINED",
  investigate: "INVESTIGATE",
  clear: "CLEAR",
  "not-evaluated": "NOT EVALUATED",
} as const;

const mps = (v: number) => `${v.toFixed(2)} m/s`;

interface RequiredSpeed {
  phenomenon: keyof typeof PHENOMENON_LABEL;
  requiredSpeedMps: number;
  totalFactor: number;
  factor: number;
  gustFactor: number | null;
  angleFactor: number | null;
  basis: string[];
}

/** The design wind and the required speed of each phenomenon, with the basis of every factor. */
export function writeRequiredSpeeds(
  w: PdfWriter,
  wind: { meanSpeedMps: number; basicSpeedMps: number; deckHeightM: number; sources: string[] },
  required: readonly RequiredSpeed[],
): void {
  w.heading("Criteria and their sources");
  w.paragraph(`Design mean wind at deck level v_m = ${mps(wind.meanSpeedMps)} (basic wind ${mps(wind.basicSpeedMps)}, deck height ${wind.deckHeightM} m).`);
  for (const source of wind.sources) w.bullet(source);
  for (const c of required) {
    const multipliers = [c.gustFactor && `gust ${c.gustFactor}`, c.angleFactor && `angle ${c.angleFactor}`]
      .filter(Boolean)
      .map((m) => ` × ${m}`)
      .join("");
    w.paragraph(
      `${PHENOMENON_LABEL[c.phenomenon]}: ${c.phenomenon === "vortexOnset" ? "no investigation needed above" : "required"} ${mps(c.requiredSpeedMps)} = ${c.factor}` +
        `${multipliers} × v_m (total factor ${c.totalFactor.toFixed(3)})`,
      { bold: true },
    );
    for (const b of c.basis) w.bullet(b);
  }
}
