import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { authRoutes } from "./auth.js";
import { healthRoutes } from "./health.js";
import { projectRoutes } from "./projects.js";

/**
 * Every API resource, mounted under /api. To add one: write server/routes/<resource>.ts exporting a factory
 * `(ctx) => Router` and mount it here with one line.
 */
export function apiRouter(ctx: AppContext): Router {
  const router = Router();
  router.use("/health", healthRoutes(ctx));
  router.use("/auth", authRoutes(ctx));
  router.use("/projects", projectRoutes(ctx));
  return router;
}
