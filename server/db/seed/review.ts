import { asc, eq } from "drizzle-orm";
import type { StudyDocument } from "../../../shared/schemas/study.js";
import { recordComment, recordSubmission } from "../../services/review.js";
import { saveRevision } from "../../services/revisions.js";
import { runSweepInProcess } from "../../services/sweep-compute.js";
import { recordSignature } from "../../services/summaries.js";
import { currentAssessment } from "../../services/assessments.js";
import type { Assessment, StabilityCheck, StabilityMargin } from "../../../shared/schemas/assessment.js";
import { findCurrentCriteria } from "../queries/criteria.js";
import { findReviewRequest } from "../queries/review.js";
import { findRevision, listRevisions } from "../queries/revisions.js";
import { findUserById } from "../queries/users.js";
import { alternatives, projects, studies } from "../schema/index.js";
import { seedUser } from "./alternatives.js";
import { ref, type SeedStep } from "./types.js";

/** Invented review texts of the demo (fictional people, fictional crossing). */
const REVIEW_SCOPE =
  "Reviewed for the invented Harrowmere demo: the flutter derivatives' conversion to the study convention, the " +
  "structural properties against the deck model, the speed sweep and the margins against the project's criteria.";
const LABEL: Record<StabilityCheck, string> = {
  flutter: "flutter",
  divergence: "torsional divergence",
  gallopingOnset: "galloping onset",
};

const ratio = (m: StabilityMargin) => `${m.marginIsLowerBound ? "at least " : ""}${m.margin!.toFixed(2)}`;

/**
 * The demo reviewer's statement, written from the signed revision's own assessment so that it never contradicts
 * it: adequate stability margins are named as such; a failed one is named with its number and accepted for the
 * concept stage only, with the next revision's remedy; vortex shedding to investigate is carried forward.
 */
export function demoReviewerStatement(assessment: Pick<Assessment, "margins" | "vortexShedding">): string {
  const margins = Object.entries(assessment.margins ?? {}) as [StabilityCheck, StabilityMargin][];
  const adequate = margins.filter(([check, m]) => check !== "gallopingOnset" && m.status === "pass" && m.margin !== null);
  const failed = margins.filter(([, m]) => m.status === "fail");
  const open = [
    ...margins.filter(([, m]) => m.status === "undetermined").map(([check]) => LABEL[check]),
    ...(assessment.vortexShedding.status === "investigate" ? ["vortex-shedding onset"] : []),
  ];
  const parts = [REVIEW_SCOPE];
  if (adequate.length > 0) {
    const met = adequate.map(([check, m]) => `${LABEL[check]} (margin ${ratio(m)})`).join(" and ");
    parts.push(`Required speed met for ${met}.`);
  }
  for (const [check, m] of failed) {
    const value = m.margin !== null ? ` is ${ratio(m)}` : " is not met";
    parts.push(
      `The ${LABEL[check]} margin${value}, below the required speed of ${m.requiredSpeedMps.toFixed(2)} m/s: ` +
        "accepted for the concept stage only; the next revision must raise the deck's torsional stiffness and mass " +
        "moment of inertia before this alternative can go forward.",
    );
  }
  if (open.length > 0) parts.push(`Still open: ${open.join(", ")}.`);
  parts.push(
    failed.length > 0
      ? "Not acceptable for the design stage as it stands; section-model tests are pending."
      : "Acceptable at this concept stage; to be confirmed by section-model tests.",
  );
  return parts.join(" ");
}

const SUBMIT_NOTE = "Second pass with the revised torsional damping — please review the margins.";

/**
 * The demo study: the one the studies' step names "study:single" (alternative B, several revisions), else the
 * first study (by id) of the demo crossing with at least one revision.
 */
async function demoStudyId(ctx: Parameters<SeedStep["run"]>[0]): Promise<number | undefined> {
  const named = ctx.refs.get("study:single");
  if (named !== undefined) return named;
  const rows = await ctx.tx
    .select({ id: studies.id })
    .from(studies)
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .innerJoin(projects, eq(projects.id, alternatives.projectId))
    .where(eq(projects.id, ref(ctx, "project:harrowmere")))
    .orderBy(asc(studies.id));
  for (const { id } of rows) if ((await listRevisions(ctx.tx, id)).length > 0) return id;
  return undefined;
}

/**
 * One signed revision of the demo study (signed by the demo reviewer, so the viewer sees a summary on first
 * start) and one later revision in review assigned to the demo reviewer. Runs after the studies' steps; when the
 * demo study has a single revision, the later one is computed here (a change of torsional damping). The signing
 * key exists before the seed runs (server/main.ts, scripts/test.ts).
 */
export const demoReview: SeedStep = {
  name: "demo review and signed summary",
  async run(ctx) {
    const { tx, config, log } = ctx;
    const studyId = await demoStudyId(ctx);
    if (studyId === undefined) {
      log.warn("demo review: the demo crossing has no study with a revision yet; no summary seeded");
      return;
    }
    const analyst = await seedUser(ctx, "user:analyst");
    const analystId = analyst.id;
    const reviewerId = ref(ctx, "user:reviewer");
    let revisions = await listRevisions(tx, studyId);
    if (revisions.length === 1) {
      // Through the same service as the API: computed, stored and audited in this transaction.
      const first = (await findRevision(tx, revisions[0].id))!;
      const study: StudyDocument = structuredClone(first.document);
      const torsion = study.structure.modes.find((m) => m.dof === "torsion")!;
      torsion.damping = Math.round(torsion.damping * 0.8 * 1e6) / 1e6;
      const changeNote = `Torsional damping ratio lowered to ${torsion.damping} (measured on the invented deck model)`;
      await saveRevision(tx, runSweepInProcess, analyst, studyId, { parentRevision: first.number, changeNote, study }, undefined, "seed");
      revisions = await listRevisions(tx, studyId);
    }
    const toSign = (await findRevision(tx, revisions[revisions.length - 2].id))!;
    const inReview = revisions[revisions.length - 1];
    // One after the other: a transaction is one connection, which runs one query at a time.
    const criteria = await findCurrentCriteria(tx, toSign.projectId);
    const reviewer = await findUserById(tx, reviewerId);
    if (!criteria || !reviewer) throw new Error("seed: demo review needs the criteria and the reviewer");

    const signedAt = new Date();
    const submittedAt = new Date(signedAt.getTime() - 26 * 3600_000);
    // The review steps through the same in-transaction services as the API (history entry and audit event each).
    await recordSubmission(tx, { revision: toSign, analystId, reviewerId, note: "First full sweep of the twin box.", at: submittedAt });
    await recordComment(tx, {
      revisionId: toSign.id,
      authorId: reviewerId,
      body: "Derivatives are within the tested range up to flutter; the extrapolation warning above it does not affect the critical speed.",
    });
    const request = (await findReviewRequest(tx, toSign.id))!;
    // The statement is written against the assessment the summary will carry (the stored one the signing uses).
    const { assessment } = await currentAssessment(tx, toSign, reviewer.id);
    const summaryId = await recordSignature(tx, config, {
      revision: toSign,
      request,
      signer: reviewer,
      signedAt,
      statement: demoReviewerStatement(assessment),
    });
    ctx.refs.set("summary:demo", summaryId);

    await recordSubmission(tx, { revision: inReview, analystId, reviewerId, note: SUBMIT_NOTE });
    ctx.refs.set("revision:in-review", inReview.id);
  },
};
