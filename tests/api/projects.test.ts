import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditActions, createProjectWithMembers, openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";

const DEMO_NAME = "Harrowmere Estuary Crossing (invented demo)";
const base = () => testEnv.baseUrl;
const db = openTestDb();
let projectId: number;
let otherProjectId: number;
let cookies: Record<"admin" | "analyst" | "reviewer" | "viewer", string>;

beforeAll(async () => {
  const suffix = Date.now().toString(36);
  projectId = await createProjectWithMembers(db, `API test crossing ${suffix}`, {
    "analyst@stillspan.test": "analyst",
    "viewer@stillspan.test": "viewer",
  });
  otherProjectId = await createProjectWithMembers(db, `API test crossing without the viewer ${suffix}`, {
    "analyst@stillspan.test": "analyst",
  });
  const [admin, analyst, reviewer, viewer] = await Promise.all(
    ["admin", "analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)),
  );
  cookies = { admin, analyst, reviewer, viewer };
});
afterAll(() => db.$client.end());

describe("GET /api/projects", () => {
  it("lists the viewer's projects with their role, and not the others", async () => {
    const res = await api(base(), "/api/projects", { cookie: cookies.viewer });
    expect(res.status).toBe(200);
    const byId = new Map(res.body.map((p: { id: string }) => [p.id, p]));
    expect(byId.get(String(projectId))).toMatchObject({ role: "viewer", description: "Created by an API test." });
    expect(byId.has(String(otherProjectId))).toBe(false);
    expect(res.body.find((p: { name: string }) => p.name === DEMO_NAME)).toMatchObject({ role: "viewer" });
  });

  it("lists every project to the administrator, with role null where not a member", async () => {
    const res = await api(base(), "/api/projects", { cookie: cookies.admin });
    const ids = res.body.map((p: { id: string }) => p.id);
    expect(ids).toEqual(expect.arrayContaining([String(projectId), String(otherProjectId)]));
    expect(res.body.find((p: { id: string }) => p.id === String(projectId)).role).toBeNull();
  });

  it("answers 401 without a session", async () => {
    expect((await api(base(), "/api/projects")).status).toBe(401);
  });
});

describe("GET /api/projects/:id", () => {
  it("shows a project to its member", async () => {
    const res = await api(base(), `/api/projects/${projectId}`, { cookie: cookies.viewer });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: String(projectId), role: "viewer" });
  });

  it("answers 403 to a signed-in user who is not a member", async () => {
    const res = await api(base(), `/api/projects/${otherProjectId}`, { cookie: cookies.viewer });
    expect(res.status).toBe(403);
  });

  it("answers 404 for a project that does not exist, and for an id that is not a number", async () => {
    expect((await api(base(), "/api/projects/987654321", { cookie: cookies.analyst })).status).toBe(404);
    expect((await api(base(), "/api/projects/abc", { cookie: cookies.analyst })).status).toBe(404);
  });
});

describe("PATCH /api/projects/:id (guarded for analysts)", () => {
  it("answers 403 to the viewer and leaves the project unchanged", async () => {
    const res = await api(base(), `/api/projects/${projectId}`, {
      method: "PATCH",
      cookie: cookies.viewer,
      body: { siteNotes: "Viewer edit" },
    });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("forbidden");
    const after = await api(base(), `/api/projects/${projectId}`, { cookie: cookies.viewer });
    expect(after.body.siteNotes).toBe("");
  });

  it("lets the analyst edit the site notes and records it in the audit trail", async () => {
    const res = await api(base(), `/api/projects/${projectId}`, {
      method: "PATCH",
      cookie: cookies.analyst,
      body: { siteNotes: "Deck 55 m above water (test)." },
    });
    expect(res.status).toBe(200);
    expect(res.body.siteNotes).toBe("Deck 55 m above water (test).");
    expect(await auditActions(db, "project", projectId)).toContain("project.update");
  });

  it("rejects invalid fields with 400 listing each path and rule", async () => {
    const res = await api(base(), `/api/projects/${projectId}`, {
      method: "PATCH",
      cookie: cookies.analyst,
      body: { name: "", description: 42 },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_input");
    const paths = res.body.error.details.map((d: { path: string }) => d.path).sort();
    expect(paths).toEqual(["description", "name"]);
    expect(res.body.error.details.every((d: { rule: string }) => typeof d.rule === "string")).toBe(true);
  });
});

describe("GET /api/projects/:id/members", () => {
  it("lists the members and their roles to a member", async () => {
    const res = await api(base(), `/api/projects/${projectId}/members`, { cookie: cookies.viewer });
    expect(res.status).toBe(200);
    expect(res.body.map((m: { email: string; role: string }) => `${m.email}:${m.role}`).sort()).toEqual([
      "analyst@stillspan.test:analyst",
      "viewer@stillspan.test:viewer",
    ]);
  });
});
