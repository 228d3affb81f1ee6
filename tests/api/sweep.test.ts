import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { benchmarkDeck as benchmarkDeckInputs } from "../../shared/engine/__tests__/support/benchmark-deck.js";
import { runSweep } from "../../shared/engine/run-sweep.js";
import { ENGINE_VERSION } from "../../shared/engine/version.js";
import { sweepResultSchema } from "../../shared/schemas/result.js";
import { parseStudy } from "../../shared/schemas/study.js";
import { createProjectWithMembers, openTestDb } from "../support/db.js";
import { startTestApp } from "../support/app.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
let cookies: Record<"admin" | "analyst" | "reviewer" | "viewer", string>;

/** Inputs of the IABSE TG 3.1 2-DOF benchmark deck (docs/conventions.md §Benchmark deck), flat plate, coarse sweep. */
const benchmarkDeck = () => benchmarkDeckInputs({ from: 10, to: 100, step: 1 });

beforeAll(async () => {
  await createProjectWithMembers(db, `Sweep test crossing ${Date.now().toString(36)}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
  });
  const [admin, analyst, reviewer, viewer] = await Promise.all(
    ["admin", "analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)),
  );
  cookies = { admin, analyst, reviewer, viewer };
});
afterAll(() => db.$client.end());

describe("POST /api/sweep", () => {
  it.each(["analyst", "reviewer", "admin"] as const)(
    "runs the benchmark deck for an %s: 77.24 m/s flutter (docs/conventions.md §Benchmark deck, computed) in the result format",
    async (role) => {
      const res = await api(base(), "/api/sweep", { cookie: cookies[role], body: benchmarkDeck() });
      expect(res.status).toBe(200);
      const result = sweepResultSchema.parse(res.body);
      expect(Math.abs(result.flutter!.speed - 77.24) / 77.24).toBeLessThan(1e-3);
      expect(result.modes.map((m) => m.id)).toEqual(["V1", "T1"]);
      expect(result.modes[0].steps).toHaveLength(91);
      expect(result.engine).toBe(ENGINE_VERSION);
    },
  );

  it("refuses a viewer with 403 and an anonymous caller with 401", async () => {
    expect((await api(base(), "/api/sweep", { cookie: cookies.viewer, body: benchmarkDeck() })).status).toBe(403);
    expect((await api(base(), "/api/sweep", { body: benchmarkDeck() })).status).toBe(401);
  });

  it("answers 400 naming each bad field's JSON path and rule", async () => {
    const study = benchmarkDeck() as Record<string, any>;
    study.structure.modes[1].frequency = -0.2;
    study.sweep.step = 0;
    delete study.deck.width;
    const res = await api(base(), "/api/sweep", { cookie: cookies.analyst, body: study });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_study");
    // one format of the invalid_study message, the same as saving or importing a revision
    expect(res.body.error.message).toMatch(/^The study document is not valid \(\d+ problems\): \$\.\S+ /);
    expect(res.body.error.details).toEqual(
      expect.arrayContaining([
        { path: "$.structure.modes[1].frequency", message: "must be greater than 0" },
        { path: "$.sweep.step", message: "must be greater than 0" },
        { path: "$.deck.width", message: "is required" },
      ]),
    );
  });

  it("refuses a body over 1 MB with 413", async () => {
    const study = { ...benchmarkDeck(), name: "x".repeat(1_100_000) };
    const res = await api(base(), "/api/sweep", { cookie: cookies.analyst, body: study });
    expect(res.status).toBe(413);
  });

  it("returns the same result as runSweep run in this process", async () => {
    const res = await api(base(), "/api/sweep", { cookie: cookies.analyst, body: benchmarkDeck() });
    expect(res.status).toBe(200);
    const parsed = parseStudy(benchmarkDeck());
    if (!parsed.ok) throw new Error("benchmark deck must be valid");
    expect(res.body).toEqual(JSON.parse(JSON.stringify(runSweep(parsed.study))));
  });

  it("answers /api/health while heavy sweeps run (they run in worker threads, not on the request thread)", async () => {
    // Three sweeps at the format's maximum of 20 000 steps: each takes several hundred ms of CPU.
    const heavy = benchmarkDeckInputs({ from: 0, to: 400, step: 0.02 });
    let sweepsDone = 0;
    const sweeps = [0, 1, 2].map(() =>
      api(base(), "/api/sweep", { cookie: cookies.analyst, body: heavy }).then((r) => {
        sweepsDone++;
        return r;
      }),
    );
    await new Promise((resolve) => setTimeout(resolve, 100));
    const health = await api(base(), "/api/health");
    const doneWhenHealthAnswered = sweepsDone;
    const results = await Promise.all(sweeps);
    expect(health.status).toBe(200);
    // Run on the request thread, the sweeps would have held the health check back until all three had finished.
    expect(doneWhenHealthAnswered).toBeLessThan(3);
    for (const r of results) expect(r.status).toBe(200);
  });

  it("stops a sweep over STILLSPAN_SWEEP_TIMEOUT_MS with 422 sweep_timeout naming the limit", async () => {
    const app = await startTestApp();
    const previous = process.env.STILLSPAN_SWEEP_TIMEOUT_MS;
    process.env.STILLSPAN_SWEEP_TIMEOUT_MS = "5";
    try {
      const cookie = await signIn(app.baseUrl, "analyst@stillspan.test");
      const res = await api(app.baseUrl, "/api/sweep", { cookie, body: benchmarkDeckInputs({ from: 0, to: 400, step: 0.02 }) });
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe("sweep_timeout");
      expect(res.body.error.message).toContain("time limit of 5 ms");
    } finally {
      if (previous === undefined) delete process.env.STILLSPAN_SWEEP_TIMEOUT_MS;
      else process.env.STILLSPAN_SWEEP_TIMEOUT_MS = previous;
      await app.close();
    }
  });
});
