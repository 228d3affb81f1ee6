/**
 * The body of a summary signed in format 1 (`stillspan.summary/1`, before summaries carried their inputs and the
 * revision's assessment), printed exactly as it was signed: its critical speeds, margins, criteria, data provenance
 * and warnings.
 */
import type { SummaryPayloadV1 } from "../../shared/schemas/summary-v1.js";
import { SUMMARY_CAUTIONS } from "../../shared/schemas/summary.js";
import { explainWarningCode } from "../../shared/warning-text.js";
import { COLORS, type PdfWriter } from "./pdf-writer.js";
import { PHENOMENON_LABEL, STATUS_LABEL, writeRequiredSpeeds } from "./summary-pdf-parts.js";

const mps = (v: number | null | undefined) => (v === null || v === undefined ? "—" : `${v.toFixed(1)} m/s`);

export function writeBodyV1(w: PdfWriter, s: SummaryPayloadV1): void {
  w.banner(`Signed in summary format 1 (${s.format}): printed as signed. Later summaries also state their inputs and the basis of every figure.`, COLORS.caution);
  writeCriticalSpeeds(w, s);
  writeMargins(w, s);
  w.banner(SUMMARY_CAUTIONS.join(" "), COLORS.caution);
  writeRequiredSpeeds(w, s.designWind, s.criteria);
  writeProvenance(w, s);
  writeWarnings(w, s);
}

function writeCriticalSpeeds(w: PdfWriter, s: SummaryPayloadV1): void {
  w.heading("Critical speeds");
  const f = s.flutter;
  const sweepEnd = s.sweep.toMps.toFixed(1);
  w.table(
    ["", "Speed", "Frequency", "Details"],
    [
      f
        ? ["Flutter", mps(f.speedMps), `${f.frequencyHz.toFixed(3)} Hz`, `${f.kind}, from mode ${f.mode}, Ur = ${f.reducedVelocity.toFixed(2)}`]
        : ["Flutter", `> ${sweepEnd} m/s`, "—", "all branches stay damped up to the end of the sweep"],
      s.divergence
        ? ["Torsional divergence", mps(s.divergence.speedMps), "—", "closed form (static, no oscillation)"]
        : ["Torsional divergence", "none", "—", "static moment slope ≤ 0: divergence cannot occur"],
    ],
    [130, 80, 75, 214],
  );
  w.note(`Sweep ${s.sweep.fromMps.toFixed(1)}–${sweepEnd} m/s, air density ${s.sweep.airDensityKgM3} kg/m³; speeds are mean wind speeds at deck level.`);
}

function writeMargins(w: PdfWriter, s: SummaryPayloadV1): void {
  w.heading("Margins against the required speeds");
  w.table(
    ["Check", "Critical", "Required", "Margin", "Result"],
    s.margins.map((m) => [
      PHENOMENON_LABEL[m.phenomenon],
      m.criticalSpeedMps === null && m.marginIsLowerBound && m.margin !== null ? `> ${(m.margin * m.requiredSpeedMps).toFixed(1)} m/s` : mps(m.criticalSpeedMps),
      mps(m.requiredSpeedMps),
      m.margin === null ? "—" : `${m.marginIsLowerBound ? "≥ " : ""}${m.margin.toFixed(2)}`,
      STATUS_LABEL[m.status],
    ]),
    [150, 95, 95, 70, 89],
    { statusColumn: 4 },
  );
  for (const m of s.margins) w.note(m.statement);
}

function writeProvenance(w: PdfWriter, s: SummaryPayloadV1): void {
  w.heading("Model and aerodynamic data");
  const a = s.aerodynamicData;
  const rows: [string, string][] = [
    ["Model", `${s.model.kind}, ${s.model.degreesOfFreedom} degrees of freedom, ${s.model.aerodynamics} aerodynamics`],
    ["Data set", `${a.name} (${a.origin})`],
  ];
  if (a.sha256) rows.push(["Data file SHA-256", a.sha256]);
  if (a.deliveredConvention) rows.push(["Delivered as", `${a.deliveredConvention.abscissa}; ${a.deliveredConvention.normalisation}; ${a.deliveredConvention.signConvention}`]);
  if (a.testedReducedVelocity) rows.push(["Tested Ur range", `${a.testedReducedVelocity[0]} – ${a.testedReducedVelocity[1]}`]);
  if (a.facility) rows.push(["Facility", a.facility]);
  w.facts(rows);
}

function writeWarnings(w: PdfWriter, s: SummaryPayloadV1): void {
  w.heading(`Warnings (${s.warnings.length})`);
  if (s.warnings.length === 0) w.paragraph("The computation raised no warning.");
  for (const warning of s.warnings) w.bullet(warning.message, COLORS.caution);
  const explained = new Set(s.warnings.flatMap((warning) => explainWarningCode(warning.code) ?? []));
  for (const sentence of explained) w.note(sentence);
}
