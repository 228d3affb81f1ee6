/**
 * The role × route matrix of alternatives, data sets, studies, revisions and the comparison: every route is
 * called by an administrator, an analyst, a reviewer and a viewer of the project, by an analyst of another
 * project, and without a session; every answer is asserted, and a refused write must leave the audit trail
 * (and so the data) unchanged.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { insertUser } from "../../server/db/queries/users.js";
import { hashPassword } from "../../server/services/passwords.js";
import { createProjectWithMembers, openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, DEMO_PASSWORD, signIn, type ApiResponse } from "../support/http.js";
import {
  createAlternativeAndStudy,
  flutterMeta,
  inventedStudy,
  lastAuditId,
  readFixture,
  upload,
} from "../support/workspace.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
const CALLERS = ["admin", "analyst", "reviewer", "viewer", "outsider", "anonymous"] as const;
type Caller = (typeof CALLERS)[number];
const cookies = {} as Record<Caller, string | undefined>;
let projectId: number;
let ids: { alternativeId: string; studyId: string; revision1Id: string; datasetId: string; revision2Id: string };

const PNG_1X1 = Buffer.from(
  "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==",
  "base64",
);

beforeAll(async () => {
  const suffix = Date.now().toString(36);
  projectId = await createProjectWithMembers(db, `Role matrix ${suffix}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
  });
  const outsiderEmail = `outsider-${suffix}@stillspan.test`;
  await insertUser(db, { email: outsiderEmail, name: "Outside Analyst", passwordHash: await hashPassword(DEMO_PASSWORD) });
  await createProjectWithMembers(db, `Another crossing ${suffix}`, { [outsiderEmail]: "analyst" });
  for (const caller of ["admin", "analyst", "reviewer", "viewer"] as const) cookies[caller] = await signIn(base(), `${caller}@stillspan.test`);
  cookies.outsider = await signIn(base(), outsiderEmail);
  cookies.anonymous = undefined;

  const made = await createAlternativeAndStudy(base(), cookies.analyst!, projectId);
  const dataset = await upload(base(), `/api/alternatives/${made.alternativeId}/datasets`, {
    cookie: cookies.analyst,
    field: "file",
    file: { name: "d.csv", bytes: readFixture("uploads/flutter-derivatives.csv"), type: "text/csv" },
    fields: { meta: flutterMeta() },
  });
  await upload(base(), `/api/alternatives/${made.alternativeId}/image`, {
    cookie: cookies.analyst,
    method: "PUT",
    field: "image",
    file: { name: "s.png", bytes: PNG_1X1, type: "image/png" },
  });
  const study = inventedStudy();
  study.structure.mass = 15800;
  const second = await api(base(), `/api/studies/${made.studyId}/revisions`, {
    cookie: cookies.analyst,
    body: { parentRevision: 1, changeNote: "mass", study },
  });
  ids = { ...made, datasetId: dataset.body.id, revision2Id: second.body.id };
});
afterAll(() => db.$client.end());

interface Route {
  name: string;
  write: boolean;
  /** Status when allowed. */
  ok: number;
  /** Makes what one call needs (fresh objects for deletions, the current parent revision), as the analyst. */
  prepare?: () => Promise<string>;
  /** Sends the request; `prepared` is what `prepare` returned. */
  call: (cookie: string | undefined, prepared: string) => Promise<ApiResponse>;
}

const json = (method: string, path: string, body?: unknown) => (cookie: string | undefined) => api(base(), path, { method, cookie, body });
const analystMakesAlternative = async () =>
  (await api(base(), `/api/projects/${projectId}/alternatives`, { cookie: cookies.analyst, body: { name: "Scratch", deckWidthM: 20, deckDepthM: 2 } })).body.id;
const latestNumber = async () =>
  String((await api(base(), `/api/studies/${ids.studyId}`, { cookie: cookies.analyst })).body.latestRevision.number);

