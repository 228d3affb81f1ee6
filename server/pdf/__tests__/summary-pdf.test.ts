import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { assessRevision } from "@shared/assessment/assess-revision";
import { createFlatPlateModel } from "@shared/engine/aero/flat-plate";
import { runSweep } from "@shared/engine/run-sweep";
import { benchmarkDeck } from "@shared/engine/__tests__/support/benchmark-deck";
import { inventedSummaryV1 } from "@shared/schemas/__tests__/fixtures/invented-summary-v1";
import { inventedSummary, inventedSummaryStudy } from "@shared/schemas/__tests__/fixtures/invented-summary-v2";
import type { StudyDocument } from "@shared/schemas/study";
import { KeyStore } from "../../signing/key-store";
import { signSummary } from "../../signing/sign-summary";
import { verificationCode } from "../../signing/verification-code";
import { renderSummaryPdf } from "../summary-pdf";
import { pdfText } from "./pdf-text";

const VERIFY = "https://stillspan.example.org/verify/";
const JWKS = "https://stillspan.example.org/.well-known/jwks.json";
const branches = () => inventedSummaryStudy().result.modes;

let dir: string;
let jws: string;
let text: string;
let flat: string;
let pages: number;
let pdf: Buffer;

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "stillspan-pdf-"));
  const store = await KeyStore.open({ dir: path.join(dir, "keys") });
  jws = (await signSummary(store, inventedSummary())).jws;
  pdf = await renderSummaryPdf({ summary: inventedSummary(), jws, branches: branches(), verificationUrl: VERIFY + verificationCode(jws), jwksUrl: JWKS });
  ({ text, pages } = await pdfText(pdf));
  flat = text.replace(/\s+/g, " ");
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const squash = (value: string) => value.replace(/\s+/g, "");

describe("renderSummaryPdf (format 2)", () => {
  it("writes a PDF whose text an independent extractor reads, the signature in an appendix page", () => {
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(pages).toBeGreaterThanOrEqual(3);
    expect(pages).toBeLessThanOrEqual(7);
    const appendix = squash(text).indexOf(squash("Appendix — the signature"));
    expect(appendix).toBeGreaterThan(squash(text).indexOf(squash("Reviewer's statement")));
  });

  it("states the assessment's flutter speed, whether it is within the tested range, and both divergence figures by basis", () => {
    const a = inventedSummary().assessment;
    if (!a.flutter.found) throw new Error("the fixture has flutter");
    expect(flat).toContain(`${a.flutter.speedMps.toFixed(2)} m/s`);
    expect(flat).toContain(`Flutter point: ${a.flutter.testedRange.statement}.`);
    expect(flat).toContain("within the tested range");
    expect(flat).toContain("Divergence — closed form (EN 1991-1-4 E.4.3, Expr. (E.24))");
    expect(flat).toContain(`${a.divergence.closedForm.speedMps!.toFixed(2)} m/s`);
    expect(flat).toContain("Divergence — static instability of the sweep");
    expect(flat).toContain(`${a.divergence.staticInstability.speedMps!.toFixed(2)} m/s`);
    expect(squash(text)).toContain(squash(a.divergence.marginBasis));
    // Never "a real pole" for the closed form.
    expect(flat).not.toMatch(/closed form[^.]*a real pole/);
  });

  it("prints the margins with their verdict, vortex shedding as a screening result, and the warning count", () => {
    const a = inventedSummary().assessment;
    expect(flat).toContain(`${a.margins!.flutter.margin!.toFixed(2)}`);
    expect(flat).toMatch(/PASS/);
    expect(flat).not.toContain("FAIL");
    expect(flat).toContain("Vortex shedding (screening, not a stability margin): INVESTIGATE");
    expect(flat).toContain(`Warnings (${a.warningCount})`);
    for (const w of a.warnings) expect(squash(text)).toContain(squash(w.message));
  });

  it("states every input the result depends on", () => {
    const i = inventedSummary().inputs;
    const d = i.aerodynamics.dataset!;
    for (const fact of [
      `${i.airDensityKgM3} kg/m³`,
      `${i.deck.widthM} m, ${i.deck.depthM} m`,
      `${i.structure.massKgPerM} kg/m`,
      `${i.structure.inertiaKgM2PerM} kg·m²/m`,
      ...i.structure.modes.flatMap((m) => [`f = ${m.frequencyHz} Hz`, `ζ = ${m.dampingRatio}`]),
      i.structure.massRatio!.toFixed(2),
      i.structure.frequencyRatio.toFixed(3),
      d.facility!,
      `1:${d.modelScale}`,
      d.flow,
      `${d.meanAngleDeg}°`,
      d.reynoldsNumber!.toExponential(2),
      d.testDate!,
      d.fileSha256,
      `${i.sweep.fromMps} – ${i.sweep.toMps} m/s, step ${i.sweep.stepMps} m/s`,
      "K = Bω/U",
    ]) {
      expect(squash(text), fact).toContain(squash(fact));
    }
  });

  it("lists what changed since the previously signed revision, and who prepared, checked and approved it", () => {
    const s = inventedSummary();
    expect(flat).toContain(s.changes.statement);
    expect(flat).toContain("Inertia I (kg·m²/m)");
    expect(flat).toContain("1710000");
    expect(flat).toContain("Prepared, checked, approved");
    expect(flat).toContain(s.signoff.prepared.name);
    expect(flat).toMatch(/Approved\s*Ingrid Revisor \(invented\)/);
  });

  it("points to the public verification page and the keys at absolute addresses, and prints the whole JWS", () => {
    const code = verificationCode(jws);
    expect(flat).toContain(code);
    expect(squash(text)).toContain(squash(VERIFY + code));
    expect(squash(text)).toContain(squash(JWKS));
    expect(squash(text).replace(/Stillspan·Inventedcrossing.*?page\d+of\d+/g, "")).toContain(jws);
  });

  it("carries the cautions and embeds the DejaVu font, so Greek letters come out as text", () => {
    expect(text).toContain("Results are indicative.");
    expect(squash(text)).toContain(squash("Critical designs need wind-tunnel verification and review by a licensed engineer"));
    expect(pdf.includes("/FontFile2")).toBe(true);
    expect(text).toContain("ζ");
  });

  it("shows a superseded banner only when a later revision was signed", async () => {
    expect(text).not.toContain("Superseded");
    const superseded = await renderSummaryPdf({ summary: inventedSummary(), jws, branches: [], verificationUrl: VERIFY, jwksUrl: JWKS, supersededBy: { revisionNumber: 4 } });
    expect((await pdfText(superseded)).text).toContain("Superseded: revision 4");
  });
});

