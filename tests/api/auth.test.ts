import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createSessionToken } from "../../server/services/auth.js";
import { startTestApp, type TestApp } from "../support/app.js";
import { auditActions, membershipsOf, openTestDb, projectIdByName, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, sessionCookieFrom, signIn } from "../support/http.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
afterAll(() => db.$client.end());

describe("POST /api/auth/sign-in", () => {
  it("signs the analyst in: 200 with the me body and an httpOnly SameSite=Lax session cookie", async () => {
    const res = await api(base(), "/api/auth/sign-in", {
      body: { email: "Analyst@Stillspan.test", password: "stillspan-demo" },
    });

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ email: "analyst@stillspan.test", isAdmin: false });
    // Other test files add projects of their own, so only the demo crossing's membership is certain here.
    const demoProjectId = (await projectIdByName(db, "Harrowmere Estuary Crossing (invented demo)"));
    expect(res.body.memberships).toContainEqual({ projectId: demoProjectId, role: "analyst" });
    const setCookie = res.headers.getSetCookie().find((c) => c.startsWith("stillspan_session="))!;
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    expect(setCookie).toMatch(/Max-Age=43200/);
    expect(setCookie).not.toMatch(/Secure/i); // plain HTTP on loopback
  });

  it("records the sign-in in the audit trail", async () => {
    await signIn(base(), "reviewer@stillspan.test");
    const actions = await auditActions(db, "user", await userId(db, "reviewer@stillspan.test"));
    expect(actions).toContain("auth.sign-in");
  });

  it("answers a wrong password and an unknown e-mail with the same 401 body and no cookie", async () => {
    const wrongPassword = await api(base(), "/api/auth/sign-in", {
      body: { email: "viewer@stillspan.test", password: "not-the-password" },
    });
    const unknownEmail = await api(base(), "/api/auth/sign-in", {
      body: { email: "nobody@stillspan.test", password: "stillspan-demo" },
    });

    expect(wrongPassword.status).toBe(401);
    expect(unknownEmail.status).toBe(401);
    expect(unknownEmail.body).toEqual(wrongPassword.body);
    expect(sessionCookieFrom(wrongPassword.headers)).toBeUndefined();
    expect(sessionCookieFrom(unknownEmail.headers)).toBeUndefined();
  });

  it("rejects a body without a valid e-mail with 400 naming the field", async () => {
    const res = await api(base(), "/api/auth/sign-in", { body: { email: "not-an-address", password: "x" } });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([expect.objectContaining({ path: "email" })]);
  });
});

describe("GET /api/auth/me", () => {
  it("returns the signed-in user with exactly the memberships the database holds", async () => {
    const cookie = await signIn(base(), "viewer@stillspan.test");
    const id = await userId(db, "viewer@stillspan.test");
    const res = await api(base(), "/api/auth/me", { cookie });
    expect(res.status).toBe(200);
    // Other test files may add the viewer to projects of their own: compare with what is stored right now.
    const stored = await membershipsOf(db, id);
    expect(stored).toContainEqual({ projectId: await projectIdByName(db, "Harrowmere Estuary Crossing (invented demo)"), role: "viewer" });
    expect(res.body).toEqual({
      id: String(id),
      email: "viewer@stillspan.test",
      name: expect.any(String),
      isAdmin: false,
      memberships: expect.arrayContaining(stored),
    });
    expect(res.body.memberships).toHaveLength(stored.length);
  });

  it("answers 401 without a cookie", async () => {
    const res = await api(base(), "/api/auth/me");
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("unauthorized");
  });

  it("answers 401 to a tampered cookie (payload changed to another user, signature kept)", async () => {
    const cookie = await signIn(base(), "viewer@stillspan.test");
    const [header, , signature] = cookie.split("=")[1].split(".");
    const adminId = await userId(db, "admin@stillspan.test");
    const original = JSON.parse(Buffer.from(cookie.split("=")[1].split(".")[1], "base64url").toString());
    const forgedPayload = Buffer.from(JSON.stringify({ ...original, sub: String(adminId) })).toString("base64url");

    const res = await api(base(), "/api/auth/me", { cookie: `stillspan_session=${header}.${forgedPayload}.${signature}` });
    expect(res.status).toBe(401);
  });

  it("answers 401 to a token signed with another secret", async () => {
    const token = await createSessionToken(new TextEncoder().encode("x".repeat(40)), await userId(db, "admin@stillspan.test"));
    const res = await api(base(), "/api/auth/me", { cookie: `stillspan_session=${token}` });
    expect(res.status).toBe(401);
  });

  it("answers 401 to an expired cookie (signed with the app's secret 13 h ago)", async () => {
    const id = await userId(db, "analyst@stillspan.test");
    const thirteenHoursAgo = new Date(Date.now() - 13 * 3600 * 1000);
    const expired = await createSessionToken(testEnv.sessionSecret, id, thirteenHoursAgo);
    const fresh = await createSessionToken(testEnv.sessionSecret, id);

    expect((await api(base(), "/api/auth/me", { cookie: `stillspan_session=${expired}` })).status).toBe(401);
    expect((await api(base(), "/api/auth/me", { cookie: `stillspan_session=${fresh}` })).status).toBe(200);
  });
});

