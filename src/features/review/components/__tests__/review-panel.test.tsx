import "@testing-library/jest-dom/vitest";
import { QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { MemoryRouter } from "react-router-dom";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { RevisionReviewDto } from "@shared/schemas/review";
import { createQueryClient } from "@/lib/query-client";
import { ReviewPanel, type ReviewPanelProps } from "@/features/review/components/review-panel";

const ANALYST = { id: "2", name: "Tomas Reedwell" };
const REVIEWER = { id: "3", name: "Mira Holloway" };
const SECOND_REVIEWER = { id: "5", name: "Ines Calloway" };
const ADMIN = { id: "1", name: "Ada Lindqvist" };

function review(overrides: Partial<RevisionReviewDto> = {}): RevisionReviewDto {
  return {
    revisionId: "41",
    revisionNumber: 3,
    latestNumber: 3,
    studyId: "7",
    projectId: "1",
    author: ANALYST,
    state: "draft",
    request: null,
    comments: [],
    events: [],
    signature: null,
    ...overrides,
  };
}

const members = [
  { userId: ANALYST.id, name: ANALYST.name, email: "analyst@stillspan.test", role: "analyst" },
  { userId: REVIEWER.id, name: REVIEWER.name, email: "reviewer@stillspan.test", role: "reviewer" },
  { userId: "4", name: "Owen Farrant", email: "viewer@stillspan.test", role: "viewer" },
  { userId: SECOND_REVIEWER.id, name: SECOND_REVIEWER.name, email: "second@stillspan.test", role: "reviewer" },
];

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { "Content-Type": "application/json" } });

