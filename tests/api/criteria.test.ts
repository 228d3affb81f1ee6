import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import invented from "../../shared/schemas/__tests__/fixtures/invented-deck-study.json";
import { DEFAULT_REQUIREMENTS } from "../../shared/criteria/default-requirements.js";
import { auditActions, createProjectWithMembers, openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
let projectId: number;
let otherProjectId: number;
let cookies: Record<"admin" | "analyst" | "reviewer" | "viewer", string>;

const criteria = () => ({
  wind: {
    basicSpeed: 26,
    probability: { kind: "return-period", years: 100 },
    terrain: { kind: "category", category: "II" },
    deckHeight: 60,
  },
  requirements: structuredClone(DEFAULT_REQUIREMENTS),
});

beforeAll(async () => {
  const suffix = Date.now().toString(36);
  projectId = await createProjectWithMembers(db, `Criteria test crossing ${suffix}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
  });
  otherProjectId = await createProjectWithMembers(db, `Criteria test crossing without the viewer ${suffix}`, {
    "analyst@stillspan.test": "analyst",
  });
  const [admin, analyst, reviewer, viewer] = await Promise.all(
    ["admin", "analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)),
  );
  cookies = { admin, analyst, reviewer, viewer };
});
afterAll(() => db.$client.end());

const criteriaUrl = (id: number) => `/api/projects/${id}/criteria`;

describe("GET /api/projects/:id/criteria", () => {
  it("shows a project without criteria as version null, with the default factors and their basis", async () => {
    const res = await api(base(), criteriaUrl(projectId), { cookie: cookies.viewer });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ projectId: String(projectId), version: null, criteria: null, evaluated: null });
    expect(res.body.defaults.divergence).toMatchObject({ factor: 2 });
    expect(res.body.defaults.flutter.basis).toMatch(/from memory/);
  });

  it("shows the demo crossing's seeded criteria with v_m at deck level (category 0, 62 m, v_b 28 m/s)", async () => {
    const projects = await api(base(), "/api/projects", { cookie: cookies.viewer });
    const demo = projects.body.find((p: { name: string }) => p.name.startsWith("Harrowmere"));
    const res = await api(base(), criteriaUrl(Number(demo.id)), { cookie: cookies.viewer });
    expect(res.status).toBe(200);
    // By hand, EN 1991-1-4 Expr. (4.3)–(4.5): 0.19·(0.003/0.05)^0.07 · ln(62/0.003) · 28 = 43.41 m/s.
    const byHand = 0.19 * Math.pow(0.003 / 0.05, 0.07) * Math.log(62 / 0.003) * 28;
    expect(res.body.version).toBeGreaterThanOrEqual(1);
    expect(res.body.evaluated.designWind.meanSpeedMps).toBeCloseTo(byHand, 9);
    expect(res.body.evaluated.required.flutter.requiredSpeedMps).toBeCloseTo(1.2 * byHand, 9);
  });

  it("answers 403 to a non-member and 401 without a session", async () => {
    expect((await api(base(), criteriaUrl(otherProjectId), { cookie: cookies.viewer })).status).toBe(403);
    expect((await api(base(), criteriaUrl(projectId))).status).toBe(401);
  });
});

describe("PUT /api/projects/:id/criteria (reviewers and administrators own the criteria)", () => {
  it("answers 403 to the viewer and to the analyst whose work is checked against them, and saves nothing", async () => {
    for (const who of ["viewer", "analyst"] as const) {
      const res = await api(base(), criteriaUrl(projectId), { method: "PUT", cookie: cookies[who], body: { criteria: criteria() } });
      expect(res.status, who).toBe(403);
      expect(res.body.error.code).toBe("forbidden");
    }
    const after = await api(base(), criteriaUrl(projectId), { cookie: cookies.analyst });
    expect(after.body.version).toBeNull();
  });

  it("answers 400 with the path of every bad field and saves nothing", async () => {
    const bad = criteria() as any;
    bad.wind.deckHeight = 250;
    bad.wind.terrain = { kind: "category", category: "VI" };
    bad.requirements.flutter.basis = "";
    const res = await api(base(), criteriaUrl(projectId), { method: "PUT", cookie: cookies.reviewer, body: { criteria: bad } });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_input");
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(
      expect.arrayContaining(["criteria.wind.deckHeight", "criteria.wind.terrain.category", "criteria.requirements.flutter.basis"]),
    );
    expect((await api(base(), criteriaUrl(projectId), { cookie: cookies.analyst })).body.version).toBeNull();
  });

  it("saves version 1, reads it back unchanged with v_m and required speeds, and audits the save", async () => {
    const sent = criteria();
    const res = await api(base(), criteriaUrl(projectId), { method: "PUT", cookie: cookies.reviewer, body: { criteria: sent, baseVersion: null } });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(1);
    const read = await api(base(), criteriaUrl(projectId), { cookie: cookies.viewer });
    expect(read.body.criteria).toEqual({ ...sent, wind: { ...sent.wind, orographyFactor: 1 } });
    expect(read.body.savedBy).toMatchObject({ name: expect.any(String) });
    // By hand, EN 1991-1-4 (4.2)–(4.5): c_prob(100 yr) · 0.19 ln(60/0.05) · 26.
    const cProb = Math.sqrt((1 - 0.2 * Math.log(-Math.log(0.99))) / (1 - 0.2 * Math.log(-Math.log(0.98))));
    expect(read.body.evaluated.designWind.meanSpeedMps).toBeCloseTo(cProb * 0.19 * Math.log(1200) * 26, 9);
    expect(await auditActions(db, "project", projectId)).toContain("criteria.update");
  });

  it("appends version 2 on the next save, refuses a stale baseVersion with 409, and keeps the history", async () => {
    const edited = criteria();
    edited.requirements.flutter = { factor: 1.4, basis: "Owner's specification (invented for the test)" } as any;
    const second = await api(base(), criteriaUrl(projectId), { method: "PUT", cookie: cookies.reviewer, body: { criteria: edited, baseVersion: 1 } });
    expect(second.status).toBe(200);
    expect(second.body.version).toBe(2);
    expect(second.body.evaluated.required.flutter.totalFactor).toBe(1.4);

    const stale = await api(base(), criteriaUrl(projectId), { method: "PUT", cookie: cookies.reviewer, body: { criteria: criteria(), baseVersion: 1 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("conflict");

    const history = await api(base(), `${criteriaUrl(projectId)}/history`, { cookie: cookies.viewer });
    expect(history.status).toBe(200);
    expect(history.body.map((v: { version: number }) => v.version)).toEqual([2, 1]);
  });

  it("lets an administrator who is not a member save", async () => {
    const res = await api(base(), criteriaUrl(otherProjectId), { method: "PUT", cookie: cookies.admin, body: { criteria: criteria() } });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(1);
  });
});

describe("who stands behind each basis", () => {
  it("marks a default basis as such until a reviewer confirms it, and records who confirmed it in which version", async () => {
    // Version 2 (above): flutter replaced by the reviewer's own text, the other three still the shipped defaults.
    const v2 = await api(base(), criteriaUrl(projectId), { cookie: cookies.viewer });
    expect(v2.body.version).toBe(2);
    expect(v2.body.bases.flutter).toMatchObject({ defaultText: false, confirmation: { by: { name: "Mira Holloway" }, version: 2, how: "written" } });
    for (const p of ["divergence", "vortexOnset", "gallopingOnset"]) expect(v2.body.bases[p], p).toEqual({ defaultText: true, confirmation: null });

    const bad = await api(base(), criteriaUrl(projectId), {
      method: "PUT",
      cookie: cookies.reviewer,
      body: { criteria: v2.body.criteria, baseVersion: 2, confirmBases: ["divergence", "buffeting"] },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toEqual(["confirmBases.1"]);

    const confirmed = await api(base(), criteriaUrl(projectId), {
      method: "PUT",
      cookie: cookies.reviewer,
      body: { criteria: v2.body.criteria, baseVersion: 2, confirmBases: ["divergence"] },
    });
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200);
    expect(confirmed.body.version).toBe(3);
    expect(confirmed.body.bases.divergence).toMatchObject({ defaultText: true, confirmation: { by: { name: "Mira Holloway" }, version: 3, how: "confirmed" } });
    // Unchanged requirements keep their record from the version that made it.
    expect(confirmed.body.bases.flutter.confirmation).toEqual(v2.body.bases.flutter.confirmation);
    expect(confirmed.body.bases.vortexOnset.confirmation).toBeNull();

    const history = await api(base(), `${criteriaUrl(projectId)}/history`, { cookie: cookies.analyst });
    expect(history.body.map((v: { version: number; bases: Record<string, { confirmation: unknown }> }) => [v.version, v.bases.divergence.confirmation !== null])).toEqual([
      [3, true],
      [2, false],
      [1, false],
    ]);
    const { rows } = await db.execute<{ details: { confirmedBases: string[] } }>(
      sql`select details from audit_events where action = 'criteria.update' and object_id = ${String(projectId)} order by id desc limit 1`,
    );
    expect(rows[0].details.confirmedBases).toEqual(["divergence"]);
  });

  it("seeds the demo crossing with its own invented design basis, every basis written by the demo reviewer", async () => {
    const projects = await api(base(), "/api/projects", { cookie: cookies.viewer });
    const demo = projects.body.find((p: { name: string }) => p.name.startsWith("Harrowmere"));
    const res = await api(base(), criteriaUrl(Number(demo.id)), { cookie: cookies.viewer });
    for (const [phenomenon, requirement] of Object.entries(res.body.criteria.requirements) as [string, { basis: string }][]) {
      expect(requirement.basis, phenomenon).toMatch(/^Harrowmere Crossing design basis, invented for the demo, clause 7\.\d\.\d/);
      expect(res.body.bases[phenomenon]).toMatchObject({ defaultText: false, confirmation: { by: { name: "Mira Holloway" } } });
    }
  });
});

describe("POST /api/screening", () => {
  it("screens a study against the project's current criteria for its analyst", async () => {
    const res = await api(base(), "/api/screening", {
      cookie: cookies.analyst,
      body: { study: invented, projectId: String(projectId), options: { strouhalNumber: 0.11 } },
    });
    expect(res.status).toBe(200);
    expect(res.body.vortexShedding.modes[0].onsetSpeedMps).toBeCloseTo((3.6 * 0.124) / 0.11, 9);
    expect(res.body.margins.divergence.requiredSpeedMps).toBeCloseTo(2 * res.body.designWind.meanSpeedMps, 9);
    expect(res.body.cautions.join(" ")).toMatch(/indicative/);
    // Onsets of 4–11 m/s against 1.25 v_m: lock-in to investigate (EN 1991-1-4 E.1.2(2)), never a failure;
    // galloping of a B/D = 7.6 deck without a_G or static coefficients is not evaluated.
    expect(res.body.margins.vortexOnset.status).toBe("investigate");
    expect(res.body.margins.gallopingOnset.status).toBe("not-evaluated");
    expect(res.body.galloping.standard).toBeNull();
  });

  it("evaluates galloping by EN 1991-1-4 E.2.2 (E.18) with an a_G given with its source, and refuses one without", async () => {
    const res = await api(base(), "/api/screening", {
      cookie: cookies.analyst,
      body: { study: invented, projectId: String(projectId), options: { gallopingFactor: 2, gallopingFactorBasis: "invented static tests" } },
    });
    expect(res.status).toBe(200);
    // By hand: Sc = 2 δ m / (ρ D²), δ = 2π·0.005; v_CG = 2 Sc n D / a_G with n = 0.124 Hz, D = 3.6 m, a_G = 2.
    const sc = (2 * 2 * Math.PI * 0.005 * 15200) / (1.225 * 3.6 ** 2);
    expect(res.body.galloping.standard.onsetSpeedMps).toBeCloseTo((2 * sc * 0.124 * 3.6) / 2, 9);
    expect(res.body.margins.gallopingOnset.criticalSpeedMps).toBeCloseTo((2 * sc * 0.124 * 3.6) / 2, 9);
    const bare = await api(base(), "/api/screening", {
      cookie: cookies.analyst,
      body: { study: invented, projectId: String(projectId), options: { gallopingFactor: 2 } },
    });
    expect(bare.status).toBe(400);
    expect(bare.body.error.details.map((d: { path: string }) => d.path)).toContain("options.gallopingFactorBasis");
  });

  it("answers 403 to a user who is only a viewer, and 400 with paths for a bad study", async () => {
    expect((await api(base(), "/api/screening", { cookie: cookies.viewer, body: { study: invented } })).status).toBe(403);
    const bad = await api(base(), "/api/screening", {
      cookie: cookies.reviewer,
      body: { study: { ...invented, deck: { width: -1, depth: 3 } } },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain("study.deck.width");
  });
});
