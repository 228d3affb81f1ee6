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