function renderPanel(props: Partial<ReviewPanelProps> = {}) {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <ReviewPanel revisionId="41" projectId="1" userId={ANALYST.id} role="analyst" {...props} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe("ReviewPanel", () => {
  const fetchMock = vi.fn<typeof fetch>();
  let current: RevisionReviewDto;

  beforeEach(() => {
    current = review();
    fetchMock.mockReset();
    fetchMock.mockImplementation(async (input, init) => {
      const url = String(input);
      if (url.endsWith("/members")) return json(200, members);
      if (url.endsWith("/review")) return json(200, current);
      if (url.endsWith("/submit") && init?.method === "POST") {
        const body = JSON.parse(String(init.body));
        current = review({
          state: "in-review",
          request: { reviewer: REVIEWER, requestedBy: ANALYST, note: body.note, submittedAt: "2026-12-02T09:00:00Z", decidedAt: null },
        });
        return json(200, current);
      }
      if (url.endsWith("/reviewer") && init?.method === "POST") {
        const body = JSON.parse(String(init.body));
        const reviewer = [REVIEWER, SECOND_REVIEWER].find((r) => r.id === body.reviewerId)!;
        current = review({ ...current, request: { ...current.request!, reviewer } });
        return json(200, current);
      }
      return json(404, { error: { code: "not_found", message: `unexpected ${url}` } });
    });
    vi.stubGlobal("fetch", fetchMock);
  });
  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

  it("lets the analyst submit a draft to a reviewer of the project, then shows it in review", async () => {
    renderPanel();
    expect(await screen.findByText("Draft")).toBeInTheDocument();
    const select = await screen.findByLabelText("Reviewer");
    await waitFor(() => expect(select).toHaveValue(REVIEWER.id));
    // Only reviewers are offered: not the analyst, not the viewer.
    expect(Array.from((select as HTMLSelectElement).options).map((o) => o.textContent)).toEqual([REVIEWER.name, SECOND_REVIEWER.name]);
    fireEvent.change(screen.getByLabelText("Note to the reviewer (optional)"), { target: { value: "Margins please." } });
    fireEvent.click(screen.getByRole("button", { name: "Submit for review" }));

    expect(await screen.findByText("In review")).toBeInTheDocument();
    const submit = fetchMock.mock.calls.find(([url]) => String(url).endsWith("/submit"))!;
    expect(JSON.parse(String(submit[1]!.body))).toEqual({ reviewerId: REVIEWER.id, note: "Margins please." });
    expect(screen.queryByRole("button", { name: "Submit for review" })).not.toBeInTheDocument();
    expect(screen.queryByRole("button", { name: "Sign the summary" })).not.toBeInTheDocument();
  });

  it("sends the assigned reviewer to the summary preview to sign or return, and shows the comments", async () => {
    current = review({
      state: "in-review",
      request: { reviewer: REVIEWER, requestedBy: ANALYST, note: "", submittedAt: "2026-12-02T09:00:00Z", decidedAt: null },
      comments: [{ id: "1", author: { ...REVIEWER, role: "reviewer" }, body: "State the tested range.", createdAt: "2026-12-02T10:00:00Z" }],
    });
    renderPanel({ userId: REVIEWER.id, role: "reviewer" });
    expect(await screen.findByText("State the tested range.")).toBeInTheDocument();
    // Signing happens after reading the summary as it will be signed, never from this panel.
    expect(screen.getByRole("link", { name: "Read the summary to sign or return" })).toHaveAttribute("href", "/reviews/41/summary");
    expect(screen.queryByRole("button", { name: "Sign the summary" })).not.toBeInTheDocument();
    expect(screen.queryByRole("button", { name: "Submit for review" })).not.toBeInTheDocument();
  });

  it("offers no resubmission of a returned revision that a newer revision supersedes, and says which to submit", async () => {
    current = review({
      state: "returned",
      latestNumber: 5,
      request: { reviewer: REVIEWER, requestedBy: ANALYST, note: "", submittedAt: "2026-12-02T09:00:00Z", decidedAt: "2026-12-03T09:00:00Z" },
    });
    renderPanel();
    expect(await screen.findByText(/revision 5 supersedes it: revision 3 is not submitted again/)).toBeInTheDocument();
    expect(screen.queryByRole("button", { name: /Submit/ })).not.toBeInTheDocument();
    cleanup();

    current = review({ ...current, latestNumber: 3 });
    renderPanel();
    expect(await screen.findByRole("button", { name: "Submit again for review" })).toBeInTheDocument();
  });

  it("gives a reviewer of the project who is not the assigned one no sign or return, and says who decides", async () => {
    current = review({
      state: "in-review",
      request: { reviewer: REVIEWER, requestedBy: ANALYST, note: "", submittedAt: "2026-12-02T09:00:00Z", decidedAt: null },
    });
    renderPanel({ userId: SECOND_REVIEWER.id, role: "reviewer" });
    expect(await screen.findByText(/assigned to Mira Holloway: only they can sign or return it/)).toBeInTheDocument();
    expect(screen.queryByRole("button", { name: "Sign the summary" })).not.toBeInTheDocument();
    expect(screen.queryByRole("button", { name: "Return with comments" })).not.toBeInTheDocument();
    expect(screen.queryByRole("link", { name: "Read the summary to sign or return" })).not.toBeInTheDocument();
    expect(screen.queryByRole("button", { name: "Reassign the review" })).not.toBeInTheDocument();
    // Comments stay open to them.
    expect(screen.getByLabelText("Add a comment")).toBeInTheDocument();
  });

  it("lets an administrator reassign a revision in review to another reviewer (not the author, not the current one)", async () => {
    current = review({
      state: "in-review",
      request: { reviewer: REVIEWER, requestedBy: ANALYST, note: "", submittedAt: "2026-12-02T09:00:00Z", decidedAt: null },
    });
    renderPanel({ userId: ADMIN.id, role: null, isAdmin: true });
    const select = await screen.findByLabelText("New reviewer");
    await waitFor(() => expect(select).toHaveValue(SECOND_REVIEWER.id));
    expect(Array.from((select as HTMLSelectElement).options).map((o) => o.textContent)).toEqual([SECOND_REVIEWER.name]);
    fireEvent.click(screen.getByRole("button", { name: "Reassign the review" }));
    expect(await screen.findByText(/Reviewer: Ines Calloway/)).toBeInTheDocument();
    const call = fetchMock.mock.calls.find(([url]) => String(url).endsWith("/reviewer"))!;
    expect(JSON.parse(String(call[1]!.body))).toEqual({ reviewerId: SECOND_REVIEWER.id });
    expect(screen.queryByRole("button", { name: "Sign the summary" })).not.toBeInTheDocument();
  });

  it("gives the author no sign button even when they hold the reviewer role, and a signed revision no actions", async () => {
    current = review({
      state: "in-review",
      request: { reviewer: REVIEWER, requestedBy: ANALYST, note: "", submittedAt: "2026-12-02T09:00:00Z", decidedAt: null },
    });
    renderPanel({ userId: ANALYST.id, role: "reviewer" });
    expect(await screen.findByText("In review")).toBeInTheDocument();
    expect(screen.queryByRole("link", { name: "Read the summary to sign or return" })).not.toBeInTheDocument();
    cleanup();

    current = review({
      state: "signed",
      signature: { summaryId: "9", signer: REVIEWER, signedAt: "2026-12-02T11:00:00Z", kid: "k", verificationCode: "1c64-d3c2-72e2" },
    });
    renderPanel();
    expect(await screen.findByRole("link", { name: "Signed summary" })).toHaveAttribute("href", "/summaries/9");
    expect(screen.getByText("1c64-d3c2-72e2")).toBeInTheDocument();
    expect(screen.queryByRole("button", { name: /Submit|Sign the summary/ })).not.toBeInTheDocument();
  });
});
