import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { insertUser } from "../../server/db/queries/users.js";
import { hashPassword } from "../../server/services/passwords.js";
import { auditActions, createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, DEMO_PASSWORD, signIn } from "../support/http.js";
import { lastAuditId } from "../support/workspace.js";
import { addRevision, ANY_PREVIEW_SHA256, arrangeStudy, signFromPreview, waitForMail, type ArrangedStudy } from "../support/review.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
const suffix = Date.now().toString(36);
const studyName = `Review workflow ${suffix}`;
let projectId: number;
let arranged: ArrangedStudy;
let cookies: Record<"admin" | "analyst" | "reviewer" | "viewer", string>;
let reviewerId: number;
let adminId: number;

beforeAll(async () => {
  projectId = await createProjectWithMembers(db, `Review test crossing ${suffix}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
    "admin@stillspan.test": "reviewer",
  });
  const [admin, analyst, reviewer, viewer] = await Promise.all(
    ["admin", "analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)),
  );
  cookies = { admin, analyst, reviewer, viewer };
  reviewerId = await userId(db, "reviewer@stillspan.test");
  adminId = await userId(db, "admin@stillspan.test");
  arranged = await arrangeStudy(base(), analyst, projectId, studyName, reviewer);
});
afterAll(() => db.$client.end());

const review = (id: string, cookie: string) => api(base(), `/api/revisions/${id}/review`, { cookie });

describe("viewers see no drafts, data sets, studies or revisions", () => {
  it("answers 403 to the viewer on the revision, its review, its study, its alternative's data sets and studies", async () => {
    const urls = [
      `/api/revisions/${arranged.revisionId}`,
      `/api/revisions/${arranged.revisionId}/review`,
      `/api/studies/${arranged.studyId}`,
      `/api/studies/${arranged.studyId}/revisions`,
      `/api/datasets/${arranged.datasetId}`,
      `/api/datasets/${arranged.datasetId}/original`,
      `/api/alternatives/${arranged.alternativeId}/datasets`,
      `/api/alternatives/${arranged.alternativeId}/studies`,
      `/api/projects/${projectId}/alternatives`,
    ];
    for (const url of urls) {
      const res = await api(base(), url, { cookie: cookies.viewer });
      expect(res.status, url).toBe(403);
    }
    // …while the analyst reads the same draft.
    expect((await api(base(), `/api/revisions/${arranged.revisionId}`, { cookie: cookies.analyst })).status).toBe(200);
  });

  it("shows a new revision as a draft with no comments and no signature", async () => {
    const res = await review(arranged.revisionId, cookies.analyst);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: "draft", request: null, comments: [], signature: null, revisionNumber: 1 });
  });
});

describe("submit → return → submit again → sign", () => {
  it("refuses a reviewer who is not a reviewer of the project (400) and signing a draft (409)", async () => {
    const viewerId = await userId(db, "viewer@stillspan.test");
    const bad = await api(base(), `/api/revisions/${arranged.revisionId}/submit`, { cookie: cookies.analyst, body: { reviewerId: viewerId } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/not a reviewer of this project/);
    const sign = await api(base(), `/api/revisions/${arranged.revisionId}/sign`, {
      cookie: cookies.reviewer,
      body: { statement: "Early.", previewSha256: ANY_PREVIEW_SHA256 },
    });
    expect(sign.status).toBe(409);
    expect(sign.body.error.message).toMatch(/draft/);
  });

  it("lets only analysts submit: the reviewer gets 403", async () => {
    const res = await api(base(), `/api/revisions/${arranged.revisionId}/submit`, { cookie: cookies.reviewer, body: { reviewerId } });
    expect(res.status).toBe(403);
  });

  it("submits to the named reviewer, audits it, lists it in their queue and e-mails them", async () => {
    const res = await api(base(), `/api/revisions/${arranged.revisionId}/submit`, {
      cookie: cookies.analyst,
      body: { reviewerId: String(reviewerId), note: "Please check the derivative conversion." },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.state).toBe("in-review");
    expect(res.body.request).toMatchObject({ reviewer: { id: String(reviewerId), name: "Mira Holloway" }, note: "Please check the derivative conversion." });
    expect(await auditActions(db, "revision", arranged.revisionId)).toContain("review.submit");

    const queue = await api(base(), "/api/review-queue", { cookie: cookies.reviewer });
    const item = queue.body.find((q: { revisionId: string }) => q.revisionId === arranged.revisionId);
    expect(item).toMatchObject({ studyName, revisionNumber: 1, requestedBy: { name: "Tomas Reedwell" } });
    // The card states the revision's assessment, the same the study shows.
    const revision = await api(base(), `/api/revisions/${arranged.revisionId}`, { cookie: cookies.reviewer });
    expect(item.assessment).toEqual(revision.body.assessment);
    expect(item.assessment.assessment.flutter.speedMps).toBeGreaterThan(0);

    const [mail] = await waitForMail(base(), cookies.admin, "reviewer@stillspan.test", `Review requested: ${studyName}, revision 1`);
    expect(mail, "review-requested message at the fake SMTP server").toBeDefined();
    expect(mail.to).toEqual(["reviewer@stillspan.test"]);
    expect(mail.text).toContain("Tomas Reedwell asks you to review a study revision.");
    expect(mail.text).toContain("Please check the derivative conversion.");
    expect(mail.text).toMatch(/\/reviews\b/);
    expect(mail.html).toContain("Review requested");
  });

  it("refuses a second submission while in review (409)", async () => {
    const res = await api(base(), `/api/revisions/${arranged.revisionId}/submit`, { cookie: cookies.analyst, body: { reviewerId } });
    expect(res.status).toBe(409);
  });

  it("lets an analyst not sign (403) and not return (403)", async () => {
    const sign = await api(base(), `/api/revisions/${arranged.revisionId}/sign`, {
      cookie: cookies.analyst,
      body: { statement: "Looks fine.", previewSha256: ANY_PREVIEW_SHA256 },
    });
    expect(sign.status).toBe(403);
    const ret = await api(base(), `/api/revisions/${arranged.revisionId}/return`, { cookie: cookies.analyst, body: { comments: "x" } });
    expect(ret.status).toBe(403);
    expect((await review(arranged.revisionId, cookies.analyst)).body.state).toBe("in-review");
  });

  it("returns with comments: stored per revision, shown in the workspace, e-mailed to the analyst", async () => {
    const res = await api(base(), `/api/revisions/${arranged.revisionId}/return`, {
      cookie: cookies.reviewer,
      body: { comments: "Extend the sweep to 150 m/s and state the tested Ur range." },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.state).toBe("returned");
    expect(res.body.comments).toEqual([
      expect.objectContaining({ body: "Extend the sweep to 150 m/s and state the tested Ur range.", author: expect.objectContaining({ name: "Mira Holloway", role: "reviewer" }) }),
    ]);
    expect(res.body.events.map((e: { kind: string }) => e.kind)).toEqual(["submitted", "returned"]);

    const [mail] = await waitForMail(base(), cookies.admin, "analyst@stillspan.test", `Returned with comments: ${studyName}, revision 1`);
    expect(mail, "returned message at the fake SMTP server").toBeDefined();
    expect(mail.to).toEqual(["analyst@stillspan.test"]);
    expect(mail.text).toContain("> Extend the sweep to 150 m/s and state the tested Ur range.");
    expect(mail.text).toContain(`/projects/${projectId}/studies/${arranged.studyId}?revision=1`);
  });

  it("takes comments from the analyst too; the viewer may not comment (403)", async () => {
    const res = await api(base(), `/api/revisions/${arranged.revisionId}/comments`, { cookie: cookies.analyst, body: { body: "Tested range is Ur 2–12." } });
    expect(res.status).toBe(201);
    expect(res.body.comments.at(-1)).toMatchObject({ body: "Tested range is Ur 2–12.", author: { role: "analyst" } });
    const viewer = await api(base(), `/api/revisions/${arranged.revisionId}/comments`, { cookie: cookies.viewer, body: { body: "Hello" } });
    expect(viewer.status).toBe(403);
    const blank = await api(base(), `/api/revisions/${arranged.revisionId}/comments`, { cookie: cookies.analyst, body: { body: "   " } });
    expect(blank.status).toBe(400);
  });

  it("signs after resubmission: 201 with the summary id, e-mail to the analyst and the project's viewer", async () => {
    const again = await api(base(), `/api/revisions/${arranged.revisionId}/submit`, { cookie: cookies.analyst, body: { reviewerId } });
    expect(again.status).toBe(200);
    const res = await signFromPreview(
      base(),
      cookies.reviewer,
      arranged.revisionId,
      "Reviewed the conversion, the sweep and the margins: stable with margin at this stage.",
    );
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.summaryId).toMatch(/^\d+$/);
    const state = await review(arranged.revisionId, cookies.analyst);
    expect(state.body.state).toBe("signed");
    expect(state.body.signature).toMatchObject({ summaryId: res.body.summaryId, signer: { name: "Mira Holloway" } });
    expect(state.body.signature.verificationCode).toMatch(/^[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}$/);
    const reviewAudit = (await auditActions(db, "revision", arranged.revisionId)).filter((a) => a.startsWith("review."));
    expect(reviewAudit).toEqual(["review.submit", "review.return", "review.comment", "review.submit", "review.sign"]);

    for (const to of ["analyst@stillspan.test", "viewer@stillspan.test"]) {
      const [mail] = await waitForMail(base(), cookies.admin, to, `Signed stability summary: ${studyName}, revision 1`);
      expect(mail, `signed message to ${to}`).toBeDefined();
      expect(mail.to).toEqual([to]);
      expect(mail.text).toContain(`/summaries/${res.body.summaryId}`);
      expect(mail.text).toContain("Mira Holloway has signed the stability summary of revision 1");
    }
    // Not to the reviewer who signed it.
    expect(await waitForMail(base(), cookies.admin, "reviewer@stillspan.test", `Signed stability summary: ${studyName}`, { timeoutMs: 300 })).toEqual([]);
    // Off the reviewer's queue.
    const queue = await api(base(), "/api/review-queue", { cookie: cookies.reviewer });
    expect(queue.body.map((q: { revisionId: string }) => q.revisionId)).not.toContain(arranged.revisionId);
  });

  it("refuses signing the same revision twice (409), also when two signatures race", async () => {
    const res = await api(base(), `/api/revisions/${arranged.revisionId}/sign`, {
      cookie: cookies.reviewer,
      body: { statement: "Again.", previewSha256: ANY_PREVIEW_SHA256 },
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/already signed/);

    const second = await addRevision(base(), cookies.analyst, arranged.studyId, 1, 0.0045);
    await api(base(), `/api/revisions/${second}/submit`, { cookie: cookies.analyst, body: { reviewerId } });
    const { previewSha256 } = (await api(base(), `/api/revisions/${second}/summary-preview`, { cookie: cookies.reviewer })).body;
    const both = await Promise.all(
      [1, 2].map((i) => api(base(), `/api/revisions/${second}/sign`, { cookie: cookies.reviewer, body: { statement: `Race ${i}`, previewSha256 } })),
    );
    expect(both.map((r) => r.status).sort()).toEqual([201, 409]);
  });
});

describe("nobody signs their own revision", () => {
  it("refuses the author as reviewer at submission (400), and the author-reviewer's signature (403)", async () => {
    // The administrator may write studies and is also a reviewer of this project: here the author.
    const own = await addRevision(base(), cookies.admin, arranged.studyId, 2, 0.0042);
    const asReviewer = await api(base(), `/api/revisions/${own}/submit`, { cookie: cookies.analyst, body: { reviewerId: adminId } });
    expect(asReviewer.status).toBe(400);
    expect(asReviewer.body.error.message).toMatch(/author/);

    const submitted = await api(base(), `/api/revisions/${own}/submit`, { cookie: cookies.analyst, body: { reviewerId } });
    expect(submitted.status).toBe(200);
    const res = await api(base(), `/api/revisions/${own}/sign`, {
      cookie: cookies.admin,
      body: { statement: "My own work is fine.", previewSha256: ANY_PREVIEW_SHA256 },
    });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/own revision/);
    expect((await review(own, cookies.analyst)).body.state).toBe("in-review");
  });
});

describe("only the assigned reviewer decides; an administrator reassigns", () => {
  let assigned: ArrangedStudy;
  let teamProjectId: number;
  let second: { id: number; cookie: string };
  const secondEmail = `second-reviewer-${suffix}@stillspan.test`;

  beforeAll(async () => {
    const secondId = await insertUser(db, { email: secondEmail, name: "Ines Calloway", passwordHash: await hashPassword(DEMO_PASSWORD) }).then((u) => u.id);
    teamProjectId = await createProjectWithMembers(db, `Two-reviewer crossing ${suffix}`, {
      "analyst@stillspan.test": "analyst",
      "reviewer@stillspan.test": "reviewer",
      [secondEmail]: "reviewer",
      "viewer@stillspan.test": "viewer",
    });
    second = { id: secondId, cookie: await signIn(base(), secondEmail) };
    assigned = await arrangeStudy(base(), cookies.analyst, teamProjectId, `Assignment ${suffix}`, cookies.reviewer);
    const submitted = await api(base(), `/api/revisions/${assigned.revisionId}/submit`, { cookie: cookies.analyst, body: { reviewerId } });
    expect(submitted.status).toBe(200);
  });

  it("refuses another reviewer of the project who is not assigned: sign and return are 403, nothing changes", async () => {
    const auditBefore = await lastAuditId(db);
    const sign = await api(base(), `/api/revisions/${assigned.revisionId}/sign`, {
      cookie: second.cookie,
      body: { statement: "Not mine to sign.", previewSha256: ANY_PREVIEW_SHA256 },
    });
    expect(sign.status).toBe(403);
    expect(sign.body.error.message).toMatch(/assigned to another reviewer/);
    const ret = await api(base(), `/api/revisions/${assigned.revisionId}/return`, { cookie: second.cookie, body: { comments: "Not mine to return." } });
    expect(ret.status).toBe(403);
    expect(await lastAuditId(db)).toBe(auditBefore);
    const state = await review(assigned.revisionId, cookies.analyst);
    expect(state.body).toMatchObject({ state: "in-review", signature: null, comments: [] });
    // Not in their queue either; they may still read and comment.
    const queue = await api(base(), "/api/review-queue", { cookie: second.cookie });
    expect(queue.body.map((q: { revisionId: string }) => q.revisionId)).not.toContain(assigned.revisionId);
  });

  it("lets only administrators reassign (403 for the analyst and the assigned reviewer), to an eligible reviewer (400), not to the same one (409)", async () => {
    const to = (cookie: string, body: unknown) => api(base(), `/api/revisions/${assigned.revisionId}/reviewer`, { cookie, body });
    expect((await to(cookies.analyst, { reviewerId: second.id })).status).toBe(403);
    expect((await to(cookies.reviewer, { reviewerId: second.id })).status).toBe(403);
    const viewerId = await userId(db, "viewer@stillspan.test");
    const notReviewer = await to(cookies.admin, { reviewerId: viewerId });
    expect(notReviewer.status).toBe(400);
    expect(notReviewer.body.error.message).toMatch(/not a reviewer of this project/);
    const same = await to(cookies.admin, { reviewerId });
    expect(same.status).toBe(409);
    expect((await to(cookies.admin, {})).status).toBe(400);
  });

  it("reassigns: audited with from and to, kept in the history, moved between queues, e-mailed; then only the new reviewer decides", async () => {
    const res = await api(base(), `/api/revisions/${assigned.revisionId}/reviewer`, {
      cookie: cookies.admin,
      body: { reviewerId: String(second.id), note: "Mira is away this week." },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.request.reviewer).toEqual({ id: String(second.id), name: "Ines Calloway" });
    expect(res.body.events.map((e: { kind: string }) => e.kind)).toEqual(["submitted", "reassigned"]);
    expect(res.body.events[1]).toMatchObject({ actor: { id: String(adminId) }, reviewer: { id: String(second.id) }, note: "Mira is away this week." });
    const { rows } = await db.execute<{ details: { fromReviewerId: number; toReviewerId: number }; actor_id: number }>(
      sql`select details, actor_id from audit_events where action = 'review.reassign' and object_id = ${assigned.revisionId}`,
    );
    expect(rows).toEqual([{ details: { fromReviewerId: reviewerId, toReviewerId: second.id }, actor_id: adminId }]);

    const queueOf = async (cookie: string) =>
      (await api(base(), "/api/review-queue", { cookie })).body.map((q: { revisionId: string }) => q.revisionId);
    expect(await queueOf(second.cookie)).toContain(assigned.revisionId);
    expect(await queueOf(cookies.reviewer)).not.toContain(assigned.revisionId);
    const [mail] = await waitForMail(base(), cookies.admin, secondEmail, `Review requested: Assignment ${suffix}, revision 1`);
    expect(mail, "review-requested message to the new reviewer").toBeDefined();

    const formerSigns = await api(base(), `/api/revisions/${assigned.revisionId}/sign`, {
      cookie: cookies.reviewer,
      body: { statement: "I was first.", previewSha256: ANY_PREVIEW_SHA256 },
    });
    expect(formerSigns.status).toBe(403);
    const signed = await signFromPreview(base(), second.cookie, assigned.revisionId, "Checked: stable with margin.");
    expect(signed.status, JSON.stringify(signed.body)).toBe(201);
    const late = await api(base(), `/api/revisions/${assigned.revisionId}/reviewer`, { cookie: cookies.admin, body: { reviewerId } });
    expect(late.status).toBe(409);
  });
});