const ROUTES: Route[] = [
  { name: "GET /projects/:id/alternatives", write: false, ok: 200, call: (c) => json("GET", `/api/projects/${projectId}/alternatives`)(c) },
  { name: "GET /projects/:id/comparison", write: false, ok: 200, call: (c) => json("GET", `/api/projects/${projectId}/comparison`)(c) },
  { name: "GET /alternatives/:id", write: false, ok: 200, call: (c) => json("GET", `/api/alternatives/${ids.alternativeId}`)(c) },
  { name: "GET /alternatives/:id/image", write: false, ok: 200, call: (c) => json("GET", `/api/alternatives/${ids.alternativeId}/image`)(c) },
  { name: "GET /alternatives/:id/datasets", write: false, ok: 200, call: (c) => json("GET", `/api/alternatives/${ids.alternativeId}/datasets`)(c) },
  { name: "GET /alternatives/:id/studies", write: false, ok: 200, call: (c) => json("GET", `/api/alternatives/${ids.alternativeId}/studies`)(c) },
  { name: "GET /datasets/:id", write: false, ok: 200, call: (c) => json("GET", `/api/datasets/${ids.datasetId}`)(c) },
  { name: "GET /datasets/:id/original", write: false, ok: 200, call: (c) => json("GET", `/api/datasets/${ids.datasetId}/original`)(c) },
  { name: "GET /studies/:id", write: false, ok: 200, call: (c) => json("GET", `/api/studies/${ids.studyId}`)(c) },
  { name: "GET /studies/:id/revisions", write: false, ok: 200, call: (c) => json("GET", `/api/studies/${ids.studyId}/revisions`)(c) },
  { name: "GET /revisions/:id", write: false, ok: 200, call: (c) => json("GET", `/api/revisions/${ids.revision1Id}`)(c) },
  { name: "GET /revisions/:a/diff/:b", write: false, ok: 200, call: (c) => json("GET", `/api/revisions/${ids.revision1Id}/diff/${ids.revision2Id}`)(c) },
  { name: "GET /revisions/:id/export", write: false, ok: 200, call: (c) => json("GET", `/api/revisions/${ids.revision1Id}/export`)(c) },
  { name: "GET /studies/:id/review-states", write: false, ok: 200, call: (c) => json("GET", `/api/studies/${ids.studyId}/review-states`)(c) },
  { name: "GET /projects/:id/review-states", write: false, ok: 200, call: (c) => json("GET", `/api/projects/${projectId}/review-states`)(c) },
  {
    name: "POST /projects/:id/alternatives",
    write: true,
    ok: 201,
    call: (c) => json("POST", `/api/projects/${projectId}/alternatives`, { name: "Matrix deck", deckWidthM: 25, deckDepthM: 2.5 })(c),
  },
  { name: "PATCH /alternatives/:id", write: true, ok: 200, call: (c) => json("PATCH", `/api/alternatives/${ids.alternativeId}`, { description: "matrix" })(c) },
  {
    name: "DELETE /alternatives/:id",
    write: true,
    ok: 204,
    prepare: analystMakesAlternative,
    call: (c, alt) => json("DELETE", `/api/alternatives/${alt}`)(c),
  },
  {
    name: "PUT /alternatives/:id/image",
    write: true,
    ok: 200,
    call: (c) =>
      upload(base(), `/api/alternatives/${ids.alternativeId}/image`, { cookie: c, method: "PUT", field: "image", file: { name: "s.png", bytes: PNG_1X1, type: "image/png" } }),
  },
  {
    name: "DELETE /alternatives/:id/image",
    write: true,
    ok: 204,
    prepare: async () => {
      const alt = await analystMakesAlternative();
      await upload(base(), `/api/alternatives/${alt}/image`, { cookie: cookies.analyst, method: "PUT", field: "image", file: { name: "s.png", bytes: PNG_1X1, type: "image/png" } });
      return alt;
    },
    call: (c, alt) => json("DELETE", `/api/alternatives/${alt}/image`)(c),
  },
  {
    name: "POST /alternatives/:id/datasets",
    write: true,
    ok: 201,
    call: (c) =>
      upload(base(), `/api/alternatives/${ids.alternativeId}/datasets`, {
        cookie: c,
        field: "file",
        file: { name: "d.csv", bytes: readFixture("uploads/flutter-derivatives.csv"), type: "text/csv" },
        fields: { meta: flutterMeta() },
      }),
  },
  { name: "PATCH /datasets/:id", write: true, ok: 200, call: (c) => json("PATCH", `/api/datasets/${ids.datasetId}`, { name: "Renamed set" })(c) },
  {
    name: "DELETE /datasets/:id",
    write: true,
    ok: 204,
    prepare: async () => {
      const made = await upload(base(), `/api/alternatives/${ids.alternativeId}/datasets`, {
        cookie: cookies.analyst,
        field: "file",
        file: { name: "d.csv", bytes: readFixture("uploads/flutter-derivatives.csv"), type: "text/csv" },
        fields: { meta: flutterMeta() },
      });
      return made.body.id;
    },
    call: (c, id) => json("DELETE", `/api/datasets/${id}`)(c),
  },
  { name: "POST /alternatives/:id/studies", write: true, ok: 201, call: (c) => json("POST", `/api/alternatives/${ids.alternativeId}/studies`, { name: "Matrix study" })(c) },
  { name: "PATCH /studies/:id", write: true, ok: 200, call: (c) => json("PATCH", `/api/studies/${ids.studyId}`, { purpose: "matrix" })(c) },
  {
    name: "POST /studies/:id/revisions",
    write: true,
    ok: 201,
    prepare: latestNumber,
    call: (c, parent) => json("POST", `/api/studies/${ids.studyId}/revisions`, { parentRevision: Number(parent), changeNote: "matrix", study: inventedStudy() })(c),
  },
  {
    name: "POST /studies/:id/import",
    write: true,
    ok: 201,
    prepare: latestNumber,
    call: (c, parent) =>
      upload(base(), `/api/studies/${ids.studyId}/import`, {
        cookie: c,
        field: "file",
        file: { name: "s.json", bytes: new TextEncoder().encode(JSON.stringify(inventedStudy())), type: "application/json" },
        fields: { parentRevision: parent, changeNote: "matrix import" },
      }),
  },
  {
    name: "POST /revisions/:id/rerun",
    write: true,
    ok: 201,
    prepare: latestNumber,
    call: (c, parent) => json("POST", `/api/revisions/${ids.revision2Id}/rerun`, { parentRevision: Number(parent) })(c),
  },
];

