import { Router, type Request } from "express";
import { createCommentSchema, returnReviewSchema, signReviewSchema } from "../../shared/schemas/review.js";
import type { AppContext } from "../app-context.js";
import { currentUser, requireAdmin, requireAuth } from "../middleware/auth.js";
import { parseObjectId } from "../services/access.js";
import {
  addComment,
  getRevisionReview,
  returnRevision,
  reviewQueue,
  submitForReview,
} from "../services/review.js";
import { reassignReviewer } from "../services/review-assignment.js";
import { signRevision } from "../services/summaries.js";

const revisionId = (req: Request) => parseObjectId(req.params.id, "Revision");

/**
 * /api/revisions/:id/{review,submit,return,sign,reviewer,comments}: the review workflow of one revision. Mounted beside
 * the studies API's /api/revisions router; only these sub-paths are handled here.
 */
export function reviewRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get("/:id/review", requireAuth, async (req, res) => {
    res.json(await getRevisionReview(db, currentUser(req), revisionId(req)));
  });

  router.post("/:id/submit", requireAuth, async (req, res) => {
    res.json(await submitForReview(ctx, currentUser(req), revisionId(req), req.body ?? {}, req.ip));
  });

  router.post("/:id/return", requireAuth, async (req, res) => {
    const { comments } = returnReviewSchema.parse(req.body ?? {});
    res.json(await returnRevision(ctx, currentUser(req), revisionId(req), comments, req.ip));
  });

  router.post("/:id/sign", requireAuth, async (req, res) => {
    const { statement } = signReviewSchema.parse(req.body ?? {});
    res.status(201).json(await signRevision(ctx, currentUser(req), revisionId(req), statement, req.ip));
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
