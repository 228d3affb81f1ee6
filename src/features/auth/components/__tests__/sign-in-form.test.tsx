import "@testing-library/jest-dom/vitest";
import { QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { createQueryClient } from "@/lib/query-client";
import { SignInForm } from "@/features/auth/components/sign-in-form";

function renderForm() {
  const onSuccess = vi.fn();
  render(
    <QueryClientProvider client={createQueryClient()}>
      <SignInForm onSuccess={onSuccess} />
    </QueryClientProvider>,
  );
  return { onSuccess };
}

function typeInto(label: string, value: string) {
  fireEvent.change(screen.getByLabelText(label), { target: { value } });
}

function submit() {
  fireEvent.click(screen.getByRole("button", { name: "Sign in" }));
}

function jsonResponse(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { "Content-Type": "application/json" } });
}

describe("SignInForm", () => {
  const fetchMock = vi.fn<typeof fetch>();

  beforeEach(() => {
    fetchMock.mockReset();
    vi.stubGlobal("fetch", fetchMock);
  });

  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

  it("submitting empty fields shows both messages on the fields and sends nothing", async () => {
    renderForm();

    submit();

    expect(await screen.findByText("Enter your e-mail address.")).toBeInTheDocument();
    expect(screen.getByText("Enter your password.")).toBeInTheDocument();
    expect(screen.getByLabelText("E-mail")).toHaveAttribute("aria-invalid", "true");
    expect(screen.getByLabelText("E-mail")).toHaveAccessibleDescription("Enter your e-mail address.");
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it("an address without a domain is refused on the e-mail field only", async () => {
    renderForm();

    typeInto("E-mail", "analyst@");
    typeInto("Password", "stillspan-demo");
    submit();

    expect(await screen.findByText(/Enter a full e-mail address/)).toBeInTheDocument();
    expect(screen.getByLabelText("Password")).not.toHaveAttribute("aria-invalid");
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it("valid input is posted as trimmed JSON and the signed-in user is handed on", async () => {
    const me = { id: "u1", email: "analyst@stillspan.test", name: "A. Analyst", isAdmin: false, memberships: [] };
    fetchMock.mockResolvedValueOnce(jsonResponse(200, me));
    const { onSuccess } = renderForm();

    typeInto("E-mail", "  analyst@stillspan.test ");
    typeInto("Password", "stillspan-demo");
    submit();

    await waitFor(() => expect(onSuccess).toHaveBeenCalledWith(me));
    const [url, init] = fetchMock.mock.calls[0]!;
    expect(url).toBe("/api/auth/sign-in");
    expect(init?.method).toBe("POST");
    expect(JSON.parse(String(init?.body))).toEqual({ email: "analyst@stillspan.test", password: "stillspan-demo" });
  });

  it("a 401 from the server shows one message that does not say which field was wrong", async () => {
    fetchMock.mockResolvedValueOnce(
      jsonResponse(401, { error: { code: "invalid_credentials", message: "E-mail or password is not correct." } }),
    );
    const { onSuccess } = renderForm();

    typeInto("E-mail", "analyst@stillspan.test");
    typeInto("Password", "wrong-password");
    submit();

    expect(await screen.findByRole("alert")).toHaveTextContent("The e-mail address or the password is not correct.");
    expect(onSuccess).not.toHaveBeenCalled();
  });
});
