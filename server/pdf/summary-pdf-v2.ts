/**
 * The body of a `stillspan.summary/2` PDF, read from the signed payload only: the assessment's figures with their
 * basis and the data behind each, the margins and which divergence figure they use, the vortex-shedding screening in
 * its own words, the warnings, every input, what changed since the previously signed revision, and who prepared,
 * checked and approved it. The same words the workspace and the summary page show, since all read the assessment.
 */
import { speedText, urText } from "../../shared/assessment/format.js";
import type { StabilityMargin } from "../../shared/schemas/assessment.js";
import { SUMMARY_CAUTIONS, type SummaryPayload } from "../../shared/schemas/summary.js";
import { COLORS, type PdfWriter } from "./pdf-writer.js";
import { STATUS_LABEL, writeRequiredSpeeds } from "./summary-pdf-parts.js";

const VERDICT: Record<SummaryPayload["assessment"]["verdict"], [string, string]> = {
  pass: ["Every stability margin passes.", COLORS.steady],
  fail: ["A stability margin fails.", COLORS.signal],
  undetermined: ["A stability check is undetermined: the sweep ends below its required speed.", COLORS.caution],
  "no-criteria": ["No criteria: no margins were evaluated.", COLORS.muted],
};

const utc = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
const value = (v: unknown) => (v === undefined ? "—" : typeof v === "number" ? String(Number(v.toPrecision(8))) : JSON.stringify(v));

export function writeBodyV2(w: PdfWriter, s: SummaryPayload): void {
  const a = s.assessment;
  const [verdict, colour] = VERDICT[a.verdict];
  w.banner(`${verdict} ${a.warningCount} warning${a.warningCount === 1 ? "" : "s"} of the computation (listed below).`, colour);
  writeCriticalSpeeds(w, s);
  writeMargins(w, s);
  w.banner(SUMMARY_CAUTIONS.join(" "), COLORS.caution);
  writeWarnings(w, s);
  writeInputs(w, s);
  writeChanges(w, s);
  if (a.designWind && a.required) writeRequiredSpeeds(w, a.designWind, a.required);
  else if (a.criteriaNote) w.paragraph(a.criteriaNote);
  writeSignoff(w, s);
}

function writeCriticalSpeeds(w: PdfWriter, s: SummaryPayload): void {
  const a = s.assessment;
  const f = a.flutter;
  const d = a.divergence;
  w.heading("Critical speeds and their basis");
  w.table(
    ["Figure", "Speed", "Basis"],
    [
      f.found
        ? ["Flutter", speedText(f.speedMps), `${f.basis}; ${f.frequencyHz.toFixed(4)} Hz, Ur ${urText(f.reducedVelocity)}`]
        : ["Flutter", `none up to ${speedText(f.upToMps)}`, f.basis],
      [
        "Divergence — closed form (EN 1991-1-4 E.4.3, Expr. (E.24))",
        d.closedForm.speedMps !== null ? speedText(d.closedForm.speedMps) : "none",
        `${d.closedForm.slopeSource}${d.closedForm.speedMps !== null && !d.closedForm.withinSweep ? "; beyond the swept range" : ""}`,
      ],
      [
        "Divergence — static instability of the sweep",
        d.staticInstability.speedMps !== null ? speedText(d.staticInstability.speedMps) : `none up to ${speedText(d.staticInstability.upToMps)}`,
        d.staticInstability.speedMps !== null
          ? `real pole crossing zero on branch ${d.staticInstability.branch ?? "?"} (H3*, H4*, A4* and A3*)`
          : "no real pole crosses zero in the sweep",
      ],
      ["Selberg estimate", a.selberg.speedMps !== null ? speedText(a.selberg.speedMps) : "n/a", "empirical, thin-plate-like decks; for orientation only"],
    ],
    [150, 80, 269],
  );
  if (f.found) w.paragraph(`Flutter point: ${f.testedRange.statement}.`, { bold: f.testedRange.status === "beyond" });
  else w.paragraph(f.statement);
  w.paragraph(d.marginBasis);
  w.note(`${a.aerodynamics.statement} ${a.selberg.statement}`);
}

function marginRow(label: string, m: StabilityMargin): string[] {
  const critical = m.criticalSpeedMps !== null ? speedText(m.criticalSpeedMps) : m.marginIsLowerBound && m.margin !== null ? `> ${speedText(m.margin * m.requiredSpeedMps)}` : "—";
  const ratio = m.margin === null ? "—" : `${m.marginIsLowerBound ? "≥ " : ""}${m.margin.toFixed(2)}`;
  return [label, critical, speedText(m.requiredSpeedMps), ratio, STATUS_LABEL[m.status]];
}

function writeMargins(w: PdfWriter, s: SummaryPayload): void {
  const a = s.assessment;
  w.heading("Margins against the required speeds");
  if (!a.margins) {
    w.paragraph(a.criteriaNote ?? "No margins.");
  } else {
    const basis = a.divergence.governing === "static-instability" ? "static instability" : "closed form";
    w.table(
      ["Stability check", "Critical", "Required", "Margin", "Result"],
      [
        marginRow("Flutter", a.margins.flutter),
        marginRow(`Torsional divergence (${basis})`, a.margins.divergence),
        marginRow("Galloping onset", a.margins.gallopingOnset),
      ],
      [150, 95, 95, 70, 89],
      { statusColumn: 4 },
    );
    for (const m of Object.values(a.margins)) w.note(m.statement);
  }
  const v = a.vortexShedding;
  w.paragraph(`Vortex shedding (screening, not a stability margin): ${STATUS_LABEL[v.status]}`, {
    bold: true,
    color: v.status === "investigate" ? COLORS.caution : v.status === "clear" ? COLORS.steady : COLORS.muted,
  });
  w.paragraph(v.statement);
}

