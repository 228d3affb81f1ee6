import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createProjectWithMembers, openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";
import { createAlternativeAndStudy } from "../support/workspace.js";

const DEMO_NAME = "Harrowmere Estuary Crossing (invented demo)";
const base = () => testEnv.baseUrl;
const db = openTestDb();
let analyst: string;
let reviewer: string;

beforeAll(async () => {
  [analyst, reviewer] = await Promise.all(["analyst", "reviewer"].map((r) => signIn(base(), `${r}@stillspan.test`)));
});
afterAll(() => db.$client.end());

describe("GET /api/projects/:id/comparison on the demo crossing", () => {
  it("compares both invented alternatives' latest revisions against the required speeds, with B's revision trend", async () => {
    const projects = await api(base(), "/api/projects", { cookie: reviewer });
    const demo = projects.body.find((p: { name: string }) => p.name === DEMO_NAME);

    const res = await api(base(), `/api/projects/${demo.id}/comparison`, { cookie: reviewer });

    expect(res.status).toBe(200);
    const { criteria, rows, trends } = res.body;
    expect(criteria.requiredFlutterSpeedMps).toBeGreaterThan(criteria.meanSpeedMps);
    // Other test files may add studies to the demo alternatives: every row is checked, the alternatives are the two seeded.
    expect([...new Set(rows.map((r: { alternativeName: string }) => r.alternativeName))].sort()).toEqual([
      "A — twin steel box with central gap (invented)",
      "B — single streamlined box with wind screens (invented)",
    ]);
    for (const row of rows) {
      const a = row.latest.assessment.assessment;
      const flutter = a.flutter;
      expect(flutter.speedMps).toBeGreaterThan(0);
      expect(["coupled", "torsional", "heave"]).toContain(flutter.kind);
      // The margin is the stored flutter speed over the project's required speed.
      expect(a.margins.flutter.margin).toBeCloseTo(flutter.speedMps / criteria.requiredFlutterSpeedMps, 12);
      expect(a.margins.flutter.status).toBe(flutter.speedMps >= criteria.requiredFlutterSpeedMps ? "pass" : "fail");
      expect(a.margins.divergence.requiredSpeedMps).toBe(criteria.requiredDivergenceSpeedMps);
      expect(a.computedFrom.criteriaVersion).toBe(criteria.version);
      // The row shows exactly what the stored revision's result says, through the same stored assessment.
      const revision = await api(base(), `/api/revisions/${row.latest.revisionId}`, { cookie: reviewer });
      expect(revision.body.assessment).toEqual(row.latest.assessment);
      expect(revision.body.result.flutter.speed).toBe(flutter.speedMps);
      expect(revision.body.result.flutter.frequency).toBe(flutter.frequencyHz);
      expect(row.latest.deck).toEqual({ widthM: revision.body.study.deck.width, depthM: revision.body.study.deck.depth });
      expect(row.latest.structure.massKgPerM).toBe(revision.body.study.structure.mass);
      expect(row.latest.structure.modes.map((m: { frequencyHz: number }) => m.frequencyHz)).toEqual(
        revision.body.study.structure.modes.map((m: { frequency: number }) => m.frequency),
      );
      expect(row.latest.aerodynamicModel).toBe(revision.body.study.aerodynamics.model);
    }
    const trendB = trends.find((t: { alternativeName: string }) => t.alternativeName.startsWith("B"));
    expect(trendB.points.length).toBeGreaterThanOrEqual(3);
    expect(trendB.points.map((p: { number: number }) => p.number)).toEqual(trendB.points.map((_: unknown, i: number) => i + 1));
    const speeds = trendB.points.slice(0, 3).map((p: { flutterSpeedMps: number }) => p.flutterSpeedMps);
    expect(new Set(speeds).size).toBe(3);
  });

  it("answers 403 to the viewer (owner's representatives read signed summaries only)", async () => {
    const viewer = await signIn(base(), "viewer@stillspan.test");
    const projects = await api(base(), "/api/projects", { cookie: viewer });
    const demo = projects.body.find((p: { name: string }) => p.name === DEMO_NAME);
    expect((await api(base(), `/api/projects/${demo.id}/comparison`, { cookie: viewer })).status).toBe(403);
  });
});

describe("GET /api/projects/:id/comparison without criteria", () => {
  it("gives null margins and null criteria, and lists a study without revisions with latest null", async () => {
    const projectId = await createProjectWithMembers(db, `Comparison test ${Date.now().toString(36)}`, { "analyst@stillspan.test": "analyst" });
    const { alternativeId } = await createAlternativeAndStudy(base(), analyst, projectId);
    await api(base(), `/api/alternatives/${alternativeId}/studies`, { cookie: analyst, body: { name: "Empty study" } });

    const res = await api(base(), `/api/projects/${projectId}/comparison`, { cookie: analyst });

    expect(res.status).toBe(200);
    expect(res.body.criteria).toBeNull();
    const [empty, withRevision] = res.body.rows;
    expect(empty).toMatchObject({ studyName: "Empty study", latest: null });
    expect(withRevision).toMatchObject({ studyName: "Test study", latest: { number: 1 } });
    const a = withRevision.latest.assessment.assessment;
    expect(a).toMatchObject({ margins: null, verdict: "no-criteria", computedFrom: { criteriaVersion: null } });
    expect(a.divergence.governingSpeedMps).toBeGreaterThan(0);
    expect(res.body.trends.map((t: { points: unknown[] }) => t.points.length)).toEqual([0, 1]);
  });
});
