import { paths, safeRedirectTarget } from "@/config/paths";
import type { ApiErrorBody } from "@/types/api";

/** An HTTP or network failure, carrying the server's `{ error: { code, message, details } }` when there is one. */
export class ApiError extends Error {
  override readonly name = "ApiError";

  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }

  get isUnauthorized(): boolean {
    return this.status === 401;
  }
}

type JsonBody = Record<string, unknown> | unknown[];

export interface RequestOptions {
  method?: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  /** JSON, or a multipart form (file uploads; the browser sets its content type and boundary). */
  body?: JsonBody | FormData;
  signal?: AbortSignal;
  /**
   * By default a 401 means the session is gone, and the browser is sent to the sign-in page (returning here
   * afterwards). The session probe and the sign-in call itself turn this off and handle 401 as an answer.
   */
  redirectOnUnauthorized?: boolean;
}

function isApiErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== "object" || value === null || !("error" in value)) return false;
  const error = (value as { error: unknown }).error;
  return typeof error === "object" && error !== null && typeof (error as { message?: unknown }).message === "string";
}

function redirectToSignIn(): void {
  const here = `${window.location.pathname}${window.location.search}`;
  if (window.location.pathname === paths.auth.signIn.path) return;
  window.location.assign(paths.auth.signIn.getHref(safeRedirectTarget(here)));
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === "") return undefined;
  try {
    return JSON.parse(text);
  } catch {
    throw new ApiError(
      response.status,
      "bad_response",
      `The server answered ${response.status} with a body that is not JSON.`,
    );
  }
}

/** fetch with the session cookie; a network failure becomes ApiError `network_error` (an abort stays an abort). */
async function send(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, { ...init, credentials: "same-origin" });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === "AbortError") throw cause;
    throw new ApiError(0, "network_error", "Could not reach the Stillspan server. Check the connection and retry.");
  }
}

/** The typed error of a failed answer (its `{ error }` body when there is one); a 401 may send the browser to sign in. */
function failure(response: Response, payload: unknown, redirectOnUnauthorized: boolean): ApiError {
  if (response.status === 401 && redirectOnUnauthorized) redirectToSignIn();
  if (isApiErrorBody(payload)) {
    const { code, message, details } = payload.error;
    return new ApiError(response.status, code, message, details);
  }
  return new ApiError(response.status, "http_error", `The server answered ${response.status} ${response.statusText}.`);
}

/** The one way the client talks to the API: JSON in and out, the session cookie included, typed errors. */
export async function apiRequest<T>(url: string, options: RequestOptions = {}): Promise<T> {
  const { method = "GET", body, signal, redirectOnUnauthorized = true } = options;
  const headers: Record<string, string> = { Accept: "application/json" };
  const isForm = typeof FormData !== "undefined" && body instanceof FormData;
  if (body !== undefined && !isForm) headers["Content-Type"] = "application/json";
  const response = await send(url, {
    method,
    headers,
    body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
    signal,
  });
  const payload = await readJson(response);
  if (response.ok) return payload as T;
  throw failure(response, payload, redirectOnUnauthorized);
}

/** A file the server sent: its bytes and the name from Content-Disposition. */
interface DownloadedFile {
  blob: Blob;
  fileName: string | null;
}

/**
 * A request whose answer is a file (POST with a JSON body): the bytes on success, the same typed errors as
 * `apiRequest` otherwise.
 */
export async function apiFile(url: string, body: JsonBody, options: { signal?: AbortSignal } = {}): Promise<DownloadedFile> {
  const response = await send(url, {
    method: "POST",
    headers: { "Content-Type": "application/json" },
    body: JSON.stringify(body),
    signal: options.signal,
  });
  if (!response.ok) throw failure(response, await readJson(response).catch(() => undefined), true);
  const named = /filename="?([^";]+)"?/.exec(response.headers.get("Content-Disposition") ?? "");
  return { blob: await response.blob(), fileName: named ? named[1] : null };
}

export const api = {
  get: <T>(url: string, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(url, { ...options, method: "GET" }),
  post: <T>(url: string, body?: JsonBody, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(url, { ...options, method: "POST", body }),
  put: <T>(url: string, body?: JsonBody, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(url, { ...options, method: "PUT", body }),
  patch: <T>(url: string, body?: JsonBody, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(url, { ...options, method: "PATCH", body }),
  delete: <T>(url: string, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(url, { ...options, method: "DELETE" }),
  /** POST of a multipart form (file uploads). */
  upload: <T>(url: string, form: FormData, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(url, { ...options, method: "POST", body: form }),
};
