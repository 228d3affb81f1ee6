/**
 * Administration API: projects (create, delete), memberships (add, change, remove) and accounts (list, edit).
 * Every route gets the full role matrix — the administrator succeeds; the project's analyst, reviewer and viewer
 * and an anonymous caller are refused — and every write leaves exactly one audit event naming its actor.
 */
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { insertUser } from "../../server/db/queries/users.js";
import { alternatives, studies } from "../../server/db/schema/index.js";
import { createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";

type Caller = "admin" | "analyst" | "reviewer" | "viewer" | "anonymous";
const base = () => testEnv.baseUrl;
const db = openTestDb();
const suffix = `${Date.now().toString(36)}-${process.pid}`;
const cookies: Partial<Record<Caller, string>> = {};
let adminId: number;

/** The rows a refused caller must get: the project's three roles (403) and no session at all (401). */
const REFUSED: { caller: Caller; status: number }[] = [
  { caller: "analyst", status: 403 },
  { caller: "reviewer", status: 403 },
  { caller: "viewer", status: 403 },
  { caller: "anonymous", status: 401 },
];

interface AuditRow {
  action: string;
  actorId: number | null;
  details: Record<string, unknown>;
}

async function auditRows(objectType: string, objectId: string | number): Promise<AuditRow[]> {
  const { rows } = await db.execute<{ action: string; actor_id: number | null; details: Record<string, unknown> }>(
    sql`select action, actor_id, details from audit_events
        where object_type = ${objectType} and object_id = ${String(objectId)} order by id`,
  );
  return rows.map((r) => ({ action: r.action, actorId: r.actor_id, details: r.details }));
}

/** A project where the three demo members hold the three roles, so each role is refused as a member. */
function projectWithAllRoles(label: string): Promise<number> {
  return createProjectWithMembers(db, `Admin test ${label} ${suffix}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
  });
}

/** A throw-away account (never a demo account: other test files rely on those). */
async function scratchUser(label: string): Promise<number> {
  const user = await insertUser(db, {
    email: `admin-test-${label}-${suffix}@stillspan.test`,
    name: `Scratch ${label}`,
    passwordHash: "not-a-usable-hash",
  });
  return user.id;
}

beforeAll(async () => {
  const [admin, analyst, reviewer, viewer] = await Promise.all(
    ["admin", "analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)),
  );
  Object.assign(cookies, { admin, analyst, reviewer, viewer });
  adminId = await userId(db, "admin@stillspan.test");
});
afterAll(() => db.$client.end());

describe("POST /api/projects", () => {
  it.each(REFUSED)("refuses the $caller with $status and creates nothing", async ({ caller, status }) => {
    const name = `Refused create by ${caller} ${suffix}`;
    const res = await api(base(), "/api/projects", { cookie: cookies[caller], body: { name } });
    expect(res.status).toBe(status);
    const { rows } = await db.execute(sql`select 1 from projects where name = ${name}`);
    expect(rows).toHaveLength(0);
  });

  it("lets the administrator create a project (201), with no members and one audit event", async () => {
    const res = await api(base(), "/api/projects", {
      cookie: cookies.admin,
      body: { name: `  Created crossing ${suffix}  `, description: "Cable-stayed option study." },
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      name: `Created crossing ${suffix}`,
      description: "Cable-stayed option study.",
      siteNotes: "",
      role: null,
    });
    expect(res.body.id).toMatch(/^\d+$/);
    const members = await api(base(), `/api/projects/${res.body.id}/members`, { cookie: cookies.admin });
    expect(members.body).toEqual([]);
    const audit = await auditRows("project", res.body.id);
    expect(audit).toEqual([{ action: "project.create", actorId: adminId, details: { name: `Created crossing ${suffix}` } }]);
  });

  it("rejects a blank name and unknown fields with 400 naming each field", async () => {
    const res = await api(base(), "/api/projects", { cookie: cookies.admin, body: { name: " ", colour: "red" } });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_input");
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(["(body)", "name"]);
  });
});

describe("DELETE /api/projects/:id", () => {
  let emptyProjectId: number;
  beforeAll(async () => {
    emptyProjectId = await projectWithAllRoles("empty");
  });

  it.each(REFUSED)("refuses the $caller with $status and keeps the project", async ({ caller, status }) => {
    const res = await api(base(), `/api/projects/${emptyProjectId}`, { method: "DELETE", cookie: cookies[caller] });
    expect(res.status).toBe(status);
    const { rows } = await db.execute(sql`select 1 from projects where id = ${emptyProjectId}`);
    expect(rows).toHaveLength(1);
  });

  it("lets the administrator delete a project with no work in it (204), memberships included, audited", async () => {
    const res = await api(base(), `/api/projects/${emptyProjectId}`, { method: "DELETE", cookie: cookies.admin });
    expect(res.status).toBe(204);
    const { rows } = await db.execute(sql`select 1 from memberships where project_id = ${emptyProjectId}`);
    expect(rows).toHaveLength(0);
    expect((await api(base(), `/api/projects/${emptyProjectId}`, { cookie: cookies.admin })).status).toBe(404);
    const audit = await auditRows("project", emptyProjectId);
    expect(audit.map((a) => [a.action, a.actorId])).toEqual([["project.delete", adminId]]);
  });

  it("refuses with 409 to delete a project that has an alternative and a study, and deletes nothing", async () => {
    const projectId = await projectWithAllRoles("with work");
    const [alternative] = await db
      .insert(alternatives)
      .values({ projectId, name: "Box girder A", deckWidthM: 31, deckDepthM: 3.2 })
      .returning({ id: alternatives.id });
    await db.insert(studies).values({ alternativeId: alternative.id, name: "Smooth flow, 0°" });

    const res = await api(base(), `/api/projects/${projectId}`, { method: "DELETE", cookie: cookies.admin });

    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("conflict");
    expect(res.body.error.details).toEqual({ alternatives: 1, studies: 1, datasets: 0 });
    expect(res.body.error.message).toMatch(/holds 1 deck alternative, 1 study and 0 data sets/);
    const { rows } = await db.execute(sql`select 1 from memberships where project_id = ${projectId}`);
    expect(rows).toHaveLength(3);
    expect(await auditRows("project", projectId)).toEqual([]);
  });

  it("answers 404 to the administrator for a project that does not exist", async () => {
    const res = await api(base(), "/api/projects/987654321", { method: "DELETE", cookie: cookies.admin });
    expect(res.status).toBe(404);
  });
});

describe("PUT /api/projects/:id/members/:userId", () => {
  let projectId: number;
  let newcomerId: number;
  beforeAll(async () => {
    projectId = await projectWithAllRoles("membership put");
    newcomerId = await scratchUser("put");
  });

  it.each(REFUSED)("refuses the $caller with $status and adds no one", async ({ caller, status }) => {
    const res = await api(base(), `/api/projects/${projectId}/members/${newcomerId}`, {
      method: "PUT",
      cookie: cookies[caller],
      body: { role: "analyst" },
    });
    expect(res.status).toBe(status);
    const { rows } = await db.execute(sql`select 1 from memberships where user_id = ${newcomerId}`);
    expect(rows).toHaveLength(0);
  });

  it("lets the administrator add a member (201) and then change the role (200), one audit event each", async () => {
    const added = await api(base(), `/api/projects/${projectId}/members/${newcomerId}`, {
      method: "PUT",
      cookie: cookies.admin,
      body: { role: "viewer" },
    });
    expect(added.status).toBe(201);
    expect(added.body).toMatchObject({ userId: String(newcomerId), name: "Scratch put", role: "viewer" });

    const changed = await api(base(), `/api/projects/${projectId}/members/${newcomerId}`, {
      method: "PUT",
      cookie: cookies.admin,
      body: { role: "reviewer" },
    });
    expect(changed.status).toBe(200);
    expect(changed.body.role).toBe("reviewer");

    const audit = await auditRows("project", projectId);
    expect(audit).toEqual([
      { action: "membership.set", actorId: adminId, details: { userId: String(newcomerId), role: "viewer", previousRole: null } },
      { action: "membership.set", actorId: adminId, details: { userId: String(newcomerId), role: "reviewer", previousRole: "viewer" } },
    ]);
  });

  it("setting the role a member already has changes nothing and records nothing", async () => {
    const before = (await auditRows("project", projectId)).length;
    const res = await api(base(), `/api/projects/${projectId}/members/${newcomerId}`, {
      method: "PUT",
      cookie: cookies.admin,
      body: { role: "reviewer" },
    });
    expect(res.status).toBe(200);
    expect((await auditRows("project", projectId)).length).toBe(before);
  });

  it("rejects an unknown role with 400, and an unknown user or project with 404", async () => {
    const badRole = await api(base(), `/api/projects/${projectId}/members/${newcomerId}`, {
      method: "PUT",
      cookie: cookies.admin,
      body: { role: "owner" },
    });
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.details[0].path).toBe("role");
    const noUser = await api(base(), `/api/projects/${projectId}/members/987654321`, {
      method: "PUT",
      cookie: cookies.admin,
      body: { role: "viewer" },
    });
    expect(noUser.status).toBe(404);
    expect(noUser.body.error.message).toBe("User not found.");
    const noProject = await api(base(), `/api/projects/987654321/members/${newcomerId}`, {
      method: "PUT",
      cookie: cookies.admin,
      body: { role: "viewer" },
    });
    expect(noProject.status).toBe(404);
    expect(noProject.body.error.message).toBe("Project not found.");
  });
});

describe("DELETE /api/projects/:id/members/:userId", () => {
  let projectId: number;
  let memberId: number;
  beforeAll(async () => {
    projectId = await projectWithAllRoles("membership delete");
    memberId = await scratchUser("delete");
    await db.execute(sql`insert into memberships (user_id, project_id, role) values (${memberId}, ${projectId}, 'analyst')`);
  });

  it.each(REFUSED)("refuses the $caller with $status and keeps the member", async ({ caller, status }) => {
    const res = await api(base(), `/api/projects/${projectId}/members/${memberId}`, {
      method: "DELETE",
      cookie: cookies[caller],
    });
    expect(res.status).toBe(status);
    const { rows } = await db.execute(sql`select 1 from memberships where user_id = ${memberId}`);
    expect(rows).toHaveLength(1);
  });

  it("lets the administrator remove the member (204), audited with the role they had", async () => {
    const res = await api(base(), `/api/projects/${projectId}/members/${memberId}`, {
      method: "DELETE",
      cookie: cookies.admin,
    });
    expect(res.status).toBe(204);
    const members = await api(base(), `/api/projects/${projectId}/members`, { cookie: cookies.admin });
    expect(members.body.map((m: { userId: string }) => m.userId)).not.toContain(String(memberId));
    expect(await auditRows("project", projectId)).toEqual([
      { action: "membership.remove", actorId: adminId, details: { userId: String(memberId), previousRole: "analyst" } },
    ]);
  });

  it("answers 404 when the user is not a member", async () => {
    const res = await api(base(), `/api/projects/${projectId}/members/${memberId}`, {
      method: "DELETE",
      cookie: cookies.admin,
    });
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe("Membership not found.");
  });
});

describe("GET /api/users", () => {
  it.each(REFUSED)("refuses the $caller with $status", async ({ caller, status }) => {
    const res = await api(base(), "/api/users", { cookie: cookies[caller] });
    expect(res.status).toBe(status);
    expect(JSON.stringify(res.body)).not.toContain("@stillspan.test");
  });

  it("lists every account to the administrator with its flag and memberships, and no password hash", async () => {
    const projectId = await projectWithAllRoles("users list");

    const res = await api(base(), "/api/users", { cookie: cookies.admin });

    expect(res.status).toBe(200);
    const reviewer = res.body.find((u: { email: string }) => u.email === "reviewer@stillspan.test");
    expect(reviewer).toMatchObject({ id: expect.stringMatching(/^\d+$/), isAdmin: false });
    expect(Object.keys(reviewer).sort()).toEqual(["createdAt", "email", "id", "isAdmin", "memberships", "name"]);
    expect(reviewer.memberships).toContainEqual({
      projectId: String(projectId),
      projectName: `Admin test users list ${suffix}`,
      role: "reviewer",
    });
    expect(res.body.find((u: { email: string }) => u.email === "admin@stillspan.test").isAdmin).toBe(true);
    expect(JSON.stringify(res.body)).not.toMatch(/password|\$2[aby]\$/i);
  });
});

describe("PATCH /api/users/:id", () => {
  let targetId: number;
  beforeAll(async () => {
    targetId = await scratchUser("patch");
  });

  it.each(REFUSED)("refuses the $caller with $status and changes nothing", async ({ caller, status }) => {
    const res = await api(base(), `/api/users/${targetId}`, {
      method: "PATCH",
      cookie: cookies[caller],
      body: { isAdmin: true },
    });
    expect(res.status).toBe(status);
    const { rows } = await db.execute<{ is_admin: boolean }>(sql`select is_admin from users where id = ${targetId}`);
    expect(rows[0].is_admin).toBe(false);
  });

  it("lets the administrator rename an account and grant the flag (200), audited with old and new values", async () => {
    const res = await api(base(), `/api/users/${targetId}`, {
      method: "PATCH",
      cookie: cookies.admin,
      body: { name: "Ilse Marrow", isAdmin: true },
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: String(targetId), name: "Ilse Marrow", isAdmin: true, memberships: [] });
    expect(await auditRows("user", targetId)).toEqual([
      {
        action: "user.update",
        actorId: adminId,
        details: { name: { from: "Scratch patch", to: "Ilse Marrow" }, isAdmin: { from: false, to: true } },
      },
    ]);
  });

  it("lets an administrator remove another administrator's flag", async () => {
    const res = await api(base(), `/api/users/${targetId}`, {
      method: "PATCH",
      cookie: cookies.admin,
      body: { isAdmin: false },
    });
    expect(res.status).toBe(200);
    expect(res.body.isAdmin).toBe(false);
    expect((await auditRows("user", targetId)).map((a) => a.action)).toEqual(["user.update", "user.update"]);
  });

  it("refuses with 409 when an administrator removes their own flag, and they stay administrator", async () => {
    const before = (await auditRows("user", adminId)).filter((a) => a.action === "user.update").length;

    const res = await api(base(), `/api/users/${adminId}`, {
      method: "PATCH",
      cookie: cookies.admin,
      body: { isAdmin: false },
    });

    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("conflict");
    expect(res.body.error.message).toMatch(/own administrator flag/);
    const me = await api(base(), "/api/auth/me", { cookie: cookies.admin });
    expect(me.body.isAdmin).toBe(true);
    expect((await auditRows("user", adminId)).filter((a) => a.action === "user.update").length).toBe(before);
  });

  it("rejects an empty body and a blank name with 400, and an unknown account with 404", async () => {
    const empty = await api(base(), `/api/users/${targetId}`, { method: "PATCH", cookie: cookies.admin, body: {} });
    expect(empty.status).toBe(400);
    const blank = await api(base(), `/api/users/${targetId}`, { method: "PATCH", cookie: cookies.admin, body: { name: "" } });
    expect(blank.status).toBe(400);
    expect(blank.body.error.details[0].path).toBe("name");
    const missing = await api(base(), "/api/users/987654321", { method: "PATCH", cookie: cookies.admin, body: { name: "X" } });
    expect(missing.status).toBe(404);
  });
});
