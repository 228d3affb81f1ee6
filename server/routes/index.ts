import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { authRoutes } from "./auth.js";
import { criteriaRoutes } from "./criteria.js";
import { devMailboxRoutes } from "./dev-mailbox.js";
import { healthRoutes } from "./health.js";
import { projectRoutes } from "./projects.js";
import { screeningRoutes } from "./screening.js";
import { signatureRoutes } from "./signatures.js";

/**
 * Every API resource, mounted under /api. To add one: write server/routes/<resource>.ts exporting a factory
 * `(ctx) => Router` and mount it here with one line.
 */
export function apiRouter(ctx: AppContext): Router {
  const router = Router();
  router.use("/health", healthRoutes(ctx));
  router.use("/auth", authRoutes(ctx));
  router.use("/projects/:projectId/criteria", criteriaRoutes(ctx));
  router.use("/projects", projectRoutes(ctx));
  router.use("/screening", screeningRoutes(ctx));
  router.use("/signatures", signatureRoutes(ctx));
  router.use("/dev/mailbox", devMailboxRoutes(ctx));
  return router;
}
