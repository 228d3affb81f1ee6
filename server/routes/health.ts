import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { databaseIsUp } from "../services/health.js";

/** GET /api/health → 200 {status:"ok",db:"ok"}, or 503 {status:"error",db:"down"} when PostgreSQL does not answer. */
export function healthRoutes({ db, logger }: AppContext): Router {
  const router = Router();
  router.get("/", async (_req, res) => {
    res.setHeader("Cache-Control", "no-store");
    if (await databaseIsUp(db, logger)) res.json({ status: "ok", db: "ok" });
    else res.status(503).json({ status: "error", db: "down" });
  });
  return router;
}