function expected(route: Route, caller: Caller): number {
  if (caller === "anonymous") return 401;
  if (caller === "viewer" || caller === "outsider") return 403;
  if (caller === "reviewer") return route.write ? 403 : route.ok;
  return route.ok;
}

describe.each(ROUTES)("$name", (route) => {
  it.each(CALLERS)(`%s`, async (caller) => {
    const status = expected(route, caller);
    const prepared = route.prepare ? await route.prepare() : "";
    const auditBefore = await lastAuditId(db);

    const res = await route.call(cookies[caller], prepared);

    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(status);
    if (status === 403) expect((res.body as { error: { code: string } }).error.code).toBe("forbidden");
    // A refused write leaves no trace; an allowed one exactly one audit event.
    if (route.write) expect(await lastAuditId(db)).toBe(status < 300 ? auditBefore + 1 : auditBefore);
  });
});

describe("objects that do not exist", () => {
  it.each([
    "/api/alternatives/987654321",
    "/api/alternatives/abc",
    "/api/datasets/987654321",
    "/api/studies/987654321",
    "/api/studies/0/revisions",
    "/api/revisions/987654321",
    `/api/projects/987654321/alternatives`,
    `/api/projects/987654321/comparison`,
  ])("%s → 404 for an analyst", async (path) => {
    expect((await api(base(), path, { cookie: cookies.analyst })).status).toBe(404);
  });
});
