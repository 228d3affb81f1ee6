/**
 * Assessments are stored append-only, keyed by what they were computed from: a revision stored before assessments
 * existed (an engine 1.0 result) gets its assessment on first read, once; a new criteria version adds one and the
 * screens show it; a signed summary keeps the one it signed.
 */
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { SweepResult } from "../../shared/schemas/result.js";
import { insertRevision } from "../../server/db/queries/revisions.js";
import { revisionAssessments, signatures } from "../../server/db/schema/index.js";
import { canonicalSha256Hex } from "../../server/lib/hash.js";
import { auditActions, createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";
import { arrangeStudy, signFromPreview, testCriteria, type ArrangedStudy } from "../support/review.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
let projectId: number;
let arranged: ArrangedStudy;
let cookies: Record<"analyst" | "reviewer", string>;
let legacyId: number;

const assessmentsOf = async (revisionId: number) =>
  db.select({ id: revisionAssessments.id, criteriaVersion: revisionAssessments.criteriaVersion }).from(revisionAssessments).where(eq(revisionAssessments.revisionId, revisionId));

/** A result as engine 1.0.1 stored it: no insideTestedRange, no divergenceOutsideSweep, no warning branches. */
function asStoredBefore(result: SweepResult): SweepResult {
  const old = structuredClone(result) as SweepResult & Record<string, unknown>;
  delete old.divergenceOutsideSweep;
  if (old.flutter) delete old.flutter.insideTestedRange;
  old.warnings = old.warnings.map(({ branch: _b, branches: _s, reducedVelocities: _r, ...w }) => w);
  old.engine = "1.0.1";
  return old;
}

beforeAll(async () => {
  projectId = await createProjectWithMembers(db, `Assessment storage ${Date.now().toString(36)}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
  });
  const [analyst, reviewer] = await Promise.all(["analyst", "reviewer"].map((r) => signIn(base(), `${r}@stillspan.test`)));
  cookies = { analyst, reviewer };
  arranged = await arrangeStudy(base(), analyst, projectId, "Assessment storage study", reviewer);
  // Revision 2, written as an earlier version of Stillspan stored it (the app's API cannot write an old result).
  const first = (await api(base(), `/api/revisions/${arranged.revisionId}`, { cookie: analyst })).body;
  legacyId = await insertRevision(db, {
    studyId: Number(arranged.studyId),
    number: 2,
    parentNumber: 1,
    authorId: await userId(db, "analyst@stillspan.test"),
    changeNote: "Stored by engine 1.0.1, before assessments were kept",
    document: first.study,
    documentSha256: canonicalSha256Hex(first.study),
    engineVersion: "1.0.1",
    result: asStoredBefore(first.result),
    flutterSpeedMps: first.result.flutter.speed,
  });
});
afterAll(() => db.$client.end());

describe("stored assessments", () => {
  it("are computed once when a revision is saved", async () => {
    expect(await assessmentsOf(Number(arranged.revisionId))).toHaveLength(1);
  });

  it("give a revision stored before them an assessment on first read, once, with an audit event, and the same figures", async () => {
    expect(await assessmentsOf(legacyId)).toHaveLength(0);
    const read = await api(base(), `/api/revisions/${legacyId}`, { cookie: cookies.analyst });
    expect(read.status).toBe(200);
    const a = read.body.assessment.assessment;
    expect(a.computedFrom).toMatchObject({ criteriaVersion: 1, results: [{ kind: "sweep", engineVersion: "1.0.1" }] });
    // The same document: the legacy result gives the same figures as the one stored by today's engine.
    const first = (await api(base(), `/api/revisions/${arranged.revisionId}`, { cookie: cookies.analyst })).body.assessment.assessment;
    expect(a.flutter).toEqual(first.flutter);
    expect(a.divergence).toEqual(first.divergence);
    expect(a.margins).toEqual(first.margins);
    expect(await assessmentsOf(legacyId)).toHaveLength(1);
    expect(await auditActions(db, "revision", legacyId)).toContain("assessment.create");
    // Read again, listed, compared: the one stored.
    expect((await api(base(), `/api/revisions/${legacyId}`, { cookie: cookies.analyst })).body.assessment.id).toBe(read.body.assessment.id);
    const list = await api(base(), `/api/studies/${arranged.studyId}/revisions`, { cookie: cookies.analyst });
    expect(list.body.find((r: { id: string }) => r.id === String(legacyId)).assessment.id).toBe(read.body.assessment.id);
    expect(await assessmentsOf(legacyId)).toHaveLength(1);
  });

  it("add one for a new criteria version; a signed summary keeps the one it signed", async () => {
    const before = (await api(base(), `/api/revisions/${legacyId}`, { cookie: cookies.analyst })).body.assessment;
    const reviewerId = await userId(db, "reviewer@stillspan.test");
    expect((await api(base(), `/api/revisions/${legacyId}/submit`, { cookie: cookies.analyst, body: { reviewerId } })).status).toBe(200);
    const signed = await signFromPreview(base(), cookies.reviewer, String(legacyId), "Signed on criteria version 1.");
    expect(signed.status, JSON.stringify(signed.body)).toBe(201);
    const [row] = await db.select({ assessmentId: signatures.assessmentId }).from(signatures).where(eq(signatures.id, Number(signed.body.summaryId)));
    expect(String(row.assessmentId)).toBe(before.id);

    const criteria = testCriteria();
    criteria.wind.basicSpeed = 31;
    const saved = await api(base(), `/api/projects/${projectId}/criteria`, { method: "PUT", cookie: cookies.reviewer, body: { criteria, baseVersion: 1 } });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);

    const after = (await api(base(), `/api/revisions/${legacyId}`, { cookie: cookies.analyst })).body.assessment;
    expect(after.id).not.toBe(before.id);
    expect(after.assessment.computedFrom.criteriaVersion).toBe(2);
    expect(after.assessment.margins.flutter.requiredSpeedMps).toBeGreaterThan(before.assessment.margins.flutter.requiredSpeedMps);
    expect((await assessmentsOf(legacyId)).map((r) => r.criteriaVersion).sort()).toEqual([1, 2]);

    const summary = await api(base(), `/api/summaries/${signed.body.summaryId}`, { cookie: cookies.reviewer });
    expect(summary.body.payload.assessmentId).toBe(before.id);
    expect(summary.body.payload.assessment).toEqual(before.assessment);
    // The first assessment is kept as it was.
    const { rows } = await db.execute<{ assessment: unknown }>(sql`select assessment from revision_assessments where id = ${Number(before.id)}`);
    expect(rows[0].assessment).toEqual(before.assessment);
  });
});
