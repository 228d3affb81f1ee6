import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { alternativeRoutes, projectAlternativeRoutes } from "./alternatives.js";
import { authRoutes } from "./auth.js";
import { comparisonRoutes } from "./comparison.js";
import { criteriaRoutes } from "./criteria.js";
import { alternativeDatasetRoutes, datasetRoutes } from "./datasets.js";
import { devMailboxRoutes } from "./dev-mailbox.js";
import { healthRoutes } from "./health.js";
import { invitationRoutes, projectInvitationRoutes } from "./invitations.js";
import { passwordResetRoutes } from "./password-reset.js";
import { projectRoutes } from "./projects.js";
import { projectReviewStateRoutes, reviewQueueRoutes, reviewRoutes, studyReviewStateRoutes } from "./review.js";
import { revisionRoutes } from "./revisions.js";
import { screeningRoutes } from "./screening.js";
import { alternativeStudyRoutes, studyRoutes } from "./studies.js";
import { signatureRoutes } from "./signatures.js";
import { summaryRoutes } from "./summaries.js";
import { sweepRoutes } from "./sweep.js";
import { userRoutes } from "./users.js";

/**
 * Every API resource, mounted under /api. To add one: write server/routes/<resource>.ts exporting a factory
 * `(ctx) => Router` and mount it here with one line.
 */
export function apiRouter(ctx: AppContext): Router {
  const router = Router();
  router.use("/health", healthRoutes(ctx));
  router.use("/auth/password-reset", passwordResetRoutes(ctx));
  router.use("/auth", authRoutes(ctx));
  router.use("/projects/:projectId/criteria", criteriaRoutes(ctx));
  router.use("/projects/:projectId/alternatives", projectAlternativeRoutes(ctx));
  router.use("/projects/:projectId/comparison", comparisonRoutes(ctx));
  router.use("/projects/:projectId/invitations", projectInvitationRoutes(ctx));
  router.use("/projects/:projectId/review-states", projectReviewStateRoutes(ctx));
  router.use("/projects", projectRoutes(ctx));
  router.use("/alternatives/:alternativeId/datasets", alternativeDatasetRoutes(ctx));
  router.use("/alternatives/:alternativeId/studies", alternativeStudyRoutes(ctx));
  router.use("/alternatives", alternativeRoutes(ctx));
  router.use("/datasets", datasetRoutes(ctx));
  router.use("/studies/:studyId/review-states", studyReviewStateRoutes(ctx));
  router.use("/studies", studyRoutes(ctx));
  router.use("/revisions", reviewRoutes(ctx));
  router.use("/revisions", revisionRoutes(ctx));
  router.use("/review-queue", reviewQueueRoutes(ctx));
  router.use("/summaries", summaryRoutes(ctx));
  router.use("/invitations", invitationRoutes(ctx));
  router.use("/screening", screeningRoutes(ctx));
  router.use("/signatures", signatureRoutes(ctx));
  router.use("/sweep", sweepRoutes(ctx));
  router.use("/users", userRoutes(ctx));
  router.use("/dev/mailbox", devMailboxRoutes(ctx));
  return router;
}
