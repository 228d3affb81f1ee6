import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { canonicalJson } from "../../shared/canonical-json.js";
import { ENGINE_VERSION } from "../../shared/engine/version.js";
import { runSweep } from "../../shared/engine/run-sweep.js";
import { parseStudy } from "../../shared/schemas/study.js";
import { canonicalSha256Hex } from "../../server/lib/hash.js";
import { appendRevision } from "../../server/services/revisions.js";
import { createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";
import { auditSince, createAlternativeAndStudy, inventedStudy, lastAuditId, rowCounts, upload } from "../support/workspace.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
let projectId: number;
let analyst: string;
let admin: string;
let reviewer: string;

beforeAll(async () => {
  projectId = await createProjectWithMembers(db, `Revisions test ${Date.now().toString(36)}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
  });
  [analyst, admin, reviewer] = await Promise.all(
    ["analyst", "admin", "reviewer"].map((r) => signIn(base(), `${r}@stillspan.test`)),
  );
});
afterAll(() => db.$client.end());

const post = (studyId: string, cookie: string, body: unknown) =>
  api(base(), `/api/studies/${studyId}/revisions`, { cookie, body });

describe("POST /api/studies/:id/revisions", () => {
  it("stores revision 2 with its canonical hash, engine version and computed result, and marks revision 1 superseded", async () => {
    const { alternativeId, studyId, revision1Id } = await createAlternativeAndStudy(base(), analyst, projectId);
    const alternative = await api(base(), `/api/alternatives/${alternativeId}`, { cookie: reviewer });
    expect(alternative.body).toMatchObject({ studyCount: 1, datasetCount: 0, deckWidthM: 27.5, image: null });
    const study = inventedStudy();
    study.structure.modes[1].frequency = 0.31;

    const res = await post(studyId, analyst, { parentRevision: 1, changeNote: "Torsional frequency 0.342 → 0.31 Hz", study });

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ number: 2, parentNumber: 1, superseded: false, engineVersion: ENGINE_VERSION, author: { name: "Tomas Reedwell" } });
    expect(res.body.documentSha256).toBe(canonicalSha256Hex(study));
    expect(res.body.study).toEqual(study);
    expect(res.body.result.engine).toBe(ENGINE_VERSION);
    expect(res.body.result.flutter.speed).toBeGreaterThan(0);
    expect(res.body.assessment.assessment.flutter.speedMps).toBe(res.body.result.flutter.speed);
    const study2 = await api(base(), `/api/studies/${studyId}`, { cookie: reviewer });
    expect(study2.body).toMatchObject({ revisionCount: 2, latestRevision: { number: 2 } });
    const first = await api(base(), `/api/revisions/${revision1Id}`, { cookie: reviewer });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ number: 1, superseded: true, latestNumber: 2 });
    // A lower torsional frequency lowers the flutter speed: the two stored results differ.
    expect(res.body.result.flutter.speed).toBeLessThan(first.body.result.flutter.speed);
  });

  it("refuses revision 2 without a change note (400) and writes nothing", async () => {
    const { studyId } = await createAlternativeAndStudy(base(), analyst, projectId);
    const before = await rowCounts(db);
    const res = await post(studyId, analyst, { parentRevision: 1, changeNote: "  ", study: inventedStudy() });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/change note is required/);
    expect(await rowCounts(db)).toEqual(before);
  });

  it("refuses an invalid document with 400 invalid_study naming each JSON path, and writes nothing", async () => {
    const { studyId } = await createAlternativeAndStudy(base(), analyst, projectId);
    const study = inventedStudy();
    study.structure.modes[0].frequency = "fast";
    study.sweep.colour = "red";
    const before = await rowCounts(db);
    const res = await post(studyId, analyst, { parentRevision: 1, changeNote: "broken", study });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_study");
    expect(res.body.error.details).toEqual(
      expect.arrayContaining([
        { path: "$.structure.modes[0].frequency", message: "must be a number" },
        { path: "$.sweep.colour", message: "is not a field of this format" },
      ]),
    );
    expect(await rowCounts(db)).toEqual(before);
  });

  it("answers 409 on a stale parent, naming the newer revision and its author, returning the rejected document, storing nothing", async () => {
    const { studyId } = await createAlternativeAndStudy(base(), analyst, projectId);
    const byAdmin = inventedStudy();
    byAdmin.structure.mass = 16000;
    expect((await post(studyId, admin, { parentRevision: 1, changeNote: "mass 16 000 kg/m", study: byAdmin })).status).toBe(201);
    const mine = inventedStudy();
    mine.structure.modes[0].damping = 0.006;
    const before = await rowCounts(db);

    const res = await post(studyId, analyst, { parentRevision: 1, changeNote: "heave damping 0.6 %", study: mine });

    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("stale_parent");
    expect(res.body.error.message).toContain("Revision 2 by Ada Quillfeather");
    expect(res.body.error.details.latest).toMatchObject({ number: 2, author: { name: "Ada Quillfeather" } });
    expect(res.body.error.details.rejected).toEqual({ parentRevision: 1, changeNote: "heave damping 0.6 %", study: mine });
    expect(await rowCounts(db)).toEqual(before);
  });

  it("gives exactly one 201 and one 409 to two saves on the same parent fired together, with no gaps in the numbers", async () => {
    const { studyId } = await createAlternativeAndStudy(base(), analyst, projectId);
    for (let round = 1; round <= 3; round++) {
      const a = inventedStudy();
      a.structure.mass = 15000 + round;
      const b = inventedStudy();
      b.structure.mass = 15500 + round;
      const bodyA = { parentRevision: round, changeNote: `analyst round ${round}`, study: a };
      const bodyB = { parentRevision: round, changeNote: `admin round ${round}`, study: b };

      const results = await Promise.all([post(studyId, analyst, bodyA), post(studyId, admin, bodyB)]);

      const statuses = results.map((r) => r.status).sort();
      expect(statuses, `round ${round}`).toEqual([201, 409]);
      const winner = results.find((r) => r.status === 201)!;
      const loser = results.find((r) => r.status === 409)!;
      expect(winner.body.number).toBe(round + 1);
      const loserBody = loser === results[0] ? bodyA : bodyB;
      expect(loser.body.error.details.rejected).toEqual(loserBody);
      expect(loser.body.error.details.latest.number).toBe(round + 1);
    }
    const list = await api(base(), `/api/studies/${studyId}/revisions`, { cookie: reviewer });
    expect(list.body.map((r: { number: number }) => r.number)).toEqual([1, 2, 3, 4]);
    expect(list.body.map((r: { superseded: boolean }) => r.superseded)).toEqual([true, true, true, false]);
  });
});

describe("the row lock on the study", () => {
  it("makes a second append on the same parent wait for the first one's commit, then refuses it with 409", async () => {
    const { studyId } = await createAlternativeAndStudy(base(), analyst, projectId);
    const parsed = parseStudy(inventedStudy());
    if (!parsed.ok) throw new Error("fixture study is invalid");
    const study = parsed.study;
    const computed = { result: runSweep(study), table: null };
    const sha = canonicalSha256Hex(study);
    const author = { id: await userId(db, "analyst@stillspan.test") };
    const events: string[] = [];
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    let inserted!: () => void;
    const firstInserted = new Promise<void>((resolve) => (inserted = resolve));

    const first = db.transaction(async (tx) => {
      await appendRevision(tx, author, Number(studyId), { parentRevision: 1, changeNote: "first", study }, computed, sha);
      events.push("first inserted");
      inserted();
      await held;
      events.push("first commits");
    });
    await firstInserted;
    const second = db
      .transaction((tx) => appendRevision(tx, author, Number(studyId), { parentRevision: 1, changeNote: "second", study }, computed, sha))
      .then(
        () => "stored",
        (err: { status?: number; code?: string }) => `${err.status} ${err.code}`,
      )
      .finally(() => events.push("second answered"));
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(events, "the second append must be waiting on the lock").toEqual(["first inserted"]);

    release();
    await first;

    expect(await second).toBe("409 stale_parent");
    expect(events).toEqual(["first inserted", "first commits", "second answered"]);
  });
});

describe("reading, diffing and re-running revisions", () => {
  it("diffs two revisions field by field with JSON paths and old and new values", async () => {
    const { studyId, revision1Id } = await createAlternativeAndStudy(base(), analyst, projectId);
    const study = inventedStudy();
    study.structure.modes[1].frequency = 0.3;
    study.aerodynamics.A2[5] = -1.2;
    study.name = "Revised";
    const second = await post(studyId, analyst, { parentRevision: 1, changeNote: "three edits", study });

    const res = await api(base(), `/api/revisions/${revision1Id}/diff/${second.body.id}`, { cookie: reviewer });

    expect(res.status).toBe(200);
    expect(res.body.identical).toBe(false);
    expect(res.body.changes).toEqual([
      { path: "$.aerodynamics.A2[5]", kind: "changed", old: -1.06, new: -1.2 },
      { path: "$.name", kind: "changed", old: inventedStudy().name, new: "Revised" },
      { path: "$.structure.modes[1].frequency", kind: "changed", old: 0.342, new: 0.3 },
    ]);
  });

  it("re-runs a revision with the current engine as a new revision, leaving the stored one untouched", async () => {
    const { studyId, revision1Id } = await createAlternativeAndStudy(base(), analyst, projectId);
    const before = await api(base(), `/api/revisions/${revision1Id}`, { cookie: analyst });

    const res = await api(base(), `/api/revisions/${revision1Id}/rerun`, { cookie: analyst, body: { parentRevision: 1 } });

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ number: 2, changeNote: `re-run with engine ${ENGINE_VERSION}`, documentSha256: before.body.documentSha256 });
    const after = await api(base(), `/api/revisions/${revision1Id}`, { cookie: analyst });
    expect(after.body.result).toEqual(before.body.result);
    expect(after.body.createdAt).toBe(before.body.createdAt);
    expect((await api(base(), `/api/studies/${studyId}/revisions`, { cookie: analyst })).body).toHaveLength(2);
  });

  it("refuses a re-run and an import on a stale base with 409 stale_parent, and either without a base with 400; nothing stored", async () => {
    const { studyId, revision1Id } = await createAlternativeAndStudy(base(), analyst, projectId);
    // Someone saves revision 2 while the re-run button still shows revision 1 as the newest.
    const saved = inventedStudy();
    saved.structure.mass = 16100;
    expect((await api(base(), `/api/studies/${studyId}/revisions`, { cookie: analyst, body: { parentRevision: 1, changeNote: "mass", study: saved } })).status).toBe(201);
    const counts = await rowCounts(db);

    const staleRerun = await api(base(), `/api/revisions/${revision1Id}/rerun`, { cookie: analyst, body: { parentRevision: 1 } });
    expect(staleRerun.status).toBe(409);
    expect(staleRerun.body.error.code).toBe("stale_parent");
    expect(staleRerun.body.error.details.latest.number).toBe(2);
    const noBase = await api(base(), `/api/revisions/${revision1Id}/rerun`, { cookie: analyst, method: "POST" });
    expect(noBase.status).toBe(400);
    expect(noBase.body.error.details).toEqual([expect.objectContaining({ path: "parentRevision" })]);

    const file = { name: "s.json", bytes: new TextEncoder().encode(JSON.stringify(inventedStudy())), type: "application/json" };
    const staleImport = await upload(base(), `/api/studies/${studyId}/import`, { cookie: analyst, field: "file", file, fields: { parentRevision: "1", changeNote: "late import" } });
    expect(staleImport.status).toBe(409);
    expect(staleImport.body.error.code).toBe("stale_parent");
    const importNoBase = await upload(base(), `/api/studies/${studyId}/import`, { cookie: analyst, field: "file", file, fields: { changeNote: "no base" } });
    expect(importNoBase.status).toBe(400);
    expect(importNoBase.body.error.details).toEqual([expect.objectContaining({ path: "parentRevision" })]);
    expect(await rowCounts(db)).toEqual(counts);

    // On the current base the re-run goes through, on top of revision 2, with revision 1's document.
    const rerun = await api(base(), `/api/revisions/${revision1Id}/rerun`, { cookie: analyst, body: { parentRevision: 2 } });
    expect(rerun.status).toBe(201);
    expect(rerun.body).toMatchObject({ number: 3, parentNumber: 2, changeNote: `re-run with engine ${ENGINE_VERSION} (document of revision 1)` });
  });

  it("round-trips export → import → export to the identical canonical JSON and hash", async () => {
    const { studyId } = await createAlternativeAndStudy(base(), analyst, projectId);
    // Numbers that a careless store (float4, fixed decimals, text rounding) would change.
    const awkward = inventedStudy();
    awkward.aerodynamics.H1 = [-0.30000000000000004, -1e-7, -3.3, -4.52, -5.8, -12345.678901234567];
    awkward.structure.inertia = 1450000.0000000002;
    awkward.air.density = 1.2250000000000003; // the double after 1.225
    const saved = await post(studyId, analyst, { parentRevision: 1, changeNote: "awkward numbers", study: awkward });
    expect(saved.status).toBe(201);
    expect(saved.body.study).toEqual(awkward);
    const revision1Id = saved.body.id;
    const first = await fetch(`${base()}/api/revisions/${revision1Id}/export`, { headers: { Cookie: analyst } });
    expect(first.status).toBe(200);
    expect(first.headers.get("content-disposition")).toMatch(/^attachment; filename="?[a-z0-9-]+-r2\.study\.json"?$/);
    const text1 = await first.text();
    const hash1 = first.headers.get("x-content-sha256");

    const imported = await upload(base(), `/api/studies/${studyId}/import`, {
      cookie: analyst,
      field: "file",
      file: { name: "exported.study.json", bytes: new TextEncoder().encode(text1), type: "application/json" },
      fields: { parentRevision: "2", changeNote: "imported back" },
    });
    expect(imported.status).toBe(201);
    const second = await fetch(`${base()}/api/revisions/${imported.body.id}/export`, { headers: { Cookie: analyst } });
    const text2 = await second.text();

    expect(canonicalJson(JSON.parse(text2))).toBe(canonicalJson(JSON.parse(text1)));
    expect(second.headers.get("x-content-sha256")).toBe(hash1);
    expect(imported.body.documentSha256).toBe(hash1);
    expect(canonicalSha256Hex(JSON.parse(text2))).toBe(hash1);
  });
});

describe("study_revisions is append-only in PostgreSQL", () => {
  it("refuses a raw UPDATE and a raw DELETE with the trigger's message", async () => {
    const { revision1Id } = await createAlternativeAndStudy(base(), analyst, projectId);
    const id = Number(revision1Id);
    // Through pg directly: the error is PostgreSQL's own, raised by the trigger of migration 0003.
    await expect(db.$client.query("update study_revisions set change_note = 'tampered' where id = $1", [id])).rejects.toThrow(
      /append-only: UPDATE refused/,
    );
    await expect(db.$client.query("delete from study_revisions where id = $1", [id])).rejects.toThrow(/append-only: DELETE refused/);
    const { rows } = await db.execute<{ change_note: string }>(sql`select change_note from study_revisions where id = ${id}`);
    expect(rows).toEqual([{ change_note: "" }]);
  });
});

describe("audit trail", () => {
  it("records exactly one audit event with the right actor for each write", async () => {
    const analystId = await userId(db, "analyst@stillspan.test");
    const adminId = await userId(db, "admin@stillspan.test");
    const steps: { label: string; actor: number; action: string; run: () => Promise<{ status: number }> }[] = [];
    let altId = "";
    let studyId = "";
    let revisionId = "";
    steps.push({
      label: "create alternative",
      actor: analystId,
      action: "alternative.create",
      run: async () => {
        const r = await api(base(), `/api/projects/${projectId}/alternatives`, { cookie: analyst, body: { name: "Audit deck", deckWidthM: 30, deckDepthM: 3 } });
        altId = r.body.id;
        return r;
      },
    });
    steps.push({
      label: "edit alternative",
      actor: adminId,
      action: "alternative.update",
      run: () => api(base(), `/api/alternatives/${altId}`, { cookie: admin, method: "PATCH", body: { description: "edited by the admin" } }),
    });
    steps.push({
      label: "create study with a document",
      actor: analystId,
      action: "study.create",
      run: async () => {
        const r = await api(base(), `/api/alternatives/${altId}/studies`, { cookie: analyst, body: { name: "Audit study", study: inventedStudy() } });
        studyId = r.body.id;
        return r;
      },
    });
    steps.push({
      label: "save revision",
      actor: adminId,
      action: "revision.create",
      run: async () => {
        const s = inventedStudy();
        s.structure.mass = 15900;
        const r = await post(studyId, admin, { parentRevision: 1, changeNote: "mass", study: s });
        revisionId = r.body.id;
        return r;
      },
    });
    steps.push({
      label: "re-run",
      actor: analystId,
      action: "revision.create",
      run: () => api(base(), `/api/revisions/${revisionId}/rerun`, { cookie: analyst, body: { parentRevision: 2 } }),
    });
    steps.push({
      label: "rename study",
      actor: analystId,
      action: "study.update",
      run: () => api(base(), `/api/studies/${studyId}`, { cookie: analyst, method: "PATCH", body: { purpose: "audited" } }),
    });
    for (const step of steps) {
      const from = await lastAuditId(db);
      const res = await step.run();
      expect(res.status, step.label).toBeLessThan(300);
      const events = await auditSince(db, from);
      expect(events.map((e) => [e.action, e.actor_id]), step.label).toEqual([[step.action, step.actor]]);
    }
  });
});