describe("POST /api/auth/sign-out", () => {
  it("clears the session cookie and ends that session on the server, leaving the user's other sessions", async () => {
    const cookie = await signIn(base(), "analyst@stillspan.test");
    const otherDevice = await signIn(base(), "analyst@stillspan.test");

    const res = await api(base(), "/api/auth/sign-out", { method: "POST", cookie });

    expect(res.status).toBe(204);
    const cleared = res.headers.getSetCookie().find((c) => c.startsWith("stillspan_session="));
    expect(cleared).toMatch(/^stillspan_session=;/);
    expect(cleared).toMatch(/Expires=Thu, 01 Jan 1970/);
    // A copy of the old cookie no longer works.
    expect((await api(base(), "/api/auth/me", { cookie })).status).toBe(401);
    expect((await api(base(), "/api/auth/me", { cookie: otherDevice })).status).toBe(200);
    expect(await auditActions(db, "user", await userId(db, "analyst@stillspan.test"))).toContain("auth.sign-out");
  });

  it("answers 204 without a session", async () => {
    expect((await api(base(), "/api/auth/sign-out", { method: "POST" })).status).toBe(204);
  });
});

describe("sign-in settings of a deployment", () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp({ env: { STILLSPAN_SIGNIN_LIMIT: "2", TRUST_PROXY: "1" } });
  });
  afterAll(() => app.close());

  it("marks the cookie Secure behind a trusted HTTPS proxy", async () => {
    const res = await api(app.baseUrl, "/api/auth/sign-in", {
      body: { email: "analyst@stillspan.test", password: "stillspan-demo" },
      headers: { "X-Forwarded-Proto": "https" },
    });
    expect(res.status).toBe(200);
    expect(res.headers.getSetCookie().find((c) => c.startsWith("stillspan_session="))).toMatch(/; Secure/);
  });

  it("answers 429 after the configured number of failed attempts from one address", async () => {
    const attempt = () =>
      api(app.baseUrl, "/api/auth/sign-in", { body: { email: "viewer@stillspan.test", password: "wrong-password" } });
    expect((await attempt()).status).toBe(401);
    expect((await attempt()).status).toBe(401);
    const third = await attempt();
    expect(third.status).toBe(429);
    expect(third.body.error.code).toBe("too_many_attempts");
  });

  it("limits failed attempts per account too: a second address gets no more guesses at the same account", async () => {
    const from = (address: string, email: string, password = "wrong-password") =>
      api(app.baseUrl, "/api/auth/sign-in", { body: { email, password }, headers: { "X-Forwarded-For": address } });
    expect((await from("203.0.113.10", "reviewer@stillspan.test")).status).toBe(401);
    expect((await from("203.0.113.10", "reviewer@stillspan.test")).status).toBe(401);
    // Another address, the same account (spelt in another case): refused.
    const moved = await from("198.51.100.20", "Reviewer@Stillspan.test");
    expect(moved.status).toBe(429);
    expect(moved.body.error.code).toBe("too_many_attempts");
    // That address may still try another account, which has its own count.
    expect((await from("198.51.100.20", "analyst@stillspan.test")).status).toBe(401);
  });
});
