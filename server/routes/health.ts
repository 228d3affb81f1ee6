import { sql } from "drizzle-orm";
import { Router } from "express";
import type { AppContext } from "../app-context.js";

/** GET /api/health → 200 {status:"ok",db:"ok"}, or 503 {status:"error",db:"down"} when PostgreSQL does not answer. */
export function healthRoutes({ db, logger }: AppContext): Router {
  const router = Router();
  router.get("/", async (_req, res) => {
    res.setHeader("Cache-Control", "no-store");
    try {
      await db.execute(sql`select 1`);
      res.json({ status: "ok", db: "ok" });
    } catch (err) {
      logger.warn({ err: (err as Error).message }, "health check: database unreachable");
      res.status(503).json({ status: "error", db: "down" });
    }
  });
  return router;
}
