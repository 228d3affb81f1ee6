import "@testing-library/jest-dom/vitest";
import { QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { MemoryRouter } from "react-router-dom";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { createQueryClient } from "@/lib/query-client";
import { ReviewDecisionForm } from "@/features/review/components/review-decision-form";

const HASH = "a".repeat(64);
const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { "Content-Type": "application/json" } });

function renderForm(props: { signBlocker?: string | null; onOutdated?: () => void } = {}) {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <ReviewDecisionForm
          revisionId="41"
          revisionNumber={3}
          previewSha256={HASH}
          signBlocker={props.signBlocker ?? null}
          onOutdated={props.onOutdated ?? (() => undefined)}
        />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe("ReviewDecisionForm (below the summary preview)", () => {
  const fetchMock = vi.fn<typeof fetch>();
  let signAnswer: Response;

  beforeEach(() => {
    fetchMock.mockReset();
    signAnswer = json(201, { summaryId: "9" });
    fetchMock.mockImplementation(async (input) => (String(input).endsWith("/sign") ? signAnswer : json(404, { error: { code: "not_found", message: "no" } })));
    vi.stubGlobal("fetch", fetchMock);
  });
  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

  it("asks for the statement on its field before sending, then signs with the statement and the preview's hash", async () => {
    renderForm();
    fireEvent.click(screen.getByRole("button", { name: "Sign the summary" }));
    const statementField = screen.getByLabelText("Reviewer's statement");
    await waitFor(() => expect(statementField).toHaveAccessibleDescription(/Write your statement before signing/));
    expect(statementField).toHaveAttribute("aria-invalid", "true");
    expect(statementField).toHaveFocus();
    expect(fetchMock).not.toHaveBeenCalled();

    fireEvent.change(statementField, { target: { value: "Checked: stable with margin." } });
    fireEvent.click(screen.getByRole("button", { name: "Sign the summary" }));
    expect(await screen.findByRole("link", { name: "Open the signed summary" })).toHaveAttribute("href", "/summaries/9");
    const [, init] = fetchMock.mock.calls.find(([url]) => String(url).endsWith("/sign"))!;
    expect(JSON.parse(String(init!.body))).toEqual({ statement: "Checked: stable with margin.", previewSha256: HASH });
  });

  it("disables signing and says why while something blocks it; returning stays possible", () => {
    renderForm({ signBlocker: "In version 1 of the project's criteria, flutter still has the default basis text." });
    expect(screen.getByRole("button", { name: "Sign the summary" })).toBeDisabled();
    expect(screen.getByTestId("sign-blocker")).toHaveTextContent("flutter still has the default basis text");
    expect(screen.getByRole("button", { name: "Return with comments" })).toBeEnabled();
  });

  it("shows the server's refusal of an outdated preview and asks the page to load the new one", async () => {
    const onOutdated = vi.fn();
    signAnswer = json(409, { error: { code: "preview_outdated", message: "The summary differs from the preview you read." } });
    renderForm({ onOutdated });
    fireEvent.change(screen.getByLabelText("Reviewer's statement"), { target: { value: "Fine." } });
    fireEvent.click(screen.getByRole("button", { name: "Sign the summary" }));
    expect(await screen.findByRole("alert")).toHaveTextContent("The summary differs from the preview you read.");
    expect(onOutdated).toHaveBeenCalledTimes(1);
  });
});
