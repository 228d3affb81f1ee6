/**
 * Signing only what a signer can stand behind: criteria whose basis a reviewer confirmed, and the summary exactly as
 * the reviewer read it on the preview. Also the review states the study screens show, the rule that a superseded
 * returned revision is not submitted again, and the queue's warning count against the study's.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEFAULT_REQUIREMENTS } from "../../shared/criteria/default-requirements.js";
import { PHENOMENA } from "../../shared/schemas/criteria.js";
import { auditActions, createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";
import { addRevision, arrangeStudy, testCriteria, type ArrangedStudy } from "../support/review.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
const suffix = Date.now().toString(36);
let projectId: number;
let arranged: ArrangedStudy;
let cookies: Record<"analyst" | "reviewer" | "viewer", string>;
let reviewerId: number;
const revisionIds: Record<number, string> = {};

const preview = (revisionId: string, cookie = cookies.reviewer) => api(base(), `/api/revisions/${revisionId}/summary-preview`, { cookie });
const submit = (revisionId: string) => api(base(), `/api/revisions/${revisionId}/submit`, { cookie: cookies.analyst, body: { reviewerId } });
const sign = (revisionId: string, previewSha256: string, statement = "Checked against the project's criteria.") =>
  api(base(), `/api/revisions/${revisionId}/sign`, { cookie: cookies.reviewer, body: { statement, previewSha256 } });
const criteriaNow = async () => (await api(base(), `/api/projects/${projectId}/criteria`, { cookie: cookies.reviewer })).body;

beforeAll(async () => {
  projectId = await createProjectWithMembers(db, `Sign-off crossing ${suffix}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
  });
  const [analyst, reviewer, viewer] = await Promise.all(["analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)));
  cookies = { analyst, reviewer, viewer };
  reviewerId = await userId(db, "reviewer@stillspan.test");
  // The criteria keep the shipped default bases, unconfirmed.
  arranged = await arrangeStudy(base(), analyst, projectId, `Sign-off study ${suffix}`, reviewer, { confirmCriteria: false });
  revisionIds[1] = arranged.revisionId;
});
afterAll(() => db.$client.end());

describe("criteria a signer can stand behind", () => {
  it("refuses to sign while a criterion's basis is still the default text, naming each (409), and signs once a reviewer confirmed them", async () => {
    expect((await submit(revisionIds[1])).status).toBe(200);
    const before = await preview(revisionIds[1]);
    expect(before.status, JSON.stringify(before.body)).toBe(200);
    expect(before.body.unconfirmedBases).toEqual(PHENOMENA.map((phenomenon) => ({ phenomenon, defaultText: true })));
    expect(before.body.signBlocker).toMatch(/flutter, torsional divergence, vortex-shedding onset, galloping onset still have the default basis text/);
    expect(before.body.canDecide).toBe(true); // the assigned reviewer may still return it
    // The analyst reads the same summary, with no decision to make.
    const asAnalyst = await preview(revisionIds[1], cookies.analyst);
    expect(asAnalyst.body).toMatchObject({ previewSha256: before.body.previewSha256, canDecide: false });
    expect(asAnalyst.body.signBlocker).toBe("Only a reviewer of this project can sign a revision; your role is analyst.");

    const refused = await sign(revisionIds[1], before.body.previewSha256);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("criteria_unconfirmed");
    expect(refused.body.error.message).toMatch(/^In version 1 of the project's criteria, flutter, torsional divergence, vortex-shedding onset, galloping onset still have the default basis text\./);
    expect(refused.body.error.details).toEqual({ criteriaVersion: 1, unconfirmed: before.body.unconfirmedBases });
    expect((await api(base(), `/api/revisions/${revisionIds[1]}/review`, { cookie: cookies.analyst })).body).toMatchObject({ state: "in-review", signature: null });
    expect(await auditActions(db, "revision", revisionIds[1])).not.toContain("review.sign");

    // The reviewer confirms the four bases as they stand: a new criteria version, same content.
    const current = await criteriaNow();
    const confirmed = await api(base(), `/api/projects/${projectId}/criteria`, {
      method: "PUT",
      cookie: cookies.reviewer,
      body: { criteria: current.criteria, baseVersion: current.version, confirmBases: [...PHENOMENA] },
    });
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200);
    const after = await preview(revisionIds[1]);
    expect(after.body).toMatchObject({ unconfirmedBases: [], signBlocker: null, criteriaVersion: 2 });
    // Confirming saves a new criteria version, so the summary states a new assessment (against version 2): the
    // preview read before is outdated, and the one read after is what gets signed.
    expect(after.body.payload.assessment.computedFrom.criteriaVersion).toBe(2);
    expect(after.body.previewSha256).not.toBe(before.body.previewSha256);
    expect((await sign(revisionIds[1], before.body.previewSha256, "Signed against confirmed criteria.")).body.error.code).toBe("preview_outdated");
    const signed = await sign(revisionIds[1], after.body.previewSha256, "Signed against confirmed criteria.");
    expect(signed.status, JSON.stringify(signed.body)).toBe(201);

    // What was signed is the preview, with only the statement and the time of signing added (the signing time is
    // also the sign-off block's time of checking and approval).
    const summary = await api(base(), `/api/summaries/${signed.body.summaryId}`, { cookie: cookies.viewer });
    const withoutSigningTime = ({ signedAt, statement: _s, ...rest }: Record<string, any>) => {
      expect(rest.signoff.checked.at).toBe(signedAt);
      expect(rest.signoff.approved.at).toBe(signedAt);
      return { ...rest, signoff: { ...rest.signoff, checked: { ...rest.signoff.checked, at: null }, approved: { ...rest.signoff.approved, at: null } } };
    };
    const statement = summary.body.payload.statement;
    expect(withoutSigningTime(summary.body.payload)).toEqual(withoutSigningTime(after.body.payload));
    expect(statement).toBe("Signed against confirmed criteria.");
  });

  it("refuses a signature whose preview is outdated (409 preview_outdated) and signs after the reviewer reads the new one", async () => {
    revisionIds[2] = await addRevision(base(), cookies.analyst, arranged.studyId, 1, 0.0045);
    expect((await submit(revisionIds[2])).status).toBe(200);
    const read = await preview(revisionIds[2]);
    expect(read.status).toBe(200);
    // The flutter factor changes after the reviewer read the summary: its required speed and margin change with it.
    const current = await criteriaNow();
    const edited = structuredClone(current.criteria);
    edited.requirements.flutter = { factor: 1.3, basis: "Owner's specification, clause 4.1 (invented for the test)" };
    expect((await api(base(), `/api/projects/${projectId}/criteria`, { method: "PUT", cookie: cookies.reviewer, body: { criteria: edited, baseVersion: current.version } })).status).toBe(200);

    const refused = await sign(revisionIds[2], read.body.previewSha256);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("preview_outdated");
    expect(refused.body.error.message).toMatch(/differs from the preview you read/);
    expect((await api(base(), `/api/revisions/${revisionIds[2]}/review`, { cookie: cookies.analyst })).body.state).toBe("in-review");

    const reread = await preview(revisionIds[2]);
    expect(reread.body.previewSha256).not.toBe(read.body.previewSha256);
    const flutter = reread.body.payload.assessment.required.find((c: { phenomenon: string }) => c.phenomenon === "flutter");
    expect(flutter.basis).toContain("Owner's specification, clause 4.1 (invented for the test)");
    const signed = await sign(revisionIds[2], reread.body.previewSha256);
    expect(signed.status, JSON.stringify(signed.body)).toBe(201);
  });

  it("refuses a sign request without the preview's hash (400 naming previewSha256)", async () => {
    const res = await api(base(), `/api/revisions/${revisionIds[2]}/sign`, { cookie: cookies.reviewer, body: { statement: "No preview read." } });
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(["previewSha256"]);
  });

  it("answers the preview of a signed revision with 409 naming its signed summary, and gives viewers no preview (403)", async () => {
    const res = await preview(revisionIds[1]);
    expect(res.status).toBe(409);
    expect(res.body.error.details.summaryId).toMatch(/^\d+$/);
    expect((await preview(revisionIds[2], cookies.viewer)).status).toBe(403);
  });
});

describe("review states and resubmission", () => {
  it("does not submit again a returned revision that a newer revision supersedes (409 superseded); the newer one goes", async () => {
    revisionIds[3] = await addRevision(base(), cookies.analyst, arranged.studyId, 2, 0.0044);
    expect((await submit(revisionIds[3])).status).toBe(200);
    const returned = await api(base(), `/api/revisions/${revisionIds[3]}/return`, { cookie: cookies.reviewer, body: { comments: "Extend the sweep." } });
    expect(returned.status).toBe(200);
    revisionIds[4] = await addRevision(base(), cookies.analyst, arranged.studyId, 3, 0.0043);

    const again = await submit(revisionIds[3]);
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: "superseded", details: { latestNumber: 4, latestRevisionId: revisionIds[4] } });
    expect(again.body.error.message).toBe("Revision 3 was returned and revision 4 supersedes it: submit revision 4 instead.");
    expect((await api(base(), `/api/revisions/${revisionIds[3]}/review`, { cookie: cookies.analyst })).body).toMatchObject({ state: "returned", latestNumber: 4 });
    expect((await submit(revisionIds[4])).status).toBe(200);
  });

  it("states each revision's review state: signed and superseded by a later signature, signed, returned and superseded, in review with whom", async () => {
    const study = await api(base(), `/api/studies/${arranged.studyId}/review-states`, { cookie: cookies.analyst });
    expect(study.status).toBe(200);
    const mira = { id: String(reviewerId), name: "Mira Holloway" };
    expect(study.body.map(({ decidedAt: _d, ...rest }: { decidedAt: string | null }) => rest)).toEqual([
      { revisionId: revisionIds[1], studyId: arranged.studyId, number: 1, state: "signed", reviewer: mira, supersededBy: 2 },
      { revisionId: revisionIds[2], studyId: arranged.studyId, number: 2, state: "signed", reviewer: mira, supersededBy: null },
      { revisionId: revisionIds[3], studyId: arranged.studyId, number: 3, state: "returned", reviewer: mira, supersededBy: 4 },
      { revisionId: revisionIds[4], studyId: arranged.studyId, number: 4, state: "in-review", reviewer: mira, supersededBy: null },
    ]);
    expect(study.body[3].decidedAt).toBeNull();
    const project = await api(base(), `/api/projects/${projectId}/review-states`, { cookie: cookies.reviewer });
    expect(project.status).toBe(200);
    expect(project.body).toEqual(study.body);
    // Drafts and reviews are the workspace's: the owner's representative reads signed summaries only.
    expect((await api(base(), `/api/studies/${arranged.studyId}/review-states`, { cookie: cookies.viewer })).status).toBe(403);
    expect((await api(base(), `/api/projects/${projectId}/review-states`, { cookie: cookies.viewer })).status).toBe(403);
  });

  it("counts in the review queue the warnings the study page lists (the stored result's list, one per branch)", async () => {
    const queue = await api(base(), "/api/review-queue", { cookie: cookies.reviewer });
    const item = queue.body.find((q: { revisionId: string }) => q.revisionId === revisionIds[4]);
    const revision = await api(base(), `/api/revisions/${revisionIds[4]}`, { cookie: cookies.analyst });
    const codes: string[] = revision.body.result.warnings.map((w: { code: string }) => w.code);
    // The fixture's table is left by both branches: the same kind twice, which a count of kinds would halve.
    expect(new Set(codes).size).toBeLessThan(codes.length);
    // The queue and the study read one stored assessment.
    expect(item.assessment.id).toBe(revision.body.assessment.id);
    expect(item.assessment.assessment.warningCount).toBe(codes.length);
    expect(revision.body.assessment.assessment.warningCount).toBe(codes.length);
  });
});

describe("the seeded demo", () => {
  it("its signed summary cites no default criteria text: every basis is the crossing's own (invented) design basis", async () => {
    const list = await api(base(), "/api/summaries", { cookie: cookies.viewer });
    const demo = list.body.filter((s: { projectName: string }) => s.projectName.startsWith("Harrowmere"));
    expect(demo.length).toBeGreaterThan(0);
    const defaults = [...Object.values(DEFAULT_REQUIREMENTS).map((r) => r.basis), ...Object.values(testCriteria().requirements).map((r) => r.basis)];
    for (const { id } of demo) {
      const { payload } = (await api(base(), `/api/summaries/${id}`, { cookie: cookies.viewer })).body;
      const text = JSON.stringify(payload);
      for (const basis of defaults) expect(text, `summary ${id}`).not.toContain(basis);
      const criteria = payload.format === "stillspan.summary/1" ? payload.criteria : payload.assessment.required;
      expect(criteria.length).toBeGreaterThan(0);
      for (const criterion of criteria) {
        expect(criterion.basis[0], `${id} ${criterion.phenomenon}`).toMatch(/^Harrowmere Crossing design basis, invented for the demo, clause 7\.\d\.\d/);
      }
    }
  });
});
