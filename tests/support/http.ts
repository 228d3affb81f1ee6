/** Small HTTP helpers for API tests: JSON requests with a session cookie. */
export const DEMO_PASSWORD = "stillspan-demo";

export interface ApiResponse<T = unknown> {
  status: number;
  headers: Headers;
  body: T;
}

export interface RequestOptions {
  method?: string;
  cookie?: string;
  /** A value to send as JSON, or a raw string sent as-is with a JSON content type. */
  body?: unknown;
  headers?: Record<string, string>;
}

export async function api<T = any>(baseUrl: string, path: string, options: RequestOptions = {}): Promise<ApiResponse<T>> {
  const headers: Record<string, string> = { Accept: "application/json", ...options.headers };
  if (options.cookie) headers.Cookie = options.cookie;
  let body: string | undefined;
  if (options.body !== undefined) {
    headers["Content-Type"] = "application/json";
    body = typeof options.body === "string" ? options.body : JSON.stringify(options.body);
  }
  const res = await fetch(`${baseUrl}${path}`, { method: options.method ?? (body ? "POST" : "GET"), headers, body });
  const text = await res.text();
  let parsed: unknown = text;
  if (text && (res.headers.get("content-type") ?? "").includes("application/json")) parsed = JSON.parse(text);
  return { status: res.status, headers: res.headers, body: parsed as T };
}

/** The `name=value` pair of the session cookie set by a response, or undefined. */
export function sessionCookieFrom(headers: Headers): string | undefined {
  const line = headers.getSetCookie().find((c) => c.startsWith("stillspan_session="));
  return line?.split(";")[0];
}

/** Signs in and returns the Cookie header value to send on later requests. */
export async function signIn(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await api(baseUrl, "/api/auth/sign-in", { body: { email, password } });
  const cookie = sessionCookieFrom(res.headers);
  if (res.status !== 200 || !cookie) {
    throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  }
  return cookie;
}

export interface RawResponse {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  /** The body exactly as sent (still compressed when Content-Encoding says so). */
  body: Buffer;
}

/**
 * A request without fetch's automatic decompression, to see what travels on the wire: the status, the headers and
 * the body bytes as sent. `Accept-Encoding` is whatever `headers` says (none by default).
 */
export async function rawRequest(
  baseUrl: string,
  path: string,
  options: { method?: string; cookie?: string; body?: unknown; headers?: Record<string, string> } = {},
): Promise<RawResponse> {
  const { request } = await import("node:http");
  const payload = options.body === undefined ? undefined : JSON.stringify(options.body);
  const headers: Record<string, string> = { ...options.headers };
  if (options.cookie) headers.Cookie = options.cookie;
  if (payload !== undefined) headers["Content-Type"] = "application/json";
  return new Promise((resolve, reject) => {
    const req = request(`${baseUrl}${path}`, { method: options.method ?? (payload ? "POST" : "GET"), headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on("error", reject);
    });
    req.on("error", reject);
    req.end(payload);
  });
}
