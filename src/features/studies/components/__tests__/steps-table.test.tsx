import "@testing-library/jest-dom/vitest";
import { QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { benchmarkDeck } from "@shared/engine/__tests__/support/benchmark-deck";
import { runSweep } from "@shared/engine/run-sweep";
import type { SweepResult } from "@shared/schemas/result";
import type { StudyDocument } from "@shared/schemas/study";
import { createQueryClient } from "@/lib/query-client";
import { StepsTable, type StepsSource } from "@/features/studies/components/steps-table";

/** The benchmark deck's inputs on a short sweep; only the table's plumbing is checked. */
const study: StudyDocument = benchmarkDeck({ from: 60, to: 90, step: 2 });
const full = runSweep(study);

function renderTable(result: SweepResult, source: StepsSource) {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <StepsTable result={result} source={source} />
    </QueryClientProvider>,
  );
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe("StepsTable", () => {
  it("says how many of the solved steps a thinned result shows, and links a stored revision's full table", () => {
    const thinned = { ...full, sampling: { solvedSteps: 41_000, shownSteps: 16, maxShownSteps: 2000 } };
    renderTable(thinned, { revisionId: "41" });
    expect(screen.getByTestId("steps-count")).toHaveTextContent("32 of 82,000 solved steps shown: each branch thinned to 16 speeds");
    expect(screen.getByRole("link", { name: "CSV" })).toHaveAttribute("href", "/api/revisions/41/steps.csv");
    expect(screen.getByRole("link", { name: "JSON" })).toHaveAttribute("href", "/api/revisions/41/steps.json");
  });

  it("counts the steps of a whole result plainly", () => {
    renderTable({ ...full, sampling: { solvedSteps: 16, shownSteps: 16, maxShownSteps: 2000 } }, { revisionId: "41" });
    expect(screen.getByTestId("steps-count")).toHaveTextContent("32 steps over 2 branches");
  });

  it("asks the server for an unsaved run's full table with the document, and shows a refusal", async () => {
    const fetch = vi.fn().mockResolvedValue(
      new Response(JSON.stringify({ error: { code: "busy", message: "The server is busy: try again in about 3 s." } }), {
        status: 429,
        headers: { "Content-Type": "application/json", "Retry-After": "3" },
      }),
    );
    vi.stubGlobal("fetch", fetch);
    renderTable(full, { document: study });
    fireEvent.click(screen.getByRole("button", { name: "CSV" }));
    await waitFor(() => expect(screen.getByRole("alert")).toHaveTextContent("The server is busy"));
    expect(fetch).toHaveBeenCalledWith("/api/sweep/steps.csv", expect.objectContaining({ method: "POST", body: JSON.stringify(study) }));
  });
});
