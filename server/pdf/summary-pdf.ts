/**
 * The signed stability summary as a PDF (pdfkit): critical speeds, margins against the required speeds, criteria
 * and their basis, the damping and frequency of every pole path drawn as vector lines, model and data provenance,
 * warnings, the reviewer's statement, the cautions, and the JWS with its short verification code so a paper copy
 * can be matched to the verified record. DejaVu Sans (shipped in server/assets/fonts) covers ζ, λ, ±, µ and the
 * other symbols; pdfkit embeds the subset it uses.
 */
import path from "node:path";
import { decodeProtectedHeader } from "jose";
import PDFDocument from "pdfkit";
import { extent } from "../../shared/extent.js";
import { SUMMARY_CAUTIONS, type SummaryPayload } from "../../shared/schemas/summary.js";
import { explainWarningCode } from "../../shared/warning-text.js";
import { projectRoot } from "../config.js";
import { verificationCode } from "../signing/verification-code.js";
import { drawLineChart, type ChartSeries } from "./line-chart.js";
import { PdfWriter, COLORS, FONTS } from "./pdf-writer.js";

export interface PdfBranch {
  id: string;
  steps: { speed: number; frequency: number; damping: number }[];
}

export interface SummaryPdfInput {
  summary: SummaryPayload;
  jws: string;
  /** Pole paths of the stored sweep result (`SweepResult["modes"]`). */
  branches: PdfBranch[];
  /** When a later revision of the study has been signed. */
  supersededBy?: { revisionNumber: number } | null;
  generatedAt?: Date;
}

const FONT_DIR = path.join(projectRoot, "server", "assets", "fonts");
const SERIES_COLORS = ["#14737b", "#b0461a", "#6b4fa0", "#2f7550", "#8c6d1f", "#3d5f66"];
const PHENOMENON_LABEL = {
  flutter: "Flutter",
  divergence: "Torsional divergence",
  vortexOnset: "Vortex-shedding onset",
  gallopingOnset: "Galloping onset",
} as const;
const STATUS_LABEL: Record<SummaryPayload["margins"][number]["status"], string> = {
  pass: "PASS",
  fail: "FAIL",
  undetermined: "UNDETERMINED",
  investigate: "INVESTIGATE",
  clear: "CLEAR",
  "not-evaluated": "NOT EVALUATED",
};

const mps = (v: number | null | undefined) => (v === null || v === undefined ? "—" : `${v.toFixed(1)} m/s`);
const utc = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;

export function renderSummaryPdf(input: SummaryPdfInput): Promise<Buffer> {
  const { summary: s, jws } = input;
  const code = verificationCode(jws);
  const doc = new PDFDocument({
    size: "A4",
    margins: { top: 48, bottom: 56, left: 48, right: 48 },
    bufferPages: true,
    info: {
      Title: `Stability summary — ${s.study.name}, revision ${s.revision.number}`,
      Author: s.signer.name,
      Subject: `${s.project.name} — ${s.alternative.name}`,
      Keywords: `Stillspan signed summary ${code}`,
      Creator: "Stillspan",
      CreationDate: input.generatedAt ?? new Date(s.signedAt),
    },
  });
  doc.registerFont(FONTS.regular, path.join(FONT_DIR, "DejaVuSans.ttf"));
  doc.registerFont(FONTS.bold, path.join(FONT_DIR, "DejaVuSans-Bold.ttf"));
  doc.registerFont(FONTS.mono, path.join(FONT_DIR, "DejaVuSansMono.ttf"));
  const chunks: Buffer[] = [];
  doc.on("data", (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });

  const w = new PdfWriter(doc);
  writeHeader(w, input, code);
  writeCriticalSpeeds(w, s);
  writeMargins(w, s);
  w.banner(SUMMARY_CAUTIONS.join(" "), COLORS.caution);
  writeCriteria(w, s);
  writeProvenance(w, s);
  writeWarnings(w, s);
  w.heading("Reviewer's statement");
  w.paragraph(s.statement);
  writeCharts(w, input);
  writeSignature(w, input, code);
  w.footers(`Stillspan · ${s.project.name} · ${s.study.name}, revision ${s.revision.number} · code ${code}`);
  doc.end();
  return done;
}

