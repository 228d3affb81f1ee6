/**
 * The review workflow's e-mail: review requested (to the reviewer), returned (to the analyst who submitted),
 * signed (to that analyst, the revision's author, and every viewer of the project). One message per recipient, so
 * no one sees another's address. Sent after the change is committed; a failure is logged, never thrown.
 */
import type { AppContext } from "../app-context.js";
import { findAlternative } from "../db/queries/alternatives.js";
import { listProjectMembers } from "../db/queries/projects.js";
import type { RevisionRow } from "../db/queries/revisions.js";
import type { SignatureRow } from "../db/queries/signatures.js";
import { findProjectById } from "../db/queries/projects.js";
import { findReviewRequest } from "../db/queries/review.js";
import { findRevision } from "../db/queries/revisions.js";
import { findUserById } from "../db/queries/users.js";
import type { User } from "../db/schema/index.js";
import { returnedMail } from "../mail/templates/returned.js";
import { reviewRequestedMail } from "../mail/templates/review-requested.js";
import { signedMail } from "../mail/templates/signed.js";
import { deliverMail } from "./mail.js";

type Ctx = Pick<AppContext, "db" | "config" | "logger">;

export const appLinks = {
  reviewQueue: (base: string) => `${base}/reviews`,
  revision: (base: string, projectId: number, studyId: number, number: number) =>
    `${base}/projects/${projectId}/studies/${studyId}?revision=${number}`,
  summary: (base: string, summaryId: number) => `${base}/summaries/${summaryId}`,
  acceptInvitation: (base: string, token: string) => `${base}/accept-invite?token=${encodeURIComponent(token)}`,
  resetPassword: (base: string, token: string) => `${base}/reset-password?token=${encodeURIComponent(token)}`,
  /** The public page that verifies a signed summary by its code (no sign-in). */
  verify: (base: string, code: string) => `${base}/verify/${encodeURIComponent(code)}`,
  jwks: (base: string) => `${base}/.well-known/jwks.json`,
};

/** Runs a notification in the background; its outcome is logged. Returns the promise for tests and callers who wait. */
function background(ctx: Ctx, what: string, work: () => Promise<unknown>): Promise<void> {
  return work().then(
    () => undefined,
    (err: unknown) => ctx.logger.error({ err }, `${what}: notification failed`),
  );
}

async function names(ctx: Ctx, revision: RevisionRow) {
  const [project, alternative] = await Promise.all([
    findProjectById(ctx.db, revision.projectId, 0),
    findAlternative(ctx.db, revision.alternativeId),
  ]);
  return { projectName: project?.name ?? "", alternativeName: alternative?.name ?? "" };
}

export function notifyReviewRequested(
  ctx: Ctx,
  m: { revision: RevisionRow; reviewer: User; analystName: string; note: string },
): Promise<void> {
  return background(ctx, "review requested", async () => {
    const { projectName, alternativeName } = await names(ctx, m.revision);
    const mail = reviewRequestedMail({
      reviewerName: m.reviewer.name,
      analystName: m.analystName,
      projectName,
      alternativeName,
      studyName: m.revision.studyName,
      revisionNumber: m.revision.number,
      note: m.note || null,
      link: appLinks.reviewQueue(ctx.config.publicUrl),
    });
    await deliverMail(ctx, { to: m.reviewer.email, ...mail });
  });
}

export function notifyReturned(
  ctx: Ctx,
  m: { revision: RevisionRow; analyst: User; reviewerName: string; comments: string },
): Promise<void> {
  return background(ctx, "revision returned", async () => {
    const { projectName } = await names(ctx, m.revision);
    const mail = returnedMail({
      analystName: m.analyst.name,
      reviewerName: m.reviewerName,
      projectName,
      studyName: m.revision.studyName,
      revisionNumber: m.revision.number,
      comments: m.comments,
      link: appLinks.revision(ctx.config.publicUrl, m.revision.projectId, m.revision.studyId, m.revision.number),
    });
    await deliverMail(ctx, { to: m.analyst.email, ...mail });
  });
}

export function notifySigned(ctx: Ctx, signature: SignatureRow): Promise<void> {
  return background(ctx, "summary signed", async () => {
    const [revision, request, members] = await Promise.all([
      findRevision(ctx.db, signature.revisionId),
      findReviewRequest(ctx.db, signature.revisionId),
      listProjectMembers(ctx.db, signature.projectId),
    ]);
    const recipients = new Map<string, string>();
    for (const id of [request?.requestedById, revision?.authorId]) {
      const user = id ? await findUserById(ctx.db, id) : undefined;
      if (user) recipients.set(user.email, user.name);
    }
    for (const member of members) if (member.role === "viewer") recipients.set(member.email, member.name);
    recipients.delete(""); // never address an empty string
    const link = appLinks.summary(ctx.config.publicUrl, signature.id);
    await Promise.all(
      [...recipients].map(([email, name]) =>
        deliverMail(ctx, {
          to: email,
          ...signedMail({
            recipientName: name,
            reviewerName: signature.signerName,
            projectName: signature.projectName,
            alternativeName: signature.alternativeName,
            studyName: signature.studyName,
            revisionNumber: signature.revisionNumber,
            signedAt: signature.signedAt,
            link,
          }),
        }),
      ),
    );
  });
}
