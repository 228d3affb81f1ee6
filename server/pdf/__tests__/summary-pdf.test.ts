import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inventedSummary } from "@shared/schemas/__tests__/fixtures/invented-summary";
import { explainWarningCode } from "@shared/warning-text";
import { KeyStore } from "../../signing/key-store";
import { signSummary } from "../../signing/sign-summary";
import { verificationCode } from "../../signing/verification-code";
import { renderSummaryPdf, type PdfBranch } from "../summary-pdf";
import { pdfText } from "./pdf-text";

/** Invented pole paths shaped like a coupled flutter case (heave branch damped, torsion branch crossing zero). */
function inventedBranches(): PdfBranch[] {
  const speeds = Array.from({ length: 61 }, (_, i) => i * 2);
  return [
    { id: "V1", steps: speeds.map((u) => ({ speed: u, frequency: 0.124 - 1e-6 * u * u, damping: 0.005 + 0.003 * u })) },
    {
      id: "T1",
      steps: speeds.map((u) => ({
        speed: u,
        frequency: 0.342 - 1e-5 * u * u,
        damping: 0.004 + 0.0008 * u * (1 - u / 78.412),
      })),
    },
  ];
}

let dir: string;
let jws: string;
let text: string;
let pages: number;
let pdf: Buffer;

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "stillspan-pdf-"));
  const store = await KeyStore.open({ dir: path.join(dir, "keys") });
  jws = (await signSummary(store, inventedSummary())).jws;
  pdf = await renderSummaryPdf({ summary: inventedSummary(), jws, branches: inventedBranches() });
  ({ text, pages } = await pdfText(pdf));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const squash = (value: string) => value.replace(/\s+/g, "");

describe("renderSummaryPdf", () => {
  it("writes a PDF whose text an independent extractor reads, on a few pages", () => {
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(pages).toBeGreaterThanOrEqual(2);
    expect(pages).toBeLessThanOrEqual(4);
  });

  it("states the flutter and divergence speeds, the required speeds and the margins", () => {
    expect(text).toContain("78.4 m/s");
    expect(text).toContain("0.231 Hz");
    expect(text).toContain("104.2 m/s");
    // Divergence is static: a real pole has no frequency to print.
    expect(text).not.toContain("0.000 Hz");
    expect(text).toMatch(/Torsional divergence\s*104\.2 m\/s\s*—/);
    expect(text).toContain("48.6 m/s");
    expect(text).toContain("1.61");
    expect(text).toMatch(/PASS/);
  });

  it("prints vortex shedding below the required speed as INVESTIGATE and galloping without a_G as NOT EVALUATED, never FAIL", () => {
    expect(text).toContain("INVESTIGATE");
    expect(text).toContain("NOT EVALUATED");
    expect(text).not.toContain("FAIL");
    expect(squash(text)).toContain(squash("investigate the vortex-induced amplitudes and deck accelerations"));
  });

  it("carries the cautions", () => {
    expect(text).toContain("Results are indicative.");
    const caution = "Critical designs need wind-tunnel verification and review by a licensed engineer";
    expect(squash(text)).toContain(squash(caution));
  });

  it("names the criteria's sources, the warnings, the signer and the signing date", () => {
    expect(text).toContain("EN 1991-1-4:2005 Annex E.4.3");
    // The workspace's plain sentence, not the engine's code.
    expect(squash(text)).toContain(squash(explainWarningCode("extrapolated-derivatives")!));
    expect(text).not.toContain("[extrapolated-derivatives]");
    expect(text).toContain("Ingrid Revisor (invented)");
    expect(text).toContain("2026-12-01 09:30 UTC");
  });

  it("prints each kind of warning's sentence once, even when the engine raised it at two speed ranges", async () => {
    const summary = inventedSummary();
    summary.warnings = [
      { code: "extrapolated-derivatives", message: "Derivatives extrapolated below the tested range at 1–15 m/s." },
      { code: "extrapolated-derivatives", message: "Derivatives extrapolated above the tested range at 76–120 m/s." },
    ];
    const twice = squash((await pdfText(await renderSummaryPdf({ summary, jws, branches: [] }))).text);
    expect(twice.split(squash(explainWarningCode("extrapolated-derivatives")!))).toHaveLength(2);
  });

  it("prints the whole JWS and its verification code", () => {
    // The JWS runs over a page break: drop the page footers ("Stillspan · … page n of m") before looking.
    const withoutFooters = squash(text).replace(/Stillspan·Inventedcrossing.*?page\d+of\d+/g, "");
    expect(withoutFooters).toContain(jws);
    expect(verificationCode(jws)).toMatch(/^[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}$/);
    expect(text).toContain(verificationCode(jws));
  });

  it("embeds the DejaVu TrueType font, so Greek letters come out as text", () => {
    expect(pdf.includes("/FontFile2")).toBe(true);
    expect(pdf.includes("DejaVuSans")).toBe(true);
    expect(text).toContain("ζ");
    expect(text).toContain("kg/m³");
  });

  it("shows a superseded banner only when a later revision was signed", async () => {
    expect(text).not.toContain("Superseded");
    const superseded = await renderSummaryPdf({
      summary: inventedSummary(),
      jws,
      branches: inventedBranches(),
      supersededBy: { revisionNumber: 4 },
    });
    expect((await pdfText(superseded)).text).toContain("Superseded: revision 4");
  });

  it("says 'all branches stay damped' instead of a speed when no flutter was found", async () => {
    const summary = { ...inventedSummary(), flutter: null };
    const none = await pdfText(await renderSummaryPdf({ summary, jws, branches: inventedBranches() }));
    expect(none.text).toContain("> 120.0 m/s");
    expect(none.text).toContain("all branches stay damped");
  });
});

describe("renderSummaryPdf with very long pole paths", () => {
  it("draws branches of 70,000 steps each (Math.max(...values) once overflowed the stack there)", async () => {
    const speeds = Array.from({ length: 70_000 }, (_, i) => i * 0.002);
    const branches: PdfBranch[] = [
      { id: "V1", steps: speeds.map((u) => ({ speed: u, frequency: 0.124, damping: 0.005 + 0.003 * u })) },
      { id: "T1", steps: speeds.map((u) => ({ speed: u, frequency: 0.342, damping: 0.004 - 0.0001 * u })) },
    ];
    const long = await renderSummaryPdf({ summary: inventedSummary(), jws, branches });
    expect(long.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  });
});
