import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { api, ApiError, apiFile } from "@/lib/api-client";

function jsonResponse(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { "Content-Type": "application/json" } });
}

describe("api client", () => {
  const fetchMock = vi.fn<typeof fetch>();
  const assign = vi.fn();

  beforeEach(() => {
    fetchMock.mockReset();
    assign.mockReset();
    vi.stubGlobal("fetch", fetchMock);
    vi.stubGlobal("location", { pathname: "/projects/p-1", search: "?tab=studies", assign });
  });

  afterEach(() => {
    vi.unstubAllGlobals();
  });

  it("an error body becomes an ApiError with the server's status, code, message and details", async () => {
    fetchMock.mockResolvedValueOnce(
      jsonResponse(400, { error: { code: "invalid_body", message: "width: must be positive", details: [{ path: "width" }] } }),
    );

    const failure = await api.post("/api/things", { width: -1 }).catch((error: unknown) => error);

    expect(failure).toBeInstanceOf(ApiError);
    expect(failure).toMatchObject({
      status: 400,
      code: "invalid_body",
      message: "width: must be positive",
      details: [{ path: "width" }],
    });
    expect(assign).not.toHaveBeenCalled();
  });

  it("a 401 sends the browser to sign-in with the current page as the way back", async () => {
    fetchMock.mockResolvedValueOnce(jsonResponse(401, { error: { code: "unauthenticated", message: "Sign in." } }));

    await expect(api.get("/api/projects")).rejects.toMatchObject({ status: 401 });

    expect(assign).toHaveBeenCalledWith(`/sign-in?redirectTo=${encodeURIComponent("/projects/p-1?tab=studies")}`);
  });

  it("a 401 with the redirect turned off is only thrown", async () => {
    fetchMock.mockResolvedValueOnce(jsonResponse(401, { error: { code: "unauthenticated", message: "Sign in." } }));

    await expect(api.get("/api/auth/me", { redirectOnUnauthorized: false })).rejects.toBeInstanceOf(ApiError);
    expect(assign).not.toHaveBeenCalled();
  });

  it("an unreachable server gives a network_error with status 0", async () => {
    fetchMock.mockRejectedValueOnce(new TypeError("Failed to fetch"));

    await expect(api.get("/api/health")).rejects.toMatchObject({ status: 0, code: "network_error" });
  });

  it("a non-JSON error page is reported with its status, not as a parse crash", async () => {
    fetchMock.mockResolvedValueOnce(new Response("<html>Bad gateway</html>", { status: 502, statusText: "Bad Gateway" }));

    await expect(api.get("/api/projects")).rejects.toMatchObject({ status: 502, code: "bad_response" });
  });

  it("a file answer gives the bytes and the name from Content-Disposition; a refusal the typed error", async () => {
    fetchMock.mockResolvedValueOnce(
      new Response("branch,speed_m_s\r\n", { status: 200, headers: { "Content-Type": "text/csv", "Content-Disposition": "attachment; filename=deck-steps.csv" } }),
    );
    const file = await apiFile("/api/sweep/steps.csv", { name: "deck" });
    expect(file.fileName).toBe("deck-steps.csv");
    expect(await file.blob.text()).toBe("branch,speed_m_s\r\n");
    expect(fetchMock).toHaveBeenCalledWith("/api/sweep/steps.csv", expect.objectContaining({ method: "POST", body: '{"name":"deck"}', credentials: "same-origin" }));

    fetchMock.mockResolvedValueOnce(jsonResponse(429, { error: { code: "busy", message: "The server is busy." } }));
    const refusal = await apiFile("/api/sweep/steps.csv", {}).catch((error: unknown) => error);
    expect(refusal).toBeInstanceOf(ApiError);
    expect((refusal as ApiError).code).toBe("busy");
  });
});