describe("renderSummaryPdf: a flutter point beyond the tested range", () => {
  it("says in words how far beyond the table the governing flutter point lies", async () => {
    // The benchmark deck (docs/conventions.md §Benchmark deck) with thin-plate derivatives tabulated only up to Ur 8.
    const ur = Array.from({ length: 29 }, (_, i) => 1 + i * 0.25);
    const plate = createFlatPlateModel();
    const rows = ur.map((u) => plate.derivatives((2 * Math.PI) / u));
    const col = (n: keyof (typeof rows)[number]) => rows.map((r) => r[n]);
    const document: StudyDocument = {
      ...benchmarkDeck({ to: 120 }),
      aerodynamics: { model: "tabulated", interpolation: "monotone-cubic", reducedVelocity: ur, H1: col("H1"), H2: col("H2"), H3: col("H3"), H4: col("H4"), A1: col("A1"), A2: col("A2"), A3: col("A3"), A4: col("A4") },
    };
    const result = runSweep(document);
    const summary = { ...inventedSummary(), assessment: assessRevision({ document, result, criteria: null }) };
    const out = (await pdfText(await renderSummaryPdf({ summary, jws, branches: result.modes, verificationUrl: VERIFY, jwksUrl: JWKS }))).text.replace(/\s+/g, " ");
    expect(out).toMatch(/Flutter point: beyond it by ΔUr \d+\.\d+ \(Ur \d+\.\d+ at flutter; tested Ur 1–8\)/);
    expect(out).toContain("rests on extrapolated data");
  });
});

describe("renderSummaryPdf (format 1, signed before format 2)", () => {
  it("still prints a format-1 summary as it was signed", async () => {
    const old = (await pdfText(await renderSummaryPdf({ summary: inventedSummaryV1(), jws, branches: branches(), verificationUrl: VERIFY, jwksUrl: JWKS }))).text;
    expect(old).toContain("Signed in summary format 1");
    expect(old).toContain("78.4 m/s");
    expect(old).toContain("104.2 m/s");
    expect(old).toContain("INVESTIGATE");
    expect(old).toContain("Ingrid Revisor (invented)");
  });

  it("draws branches of 70,000 steps each (Math.max(...values) once overflowed the stack there)", async () => {
    const speeds = Array.from({ length: 70_000 }, (_, i) => i * 0.002);
    const long = [
      { id: "V1", steps: speeds.map((u) => ({ speed: u, frequency: 0.124, damping: 0.005 + 0.003 * u })) },
      { id: "T1", steps: speeds.map((u) => ({ speed: u, frequency: 0.342, damping: 0.004 - 0.0001 * u })) },
    ];
    const out = await renderSummaryPdf({ summary: inventedSummaryV1(), jws, branches: long, verificationUrl: VERIFY, jwksUrl: JWKS });
    expect(out.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  });
});
