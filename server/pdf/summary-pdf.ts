/**
 * The signed stability summary as a PDF (pdfkit): the verdict, the critical speeds with their basis, the margins,
 * the warnings, every input, what changed since the previously signed revision, who prepared, checked and approved
 * it, the criteria and their sources, the damping and frequency of every pole path (drawn from the same figure data
 * as the browser's plots), the reviewer's statement and the cautions — then, in an appendix, the JWS with its key.
 * The first page names the verification code and the public page that checks it. DejaVu Sans (shipped in
 * server/assets/fonts) covers ζ, λ, ±, µ and the other symbols; pdfkit embeds the subset it uses. A summary signed in
 * format 1 prints its body as signed (summary-pdf-v1.ts).
 */
import path from "node:path";
import { decodeProtectedHeader } from "jose";
import PDFDocument from "pdfkit";
import { dampingFigureData, frequencyFigureData, markersOfSummaryV1, type FigureMarker, type FigureRun, type LineFigureData } from "../../shared/figures/figure-data.js";
import type { SignedSummaryPayload } from "../../shared/schemas/summary.js";
import { projectRoot } from "../config.js";
import { verificationCode } from "../signing/verification-code.js";
import { drawLineChart } from "./line-chart.js";
import { PdfWriter, COLORS, FONTS } from "./pdf-writer.js";
import { writeBodyV1 } from "./summary-pdf-v1.js";
import { writeBodyV2 } from "./summary-pdf-v2.js";

export interface PdfBranch {
  id: string;
  steps: { speed: number; frequency: number; damping: number }[];
}

export interface SummaryPdfInput {
  summary: SignedSummaryPayload;
  jws: string;
  /** Pole paths of the stored sweep result (`SweepResult["modes"]`). */
  branches: PdfBranch[];
  /** When a later revision of the study has been signed. */
  supersededBy?: { revisionNumber: number } | null;
  /** Absolute address of the public page that verifies this summary by its code. */
  verificationUrl: string;
  /** Absolute address of the published keys. */
  jwksUrl: string;
  generatedAt?: Date;
}

const FONT_DIR = path.join(projectRoot, "server", "assets", "fonts");
const SERIES_COLORS = ["#14737b", "#6b4fa0", "#b8860b", "#3d6fb6", "#2f7550", "#8a5a44"];

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
  if (s.format === "stillspan.summary/1") writeBodyV1(w, s);
  else writeBodyV2(w, s);
  w.heading("Reviewer's statement");
  w.paragraph(s.statement);
  writeCharts(w, input);
  writeSignatureAppendix(w, input, code);
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
    ["Verify at", input.verificationUrl],
    ["Signing key id", decodeProtectedHeader(input.jws).kid ?? "unknown"],
    ["Revision content hash", s.revision.contentHash],
    ["Engine", s.engineVersion],
  ]);
}

function writeCharts(w: PdfWriter, input: SummaryPdfInput): void {
  const s = input.summary;
  const runs: FigureRun[] = [{ name: "Result", branches: input.branches, assessment: s.format === "stillspan.summary/1" ? null : s.assessment }];
  const legacy = s.format === "stillspan.summary/1" ? markersOfSummaryV1(s) : undefined;
  const damping = dampingFigureData(runs, legacy);
  const frequency = frequencyFigureData(runs, legacy);
  const flutterFails = s.format !== "stillspan.summary/1" && s.assessment.margins?.flutter.status === "fail";
  // Colour by verdict: the flutter speed is drawn in the failure colour only when its margin fails.
  const markerColor = (m: FigureMarker) =>
    m.kind === "flutter" ? (flutterFails ? COLORS.signal : COLORS.ink) : m.kind === "required-flutter" ? COLORS.muted : COLORS.caution;
  const height = 215;
  w.heading("Damping and frequency of every pole path", 2 * height + 40);
  const chart = (figure: LineFigureData, title: string) => {
    drawLineChart(w.doc, {
      x: w.left,
      y: w.y,
      width: w.width,
      height,
      title,
      figure,
      seriesColor: (series) => SERIES_COLORS[series.branch % SERIES_COLORS.length],
      markerColor,
      fonts: FONTS,
    });
    w.y += height + 8;
  };
  chart(damping, "Damping ratio ζ of each branch (%); flutter where a branch crosses zero");
  chart(frequency, "Frequency of each branch (Hz)");
  if (damping.note) w.note(damping.note);
}

function writeSignatureAppendix(w: PdfWriter, input: SummaryPdfInput, code: string): void {
  const kid = decodeProtectedHeader(input.jws).kid ?? "unknown";
  w.doc.addPage();
  w.y = w.doc.page.margins.top;
  w.heading("Appendix — the signature");
  w.paragraph(
    `This summary is signed as a compact JWS (EdDSA, Ed25519 key ${kid}) over the RFC 8785 canonical JSON of its content. ` +
      `Check it on the public page ${input.verificationUrl}, or verify the JWS below with any JOSE library against the ` +
      `server's public keys at ${input.jwksUrl}. The verification code is the first 12 hex digits of SHA-256 over the ` +
      `JWS text: ${code}.`,
  );
  w.mono(input.jws, 116, 6);
}
