/**
 * A NUL character or an escaped lone surrogate in any text field once gave 500 on every write route (PostgreSQL
 * refuses both) and wrote the whole failed query to the log. Every write route must answer 400 naming the field,
 * store nothing, and log (almost) nothing.
 */
import { Writable } from "node:stream";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEFAULT_REQUIREMENTS } from "../../shared/criteria/default-requirements.js";
import { createLogger } from "../../server/logger.js";
import { startTestApp } from "../support/app.js";
import { createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn, type ApiResponse } from "../support/http.js";
import { postRawMultipart } from "../support/multipart.js";
import { createAlternativeAndStudy, flutterMeta, inventedStudy, readFixture, rowCounts, upload } from "../support/workspace.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
const ids = { project: "", alternative: "", study: "", revision: "", dataset: "", reviewer: 0, viewer: 0 };
const cookies = { admin: "", analyst: "", reviewer: "" };

beforeAll(async () => {
  const project = await createProjectWithMembers(db, `Bad text ${Date.now().toString(36)}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
  });
  ids.project = String(project);
  cookies.admin = await signIn(base(), "admin@stillspan.test");
  cookies.analyst = await signIn(base(), "analyst@stillspan.test");
  cookies.reviewer = await signIn(base(), "reviewer@stillspan.test");
  const made = await createAlternativeAndStudy(base(), cookies.analyst, project);
  Object.assign(ids, { alternative: made.alternativeId, study: made.studyId, revision: made.revision1Id });
  const dataset = await upload(base(), `/api/alternatives/${ids.alternative}/datasets`, {
    cookie: cookies.analyst,
    field: "file",
    file: { name: "derivatives.csv", bytes: readFixture("uploads/flutter-derivatives.csv"), type: "text/csv" },
    fields: { meta: flutterMeta() },
  });
  ids.dataset = dataset.body.id;
  ids.reviewer = await userId(db, "reviewer@stillspan.test");
  ids.viewer = await userId(db, "viewer@stillspan.test");
});
afterAll(() => db.$client.end());

const criteria = (notes: string) => ({
  wind: { basicSpeed: 26, probability: { kind: "return-period", years: 100 }, terrain: { kind: "category", category: "II" }, deckHeight: 60 },
  requirements: DEFAULT_REQUIREMENTS,
  notes,
});
const studyNamed = (name: string) => ({ ...inventedStudy(), name });
const studyWithModeId = (id: string) => {
  const doc = inventedStudy();
  doc.structure.modes[0].id = id;
  return doc;
};

type Route = { name: string; who: keyof typeof cookies | null; method: string; path: () => string; body: (bad: string) => unknown; field: string };

/** Every JSON write route that takes text, the body with `bad` in one text field, and the path the answer must name. */
const ROUTES: Route[] = [
  { name: "create project", who: "admin", method: "POST", path: () => "/api/projects", body: (b) => ({ name: `P${b}` }), field: "name" },
  { name: "edit project", who: "analyst", method: "PATCH", path: () => `/api/projects/${ids.project}`, body: (b) => ({ siteNotes: `n${b}` }), field: "siteNotes" },
  { name: "set member", who: "admin", method: "PUT", path: () => `/api/projects/${ids.project}/members/${ids.viewer}`, body: (b) => ({ role: `viewer${b}` }), field: "role" },
  { name: "criteria", who: "reviewer", method: "PUT", path: () => `/api/projects/${ids.project}/criteria`, body: (b) => ({ criteria: criteria(`n${b}`), baseVersion: null }), field: "criteria.notes" },
  { name: "create alternative", who: "analyst", method: "POST", path: () => `/api/projects/${ids.project}/alternatives`, body: (b) => ({ name: `A${b}`, deckWidthM: 30, deckDepthM: 3 }), field: "name" },
  { name: "edit alternative", who: "analyst", method: "PATCH", path: () => `/api/alternatives/${ids.alternative}`, body: (b) => ({ description: `d${b}` }), field: "description" },
  { name: "create study", who: "analyst", method: "POST", path: () => `/api/alternatives/${ids.alternative}/studies`, body: (b) => ({ name: `S${b}` }), field: "name" },
  { name: "create study with a document", who: "analyst", method: "POST", path: () => `/api/alternatives/${ids.alternative}/studies`, body: (b) => ({ name: "S", study: studyNamed(`S${b}`) }), field: "$.name" },
  { name: "edit study", who: "analyst", method: "PATCH", path: () => `/api/studies/${ids.study}`, body: (b) => ({ purpose: `p${b}` }), field: "purpose" },
  { name: "save revision (note)", who: "analyst", method: "POST", path: () => `/api/studies/${ids.study}/revisions`, body: (b) => ({ parentRevision: 1, changeNote: `c${b}`, study: inventedStudy() }), field: "changeNote" },
  { name: "save revision (mode id)", who: "analyst", method: "POST", path: () => `/api/studies/${ids.study}/revisions`, body: (b) => ({ parentRevision: 1, changeNote: "c", study: studyWithModeId(`V${b}`) }), field: "$.structure.modes[0].id" },
  { name: "edit data set", who: "analyst", method: "PATCH", path: () => `/api/datasets/${ids.dataset}`, body: (b) => ({ provenance: { flow: "smooth", facility: `f${b}` } }), field: "provenance.facility" },
  { name: "submit for review", who: "analyst", method: "POST", path: () => `/api/revisions/${ids.revision}/submit`, body: (b) => ({ reviewerId: String(ids.reviewer), note: `n${b}` }), field: "note" },
  { name: "comment", who: "analyst", method: "POST", path: () => `/api/revisions/${ids.revision}/comments`, body: (b) => ({ body: `c${b}` }), field: "body" },
  { name: "return", who: "reviewer", method: "POST", path: () => `/api/revisions/${ids.revision}/return`, body: (b) => ({ comments: `c${b}` }), field: "comments" },
  { name: "sign", who: "reviewer", method: "POST", path: () => `/api/revisions/${ids.revision}/sign`, body: (b) => ({ statement: `s${b}`, previewSha256: "0".repeat(64) }), field: "statement" },
  { name: "sweep", who: "analyst", method: "POST", path: () => "/api/sweep", body: (b) => studyNamed(`S${b}`), field: "$.name" },
  { name: "screening", who: "analyst", method: "POST", path: () => "/api/screening", body: (b) => ({ study: studyWithModeId(`V${b}`), criteria: criteria("n") }), field: "study.structure.modes.0.id" },
  { name: "invite", who: "admin", method: "POST", path: () => `/api/projects/${ids.project}/invitations`, body: (b) => ({ email: "new.person@stillspan.test", role: "viewer", name: `N${b}` }), field: "name" },
  { name: "rename user", who: "admin", method: "PATCH", path: () => `/api/users/${ids.viewer}`, body: (b) => ({ name: `U${b}` }), field: "name" },
  { name: "sign in", who: null, method: "POST", path: () => "/api/auth/sign-in", body: (b) => ({ email: "analyst@stillspan.test", password: `stillspan-demo${b}` }), field: "password" },
  { name: "password reset", who: null, method: "POST", path: () => "/api/auth/password-reset", body: (b) => ({ email: `a${b}@stillspan.test` }), field: "email" },
  { name: "password reset confirm", who: null, method: "POST", path: () => "/api/auth/password-reset/confirm", body: (b) => ({ token: "a".repeat(43), password: `long enough${b}` }), field: "password" },
  { name: "accept invitation", who: null, method: "POST", path: () => "/api/invitations/accept", body: (b) => ({ token: "a".repeat(43), password: "long enough pass", name: `N${b}` }), field: "name" },
  { name: "verify signature", who: null, method: "POST", path: () => "/api/signatures/verify", body: (b) => ({ jws: `a.b.c${b}` }), field: "jws" },
];

const BAD = [
  ["a NUL character", "\u0000"],
  ["an escaped lone surrogate", "\uD800"],
] as const;

function expectRefusedAt(res: ApiResponse<any>, field: string): void {
  expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(400);
  const paths = (res.body.error.details as { path: string }[]).map((d) => d.path);
  expect(paths).toContain(field);
}

describe("NUL and lone surrogates on every write route", () => {
  it.each(ROUTES.flatMap((route) => BAD.map(([what, bad]) => ({ ...route, what, bad }))))(
    "$name: $what → 400 naming $field, nothing stored",
    async ({ who, method, path, body, field, bad }) => {
      const before = await rowCounts(db);
      const res = await api(base(), path(), { method, cookie: who ? cookies[who] : undefined, body: body(bad) });
      expectRefusedAt(res, field);
      expect(await rowCounts(db)).toEqual(before);
    },
  );

  it("multipart: the data-set description, the import's change note and the study file are checked too", async () => {
    const meta = await upload(base(), `/api/alternatives/${ids.alternative}/datasets`, {
      cookie: cookies.analyst,
      field: "file",
      file: { name: "d.csv", bytes: readFixture("uploads/flutter-derivatives.csv"), type: "text/csv" },
      fields: { meta: flutterMeta({ name: "Set\u0000" }) },
    });
    expectRefusedAt(meta, "meta.name");

    const file = { name: "s.json", bytes: Buffer.from(JSON.stringify(inventedStudy())), type: "application/json" };
    const note = await upload(base(), `/api/studies/${ids.study}/import`, { cookie: cookies.analyst, field: "file", file, fields: { parentRevision: "1", changeNote: "c\u0000" } });
    expectRefusedAt(note, "changeNote");

    const named = { ...file, bytes: Buffer.from(JSON.stringify(studyNamed("S\uDBFF"))) };
    const study = await upload(base(), `/api/studies/${ids.study}/import`, { cookie: cookies.analyst, field: "file", file: named, fields: { parentRevision: "1" } });
    expectRefusedAt(study, "$.name");
  });

  it("a NUL in an uploaded file's name is refused (it is stored beside the file)", async () => {
    const before = await rowCounts(db);
    const send = (part: { filename?: Buffer; filenameStar?: string }) =>
      postRawMultipart(`${base()}/api/alternatives/${ids.alternative}/datasets`, [
        { name: "meta", bytes: flutterMeta() },
        { name: "file", ...part, type: "text/csv", bytes: readFixture("uploads/flutter-derivatives.csv") },
      ], { cookie: cookies.analyst });
    // Percent-encoded (RFC 5987): the parser decodes it, the file name rule refuses it.
    expectRefusedAt(await send({ filenameStar: "UTF-8''deriv%00atives.csv" }), "file.filename");
    // A raw NUL byte in the part header: the parser refuses the header, which is the client's fault (once a 500).
    const raw = await send({ filename: Buffer.from("deriv\u0000atives.csv", "latin1") });
    expect(raw.status).toBe(400);
    expect(raw.body.error).toMatchObject({ code: "malformed_multipart", message: expect.stringMatching(/Malformed part header/) });
    expect(await rowCounts(db)).toEqual(before);
  });
});

describe("the server log stays bounded per request", () => {
  it("a 400 kB study saved with a NUL in its change note, and a NUL in a name, grow the log by far less than 100 kB", async () => {
    let logged = 0;
    const sink = new Writable({
      write(chunk, _encoding, done) {
        logged += chunk.length;
        done();
      },
    });
    const app = await startTestApp({ logger: createLogger({ level: "info", destination: sink }) });
    try {
      // A long (valid) derivative table, so the failed INSERT once carried ~400 kB of parameters plus the result.
      const big = inventedStudy();
      const ur = Array.from({ length: 5000 }, (_, i) => 1 + i * 0.004);
      big.aerodynamics = { model: "tabulated", interpolation: "linear", reducedVelocity: ur };
      for (const name of ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"]) big.aerodynamics[name] = ur.map((u) => -0.0123456 * u);
      big.sweep = { from: 10, to: 20, step: 5 };
      const body = JSON.stringify({ parentRevision: 1, changeNote: "note\u0000", study: big });
      expect(body.length).toBeGreaterThan(350_000);

      const res = await api(app.baseUrl, `/api/studies/${ids.study}/revisions`, { cookie: cookies.analyst, body });
      const named = await api(app.baseUrl, `/api/studies/${ids.study}`, { method: "PATCH", cookie: cookies.analyst, body: { name: "x\u0000" } });
      expect(logged, `the log grew by ${logged} bytes`).toBeLessThan(100_000);
      expectRefusedAt(res, "changeNote");
      expectRefusedAt(named, "name");
    } finally {
      await app.close();
    }
  });
});
