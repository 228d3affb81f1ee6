/**
 * Cross-site request forgery: every API route that changes something refuses a request a browser marks as coming
 * from another site (foreign `Origin`, or `Sec-Fetch-Site: cross-site`) with 403 `cross_origin`, before it reads
 * the body or the session; requests from the app's own pages, and scripts that send no Origin, pass.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, type TestApp } from "../support/app.js";
import { createProjectWithMembers, openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";
import { appRoutes } from "../support/routes.js";
import { createAlternativeAndStudy, flutterMeta, lastAuditId, readFixture, rowCounts, upload } from "../support/workspace.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
let admin: string;
let analyst: string;
let made: { alternativeId: string; studyId: string; revision1Id: string };
afterAll(() => db.$client.end());

beforeAll(async () => {
  admin = await signIn(base(), "admin@stillspan.test");
  analyst = await signIn(base(), "analyst@stillspan.test");
  const projectId = await createProjectWithMembers(db, `Same-origin test ${Date.now().toString(36)}`, { "analyst@stillspan.test": "analyst" });
  made = await createAlternativeAndStudy(base(), analyst, projectId);
});

/** The app's write routes with their parameters filled in with real ids where the route has them. */
function writeRoutes() {
  const fill = (path: string) =>
    path
      .replace(":alternativeId", made.alternativeId)
      .replace(/\/alternatives\/:id/, `/alternatives/${made.alternativeId}`)
      .replace(/\/studies\/:id/, `/studies/${made.studyId}`)
      .replace(/\/revisions\/:id/, `/revisions/${made.revision1Id}`)
      .replace(/:[A-Za-z]+/g, "1");
  return appRoutes()
    .filter((r) => r.path.startsWith("/api/") && !["GET", "HEAD", "OPTIONS"].includes(r.method))
    .map((r) => ({ name: `${r.method} ${r.path}`, method: r.method, url: fill(r.path) }));
}

describe("writes from another site", () => {
  it("lists the app's write routes (the router is read, so a new route is covered without editing this test)", () => {
    const names = writeRoutes().map((r) => r.name);
    expect(names.length).toBeGreaterThan(30);
    expect(names).toEqual(expect.arrayContaining(["POST /api/revisions/:id/rerun", "POST /api/alternatives/:alternativeId/datasets", "POST /api/auth/sign-in"]));
  });

  it("answers 403 cross_origin on every write route to a foreign Origin and to Sec-Fetch-Site: cross-site, and stores nothing", async () => {
    const before = { counts: await rowCounts(db), audit: await lastAuditId(db) };
    const answers: string[] = [];
    for (const route of writeRoutes()) {
      const variants: Record<string, string>[] = [{ Origin: "https://attacker.example" }, { "Sec-Fetch-Site": "cross-site" }, { Origin: "null" }];
      for (const headers of variants) {
        const res = await api(base(), route.url, { method: route.method, cookie: admin, headers, body: {} });
        if (res.status !== 403 || (res.body as { error?: { code?: string } }).error?.code !== "cross_origin") {
          answers.push(`${route.name} with ${JSON.stringify(headers)} → ${res.status} ${JSON.stringify(res.body).slice(0, 80)}`);
        }
      }
    }
    expect(answers, "write routes that did not refuse a cross-site request").toEqual([]);
    expect(await rowCounts(db)).toEqual(before.counts);
    expect(await lastAuditId(db)).toBe(before.audit);
  });

  it("refuses a real multipart upload and a re-run sent with a foreign Origin, naming the origin", async () => {
    const counts = await rowCounts(db);
    const uploaded = await upload(base(), `/api/alternatives/${made.alternativeId}/datasets`, {
      cookie: analyst,
      field: "file",
      file: { name: "d.csv", bytes: readFixture("uploads/flutter-derivatives.csv"), type: "text/csv" },
      fields: { meta: flutterMeta() },
      headers: { Origin: "https://attacker.example" },
    });
    expect(uploaded.status).toBe(403);
    expect(uploaded.body.error.message).toContain("Origin https://attacker.example");
    const rerun = await api(base(), `/api/revisions/${made.revision1Id}/rerun`, {
      cookie: analyst,
      headers: { Origin: "https://attacker.example" },
      body: { parentRevision: 1 },
    });
    expect(rerun.status).toBe(403);
    expect(await rowCounts(db)).toEqual(counts);
  });

  it("refuses a foreign write to a path that does not exist with 403 too (the check comes before routing)", async () => {
    const res = await api(base(), "/api/no-such-route", { method: "POST", headers: { Origin: "https://attacker.example" }, body: {} });
    expect(res.status).toBe(403);
  });
});

describe("writes from the app's own pages and from scripts", () => {
  const signInBody = { email: "viewer@stillspan.test", password: "stillspan-demo" };

  it("accepts the app's own Origin (the Host it was addressed to), with or without Sec-Fetch-Site: same-origin", async () => {
    const own = await api(base(), "/api/auth/sign-in", { body: signInBody, headers: { Origin: base() } });
    expect(own.status).toBe(200);
    const fetchMeta = await api(base(), "/api/auth/sign-in", { body: signInBody, headers: { Origin: base(), "Sec-Fetch-Site": "same-origin" } });
    expect(fetchMeta.status).toBe(200);
  });

  it("accepts a request without Origin (curl, scripts), and reads with any Origin", async () => {
    expect((await api(base(), "/api/auth/sign-in", { body: signInBody })).status).toBe(200);
    expect((await api(base(), "/api/health", { headers: { Origin: "https://attacker.example" } })).status).toBe(200);
  });

  describe("behind a proxy with STILLSPAN_PUBLIC_URL", () => {
    let app: TestApp;
    beforeAll(async () => {
      app = await startTestApp({ env: { STILLSPAN_PUBLIC_URL: "https://stillspan.example.org/" } });
    });
    afterAll(() => app.close());

    it("accepts the configured public origin although the Host differs, and refuses its other ports and schemes", async () => {
      const from = (origin: string) => api(app.baseUrl, "/api/auth/sign-in", { body: signInBody, headers: { Origin: origin } });
      expect((await from("https://stillspan.example.org")).status).toBe(200);
      expect((await from("https://stillspan.example.org:8443")).status).toBe(403);
      expect((await from("http://stillspan.example.org")).status).toBe(403);
      expect((await from("https://evil.stillspan.example.org")).status).toBe(403);
    });
  });
});