function writeWarnings(w: PdfWriter, s: SummaryPayload): void {
  const a = s.assessment;
  w.heading(`Warnings (${a.warningCount})`);
  if (a.warnings.length === 0) w.paragraph("The computation raised no warning.");
  for (const warning of a.warnings) w.bullet(`${warning.title}${warning.speeds ? ` (${warning.speeds})` : ""}: ${warning.message}`, COLORS.caution);
  if (a.warningCount > a.warnings.length) w.note(`${a.warningCount - a.warnings.length} further warnings of the same kinds are not listed.`);
  for (const sentence of new Set(a.warnings.flatMap((x) => x.explanation ?? []))) w.note(sentence);
}

function writeInputs(w: PdfWriter, s: SummaryPayload): void {
  const i = s.inputs;
  const st = i.structure;
  const ae = i.aerodynamics;
  w.heading("Inputs of the computation");
  w.facts([
    ["Air density ρ", `${i.airDensityKgM3} kg/m³`],
    ["Deck width B, depth D", `${i.deck.widthM} m, ${i.deck.depthM} m`],
    ["Mass m", `${st.massKgPerM} kg/m`],
    ["Inertia I", `${st.inertiaKgM2PerM} kg·m²/m (radius of gyration r = √(I/m) = ${st.radiusOfGyrationM.toFixed(3)} m)`],
    ...st.modes.map((m): [string, string] => [`Mode ${m.id} (${m.dof})`, `f = ${m.frequencyHz} Hz, damping ratio ζ = ${m.dampingRatio}`]),
    ["Mass ratio m/(ρB²)", st.massRatio !== null ? st.massRatio.toFixed(2) : "— (ρ = 0)"],
    ["Inertia ratio I/(ρB⁴)", st.inertiaRatio !== null ? st.inertiaRatio.toFixed(3) : "— (ρ = 0)"],
    ["Frequency ratio f_α/f_h", st.frequencyRatio.toFixed(3)],
    ["Aerodynamic model", ae.description],
    ...(ae.tableRows !== null && ae.testedReducedVelocity
      ? [["Derivative table", `${ae.tableRows} rows, tested Ur ${urText(ae.testedReducedVelocity[0])}–${urText(ae.testedReducedVelocity[1])}, ${ae.interpolation} interpolation`] as [string, string]]
      : []),
    ...(ae.staticMomentSlopePerRad !== null ? [["Static moment slope", `${ae.staticMomentSlopePerRad} per rad`] as [string, string]] : []),
    ...(ae.quasiSteady
      ? [["Static slopes", `dC_L/dα ${ae.quasiSteady.liftSlopePerRad}, C_D ${ae.quasiSteady.dragCoefficient}, dC_M/dα ${ae.quasiSteady.momentSlopePerRad} per rad`] as [string, string]]
      : []),
    ...datasetFacts(s),
    ["Conventions", ae.conventions],
    ["Sweep", `${i.sweep.fromMps} – ${i.sweep.toMps} m/s, step ${i.sweep.stepMps} m/s (refined locally near critical points)`],
  ]);
}

function datasetFacts(s: SummaryPayload): [string, string][] {
  const d = s.inputs.aerodynamics.dataset;
  if (!d) return [];
  return [
    ["Data set", d.name],
    ["Data file SHA-256", d.fileSha256],
    ["Delivered as", `${d.deliveredConvention.abscissa}; ${d.deliveredConvention.normalisation}; ${d.deliveredConvention.signConvention}`],
    ["Facility", d.facility ?? "—"],
    ["Model scale", d.modelScale !== null ? `1:${d.modelScale}` : "—"],
    ["Flow", `${d.flow}${d.turbulenceIntensityPct !== null ? `, I_u ${d.turbulenceIntensityPct} %` : ""}`],
    ["Mean angle of attack", `${d.meanAngleDeg}°`],
    ["Reynolds number (on B)", d.reynoldsNumber !== null ? d.reynoldsNumber.toExponential(2) : "—"],
    ["Test date", d.testDate ?? "—"],
  ];
}

function writeChanges(w: PdfWriter, s: SummaryPayload): void {
  const c = s.changes;
  w.heading("Changes since the previously signed revision");
  w.paragraph(c.statement);
  if (s.revision.changeNote) w.note(`Change note of revision ${s.revision.number}: ${s.revision.changeNote}`);
  if (c.items.length > 0) {
    w.table(
      ["Field", "Before", "Now"],
      c.items.map((item) => [item.label, value(item.old), value(item.new)]),
      [219, 140, 140],
    );
  }
  if (c.omitted > 0) w.note(`${c.omitted} further changed fields are not listed; the revision diff shows every one.`);
}

function writeSignoff(w: PdfWriter, s: SummaryPayload): void {
  const o = s.signoff;
  w.heading("Prepared, checked, approved");
  w.table(
    ["", "Name", "Role", "Date"],
    [
      ["Prepared", o.prepared.name, "analyst (author of the revision)", utc(o.prepared.at)],
      ["Checked", o.checked.name, `reviewer (submitted ${utc(o.checked.submittedAt)})`, utc(o.checked.at)],
      ["Approved", o.approved.name, `by ${o.approved.by}`, utc(o.approved.at)],
    ],
    [70, 130, 189, 110],
  );
}
