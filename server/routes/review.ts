import { Router, type Request } from "express";
import { createCommentSchema, returnReviewSchema, signReviewSchema } from "../../shared/schemas/review.js";
import type { AppContext } from "../app-context.js";
import { currentUser, fromParam, requireAdmin, requireAuth, requireRole } from "../middleware/auth.js";
import { parseObjectId, parseProjectId, READ_ROLES } from "../services/access.js";
import {
  addComment,
  getRevisionReview,
  returnRevision,
  reviewQueue,
  submitForReview,
} from "../services/review.js";
import { reassignReviewer } from "../services/review-assignment.js";
import { getSummaryPreview } from "../services/review-preview.js";
import { projectReviewStates, studyReviewStates } from "../services/review-states.js";
import { signRevision } from "../services/summaries.js";

const revisionId = (req: Request) => parseObjectId(req.params.id, "Revision");

/**
 * /api/revisions/:id/{review,summary-preview,submit,return,sign,reviewer,comments}: the review workflow of one
 * revision — the reviewer reads the summary preview, then signs it with its hash. Mounted beside
 * the studies API's /api/revisions router; only these sub-paths are handled here.
 */
export function reviewRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get("/:id/review", requireAuth, async (req, res) => {
    res.json(await getRevisionReview(db, currentUser(req), revisionId(req)));
  });

  router.get("/:id/summary-preview", requireAuth, async (req, res) => {
    res.setHeader("Cache-Control", "no-store");
    res.json(await getSummaryPreview(db, currentUser(req), revisionId(req)));
  });

  router.post("/:id/submit", requireAuth, async (req, res) => {
    res.json(await submitForReview(ctx, currentUser(req), revisionId(req), req.body ?? {}, req.ip));
  });

  router.post("/:id/return", requireAuth, async (req, res) => {
    const { comments } = returnReviewSchema.parse(req.body ?? {});
    res.json(await returnRevision(ctx, currentUser(req), revisionId(req), comments, req.ip));
  });

  router.post("/:id/sign", requireAuth, async (req, res) => {
    const body = signReviewSchema.parse(req.body ?? {});
    res.status(201).json(await signRevision(ctx, currentUser(req), revisionId(req), body, req.ip));
  });

  router.post("/:id/reviewer", requireAuth, requireAdmin, async (req, res) => {
    res.json(await reassignReviewer(ctx, currentUser(req), revisionId(req), req.body ?? {}, req.ip));
  });

  router.post("/:id/comments", requireAuth, async (req, res) => {
    const { body } = createCommentSchema.parse(req.body ?? {});
    res.status(201).json(await addComment(db, currentUser(req), revisionId(req), body, req.ip));
  });

  return router;
}

/** /api/review-queue: the revisions in review assigned to the signed-in reviewer. */
export function reviewQueueRoutes({ db }: AppContext): Router {
  const router = Router();
  router.get("/", requireAuth, async (req, res) => {
    res.setHeader("Cache-Control", "no-store");
    res.json(await reviewQueue(db, currentUser(req)));
  });
  return router;
}

/** /api/studies/:studyId/review-states: the review state of every revision of the study (analysts, reviewers). */
export function studyReviewStateRoutes({ db }: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.get("/", requireAuth, async (req, res) => {
    res.json(await studyReviewStates(db, currentUser(req), parseObjectId(fromParam("studyId")(req), "Study")));
  });
  return router;
}

/** /api/projects/:projectId/review-states: the review state of every revision of the project's studies. */
export function projectReviewStateRoutes({ db }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const projectId = fromParam();
  router.get("/", requireAuth, requireRole(projectId, READ_ROLES), async (req, res) => {
    res.json(await projectReviewStates(db, currentUser(req), parseProjectId(projectId(req))));
  });
  return router;
}