function writeHeader(w: PdfWriter, input: SummaryPdfInput, code: string): void {
  const s = input.summary;
  w.kicker("STILLSPAN · SIGNED STABILITY SUMMARY");
  w.title(s.project.name);
  w.paragraph(`${s.alternative.name} · ${s.study.name} · revision ${s.revision.number}`, { color: COLORS.muted });
  if (input.supersededBy) {
    w.banner(
      `Superseded: revision ${input.supersededBy.revisionNumber} of this study has been signed since. ` +
        "Read the current summary.",
      COLORS.signal,
    );
  }
  w.facts([
    ["Signed by", `${s.signer.name} <${s.signer.email}>`],
    ["Signed on", utc(s.signedAt)],
    ["Verification code", code],
    ["Revision content hash", s.revision.contentHash],
    ["Engine", s.engineVersion],
  ]);
}

function writeCriticalSpeeds(w: PdfWriter, s: SummaryPayload): void {
  w.heading("Critical speeds");
  const f = s.flutter;
  const sweepEnd = s.sweep.toMps.toFixed(1);
  w.table(
    ["", "Speed", "Frequency", "Details"],
    [
      f
        ? [
            "Flutter",
            mps(f.speedMps),
            `${f.frequencyHz.toFixed(3)} Hz`,
            `${f.kind}, from mode ${f.mode}, Ur = ${f.reducedVelocity.toFixed(2)}`,
          ]
        : ["Flutter", `> ${sweepEnd} m/s`, "—", "all branches stay damped up to the end of the sweep"],
      s.divergence
        ? ["Torsional divergence", mps(s.divergence.speedMps), "—", "static instability (a real pole, no oscillation)"]
        : ["Torsional divergence", "none", "—", "static moment slope ≤ 0: divergence cannot occur"],
    ],
    [130, 80, 75, 214],
  );
  w.note(
    `Sweep ${s.sweep.fromMps.toFixed(1)}–${sweepEnd} m/s, air density ${s.sweep.airDensityKgM3} kg/m³; ` +
      "speeds are mean wind speeds at deck level.",
  );
}

function writeMargins(w: PdfWriter, s: SummaryPayload): void {
  w.heading("Margins against the required speeds");
  w.table(
    ["Check", "Critical", "Required", "Margin", "Result"],
    s.margins.map((m) => [
      PHENOMENON_LABEL[m.phenomenon],
      m.criticalSpeedMps === null && m.marginIsLowerBound && m.margin !== null
        ? `> ${(m.margin * m.requiredSpeedMps).toFixed(1)} m/s`
        : mps(m.criticalSpeedMps),
      mps(m.requiredSpeedMps),
      m.margin === null ? "—" : `${m.marginIsLowerBound ? "≥ " : ""}${m.margin.toFixed(2)}`,
      STATUS_LABEL[m.status],
    ]),
    [150, 95, 95, 70, 89],
    { statusColumn: 4 },
  );
  for (const m of s.margins) w.note(m.statement);
}

function writeCriteria(w: PdfWriter, s: SummaryPayload): void {
  w.heading("Criteria and their sources");
  const d = s.designWind;
  w.paragraph(
    `Design mean wind at deck level v_m = ${mps(d.meanSpeedMps)} (basic wind ${mps(d.basicSpeedMps)}, ` +
      `deck height ${d.deckHeightM} m).`,
  );
  for (const source of d.sources) w.bullet(source);
  for (const c of s.criteria) {
    const multipliers = [c.gustFactor && `gust ${c.gustFactor}`, c.angleFactor && `angle ${c.angleFactor}`]
      .filter(Boolean)
      .map((m) => ` × ${m}`)
      .join("");
    w.paragraph(
      `${PHENOMENON_LABEL[c.phenomenon]}: required ${mps(c.requiredSpeedMps)} = ${c.factor}` +
        `${multipliers} × v_m (total factor ${c.totalFactor.toFixed(3)})`,
      { bold: true },
    );
    for (const b of c.basis) w.bullet(b);
  }
}

