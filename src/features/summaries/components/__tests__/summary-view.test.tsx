import "@testing-library/jest-dom/vitest";
import { QueryClientProvider } from "@tanstack/react-query";
import { cleanup, render, screen, within } from "@testing-library/react";
import { calculateJwkThumbprint, CompactSign, exportJWK, generateKeyPair, type JWK } from "jose";
import { MemoryRouter } from "react-router-dom";
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { canonicalJsonBytes } from "@shared/canonical-json";
import type { SummaryDto } from "@shared/schemas/review";
import { SUMMARY_JWS_TYP } from "@shared/schemas/summary";
import { inventedSummaryV1 } from "@shared/schemas/__tests__/fixtures/invented-summary-v1";
import { inventedSummary } from "@shared/schemas/__tests__/fixtures/invented-summary-v2";
import { createQueryClient } from "@/lib/query-client";
import { SummaryView } from "@/features/summaries/components/summary-view";

// Plotly is not needed to check the signature status; the plot component is replaced by a labelled box.
vi.mock("@/components/ui/plot", () => ({ Plot: ({ label }: { label: string }) => <div role="figure" aria-label={label} /> }));

let jwks: { keys: JWK[] };
let jws: string;
let jwsV1: string;

beforeAll(async () => {
  const { privateKey, publicKey } = await generateKeyPair("EdDSA", { crv: "Ed25519", extractable: true });
  const publicJwk = await exportJWK(publicKey);
  const kid = await calculateJwkThumbprint(publicJwk);
  jwks = { keys: [{ ...publicJwk, kid, alg: "EdDSA", use: "sig" }] };
  // Copied into this realm's Uint8Array: jsdom's TextEncoder returns another realm's, which jose refuses.
  const sign = (payload: unknown) =>
    new CompactSign(Uint8Array.from(canonicalJsonBytes(payload))).setProtectedHeader({ alg: "EdDSA", kid, typ: SUMMARY_JWS_TYP }).sign(privateKey);
  jws = await sign(inventedSummary());
  jwsV1 = await sign(inventedSummaryV1());
});

function dto(overrides: Partial<SummaryDto> = {}): SummaryDto {
  return {
    id: "5",
    revisionId: "41",
    studyId: "7",
    projectId: "1",
    payload: inventedSummary(),
    jws,
    kid: jwks.keys[0].kid!,
    payloadSha256: "0".repeat(64),
    verificationCode: "1c64-d3c2-72e2",
    current: true,
    currentSummary: null,
    newerUnsigned: false,
    newestRevisionNumber: 3,
    branches: [],
    branchSampling: null,
    jwksUrl: "/.well-known/jwks.json",
    verificationUrl: "https://stillspan.example.org/verify/1c64-d3c2-72e2",
    ...overrides,
  };
}

function renderView(summary: SummaryDto) {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <SummaryView summary={summary} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe("SummaryView: the signature is checked in the browser against the JWKS", () => {
  const fetchMock = vi.fn<typeof fetch>();
  beforeEach(() => {
    fetchMock.mockReset();
    fetchMock.mockImplementation(async () => new Response(JSON.stringify(jwks), { status: 200, headers: { "Content-Type": "application/json" } }));
    vi.stubGlobal("fetch", fetchMock);
  });
  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

  it("shows Verified for an untouched summary, with the key id and the verification code", async () => {
    renderView(dto());
    expect(await screen.findByText("✓ Verified", {}, { timeout: 5000 })).toBeInTheDocument();
    expect(String(fetchMock.mock.calls[0][0])).toBe("/.well-known/jwks.json");
    expect(screen.getByRole("region", { name: "Signature" })).toHaveTextContent(jwks.keys[0].kid!);
    expect(screen.getByRole("region", { name: "Signature" })).toHaveTextContent("1c64-d3c2-72e2");
    expect(screen.getByRole("region", { name: "Signature" })).toHaveTextContent("https://stillspan.example.org/verify/1c64-d3c2-72e2");
    const a = inventedSummary().assessment;
    if (!a.flutter.found) throw new Error("the fixture has flutter");
    expect(screen.getByTestId("summary-flutter")).toHaveTextContent(`${a.flutter.speedMps.toFixed(2)} m/s`);
    expect(screen.getByTestId("summary-tested-range")).toHaveTextContent("within the tested range");
  });

  it("still verifies and shows a summary signed in format 1, as signed", async () => {
    renderView(dto({ payload: inventedSummaryV1(), jws: jwsV1 }));
    expect(await screen.findByText("✓ Verified", {}, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.getByText("78.4 m/s", { selector: "p" })).toBeInTheDocument();
    expect(screen.getByText(/Signed in summary format 1/)).toBeInTheDocument();
  });

  it("shows Not verified when the numbers on the page differ from the signed ones", async () => {
    const shown = inventedSummary();
    if (shown.assessment.flutter.found) shown.assessment.flutter.speedMps = 88.412;
    renderView(dto({ payload: shown }));
    expect(await screen.findByText("✗ Not verified", {}, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.getByRole("region", { name: "Signature" })).toHaveTextContent("differ from the signed content");
  });

  it("shows Not verified when the signature itself was altered", async () => {
    const [h, p, s] = jws.split(".");
    const flipped = `${h}.${p}.${s[0] === "A" ? "B" : "A"}${s.slice(1)}`;
    renderView(dto({ jws: flipped }));
    expect(await screen.findByText("✗ Not verified", {}, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.getByRole("region", { name: "Signature" })).toHaveTextContent("does not match");
  });

  it("says so clearly when superseded, with a link to the current summary", async () => {
    renderView(dto({ current: false, currentSummary: { id: "8", revisionNumber: 4, signedAt: "2026-12-02T11:00:00Z" } }));
    const banner = screen.getByRole("alert");
    expect(banner).toHaveTextContent("Superseded");
    expect(screen.getByRole("link", { name: "Open the current summary (revision 4)" })).toHaveAttribute("href", "/summaries/8");
  });

  it("colours the flutter speed by its verdict and shows vortex shedding as a screening result, never as Fail", () => {
    renderView(dto());
    expect(screen.getByTestId("summary-flutter").className).toMatch(/steady/);
    const vortex = within(screen.getByTestId("summary-vortex")).getByText("investigate");
    expect(vortex.className).toMatch(/caution/);
    expect(vortex.className).not.toMatch(/signal/);
    const margins = screen.getByRole("region", { name: "Margins against the required speeds" });
    expect(within(margins).queryByRole("rowheader", { name: /Vortex/ })).toBeNull();
    const galloping = within(within(margins).getByRole("rowheader", { name: /Galloping onset/ }).closest("tr") as HTMLElement).getByText("not evaluated");
    expect(galloping.className).not.toMatch(/signal|caution/);
    expect(within(margins).queryByText("fail")).toBeNull();
  });

  it("writes a failing flutter speed in the failure colour", () => {
    const failing = inventedSummary();
    failing.assessment.margins!.flutter.status = "fail";
    renderView(dto({ payload: failing }));
    expect(screen.getByTestId("summary-flutter").className).toMatch(/signal/);
  });
});
