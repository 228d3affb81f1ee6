import { Router } from "express";
import type { AppContext } from "../app.js";
import { healthRoutes } from "./health.js";

/**
 * Every API resource, mounted under /api. To add one: write server/routes/<resource>.ts exporting a factory
 * `(ctx) => Router` and mount it here with one line.
 */
export function apiRouter(ctx: AppContext): Router {
  const router = Router();
  router.use("/health", healthRoutes(ctx));
  return router;
}
