/**
 * Stored revisions keep their result bounded (thinned branches in the revision row) and their full step table
 * apart, compressed, streamed only on download.
 */
import { gunzipSync } from "node:zlib";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { denseTableDeck } from "../../shared/engine/__tests__/support/extreme-deck.js";
import { runSweep } from "../../shared/engine/run-sweep.js";
import { parseStudy } from "../../shared/schemas/study.js";
import { canonicalSha256Hex } from "../../server/lib/hash.js";
import { stepsCsvChunks } from "../../server/lib/steps-table.js";
import { appendRevision } from "../../server/services/revisions.js";
import { createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, rawRequest, signIn } from "../support/http.js";
import { createAlternativeAndStudy, inventedStudy } from "../support/workspace.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
let projectId: number;
let analyst: string;
let reviewer: string;
let viewer: string;
/** A revision of a long sweep (about 26,000 solved speeds per branch) and its answer. */
let long: { id: string; body: any; bytes: number };

beforeAll(async () => {
  projectId = await createProjectWithMembers(db, `Revision steps test ${Date.now().toString(36)}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
  });
  [analyst, reviewer, viewer] = await Promise.all(["analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)));
  const { studyId } = await createAlternativeAndStudy(base(), analyst, projectId);
  const study = { ...denseTableDeck(0.05), name: "Long sweep (test only)" };
  const saved = await api(base(), `/api/studies/${studyId}/revisions`, { cookie: analyst, body: { parentRevision: 1, changeNote: "long sweep", study } });
  if (saved.status !== 201) throw new Error(`save: ${saved.status} ${JSON.stringify(saved.body)}`);
  const read = await rawRequest(base(), `/api/revisions/${saved.body.id}`, { cookie: reviewer });
  long = { id: saved.body.id, body: JSON.parse(read.body.toString()), bytes: read.body.byteLength };
}, 120_000);
afterAll(() => db.$client.end());

describe("a stored revision of a long sweep", () => {
  it("reads back under 2 MB, its branches thinned and the numbers of solved and shown steps stated", () => {
    expect(long.bytes).toBeLessThan(2e6);
    const { sampling, modes } = long.body.result;
    expect(sampling.solvedSteps).toBeGreaterThan(20_000);
    expect(sampling.shownSteps).toBeLessThanOrEqual(2000);
    for (const m of modes) expect(m.steps).toHaveLength(sampling.shownSteps);
    expect(long.body.assessment.assessment.sweep.lastSolvedMps).toBe(500);
  });

  it("keeps the full table apart, compressed, and append-only like the revision", async () => {
    const { rows } = await db.execute<{ row_count: number; bytes: number }>(
      sql`select row_count, octet_length(csv_gzip)::int as bytes from study_revision_tables where revision_id = ${Number(long.id)}`,
    );
    expect(rows[0].row_count).toBe(2 * long.body.result.sampling.solvedSteps);
    expect(rows[0].bytes).toBeLessThan(rows[0].row_count * 150);
    await expect(db.$client.query("update study_revision_tables set row_count = 0 where revision_id = $1", [Number(long.id)])).rejects.toThrow(/append-only: UPDATE refused/);
    await expect(db.$client.query("delete from study_revision_tables where revision_id = $1", [Number(long.id)])).rejects.toThrow(/append-only: DELETE refused/);
  });

  it("streams every solved step as CSV (gzip as stored when accepted, plain otherwise)", async () => {
    const gz = await rawRequest(base(), `/api/revisions/${long.id}/steps.csv`, { cookie: reviewer, headers: { "Accept-Encoding": "gzip" } });
    expect(gz.status).toBe(200);
    expect(gz.headers["content-encoding"]).toBe("gzip");
    expect(gz.headers["content-disposition"]).toBe("attachment; filename=test-study-r2-steps.csv");
    const text = gunzipSync(gz.body).toString();
    const lines = text.trimEnd().split("\r\n");
    expect(lines).toHaveLength(2 * long.body.result.sampling.solvedSteps + 1);
    expect(lines[0]).toBe("branch,speed_m_s,frequency_hz,damping_ratio,re_rad_s,im_rad_s,participation_V1,participation_T1,mac,confidence");
    const plain = await rawRequest(base(), `/api/revisions/${long.id}/steps.csv`, { cookie: analyst });
    expect(plain.headers["content-encoding"]).toBeUndefined();
    expect(plain.body.toString()).toBe(text);
  });

  it("streams every solved step as JSON, each shown step among them", async () => {
    const res = await api(base(), `/api/revisions/${long.id}/steps.json`, { cookie: reviewer });
    expect(res.status).toBe(200);
    expect(res.body.engine).toBe(long.body.engineVersion);
    expect(res.body.modes.map((m: { id: string }) => m.id)).toEqual(["V1", "T1"]);
    for (const [j, mode] of res.body.modes.entries()) {
      expect(mode.steps).toHaveLength(long.body.result.sampling.solvedSteps);
      const bySpeed = new Map(mode.steps.map((s: { speed: number }) => [s.speed, s]));
      for (const shown of long.body.result.modes[j].steps) expect(bySpeed.get(shown.speed)).toEqual(shown);
    }
  });

  it("is refused to viewers (403) and unknown revisions (404)", async () => {
    expect((await api(base(), `/api/revisions/${long.id}/steps.csv`, { cookie: viewer })).status).toBe(403);
    expect((await api(base(), "/api/revisions/999999999/steps.json", { cookie: reviewer })).status).toBe(404);
  });
});

describe("a revision stored before step tables were kept apart", () => {
  it("streams its table from the steps in its stored result", async () => {
    const { studyId } = await createAlternativeAndStudy(base(), analyst, projectId);
    const parsed = parseStudy(inventedStudy());
    if (!parsed.ok) throw new Error("fixture study is invalid");
    const result = runSweep(parsed.study);
    const author = { id: await userId(db, "analyst@stillspan.test") };
    const { id } = await db.transaction((tx) =>
      appendRevision(tx, author, Number(studyId), { parentRevision: 1, changeNote: "as before", study: parsed.study }, { result, table: null }, canonicalSha256Hex(parsed.study)),
    );
    const csv = await rawRequest(base(), `/api/revisions/${id}/steps.csv`, { cookie: analyst });
    expect(csv.status).toBe(200);
    expect(csv.body.toString()).toBe(Array.from(stepsCsvChunks(result)).join(""));
  });
});