function writeCharts(w: PdfWriter, input: SummaryPdfInput): void {
  const s = input.summary;
  const series = (pick: (st: PdfBranch["steps"][number]) => number): ChartSeries[] =>
    input.branches.map((b, i) => ({
      label: `branch from ${b.id}`,
      color: SERIES_COLORS[i % SERIES_COLORS.length],
      points: b.steps.map((st) => [st.speed, pick(st)] as [number, number]),
    }));
  const markers = [
    ...(s.flutter ? [{ x: s.flutter.speedMps, label: `flutter ${mps(s.flutter.speedMps)}`, color: "#b0461a" }] : []),
    ...(s.divergence && s.divergence.speedMps <= s.sweep.toMps
      ? [{ x: s.divergence.speedMps, label: `divergence ${mps(s.divergence.speedMps)}`, color: "#6f520c" }]
      : []),
  ];
  const damping = series((st) => st.damping * 100);
  const values = damping.flatMap((d) => d.points.map((p) => p[1]));
  const range = extent(values);
  const yRange: [number, number] = [Math.max(Math.min(0, range.min), -10), Math.min(Math.max(range.max, 1), 30)];
  const height = 215;
  w.heading("Damping and frequency of every pole path", 2 * height + 40);
  const xLabel = "Mean wind speed at deck level U (m/s)";
  const common = { x: w.left, width: w.width, height, xLabel, markers, fonts: FONTS };
  drawLineChart(w.doc, {
    ...common,
    y: w.y,
    title: "Damping ratio ζ of each branch (%); flutter where a branch crosses zero",
    yLabel: "ζ (%)",
    series: damping,
    zeroLine: true,
    yRange,
  });
  w.y += height + 10;
  drawLineChart(w.doc, {
    ...common,
    y: w.y,
    title: "Frequency of each branch (Hz)",
    yLabel: "f (Hz)",
    series: series((st) => st.frequency),
  });
  w.y += height + 6;
  w.note("Damping axis clipped to −10 … 30 % for legibility; the stored result holds every value.");
}

function writeProvenance(w: PdfWriter, s: SummaryPayload): void {
  w.heading("Model and aerodynamic data");
  const a = s.aerodynamicData;
  const rows: [string, string][] = [
    ["Model", `${s.model.kind}, ${s.model.degreesOfFreedom} degrees of freedom, ${s.model.aerodynamics} aerodynamics`],
    ["Data set", `${a.name} (${a.origin})`],
  ];
  if (a.sha256) rows.push(["Data file SHA-256", a.sha256]);
  const delivered = a.deliveredConvention;
  if (delivered) {
    rows.push(["Delivered as", `${delivered.abscissa}; ${delivered.normalisation}; ${delivered.signConvention}`]);
  }
  if (a.testedReducedVelocity) {
    rows.push(["Tested Ur range", `${a.testedReducedVelocity[0]} – ${a.testedReducedVelocity[1]}`]);
  }
  if (a.facility) rows.push(["Facility", a.facility]);
  w.facts(rows);
}

function writeWarnings(w: PdfWriter, s: SummaryPayload): void {
  w.heading("Warnings");
  if (s.warnings.length === 0) w.paragraph("The computation raised no warning.");
  // The plain sentence the workspace shows, once per kind (the engine may raise one kind at several speed ranges);
  // the engine's own message only for a code this build does not know.
  const sentences = new Set(s.warnings.map((warning) => explainWarningCode(warning.code) ?? warning.message));
  for (const sentence of sentences) w.bullet(sentence, COLORS.signal);
}

function writeSignature(w: PdfWriter, input: SummaryPdfInput, code: string): void {
  const kid = decodeProtectedHeader(input.jws).kid ?? "unknown";
  w.heading("Signature");
  w.paragraph(
    `This summary is signed as a compact JWS (EdDSA, Ed25519 key ${kid}). To check it, paste the JWS into ` +
      "Stillspan's verification page, or verify it with any JOSE library against the server's public keys at " +
      "/.well-known/jwks.json. The verification code is the first 12 hex digits of SHA-256 over the JWS text: " +
      `${code}.`,
  );
  w.mono(input.jws);
}
