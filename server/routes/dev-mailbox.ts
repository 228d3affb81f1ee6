import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../app-context.js";
import { AppError } from "../errors.js";
import { requireAdmin, requireAuth } from "../middleware/auth.js";
import { listDevMailbox, usesFakeSmtp } from "../services/mail.js";

const mailboxQuerySchema = z.object({
  to: z.email().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

/**
 * /api/dev/mailbox: what the local fake SMTP server received (admins only). Exists only while the fake is in use:
 * with a real SMTP server configured it answers 404, as if it were not there.
 */
export function devMailboxRoutes({ db, config }: AppContext): Router {
  const router = Router();
  router.use((_req, _res, next) => next(usesFakeSmtp(config) ? undefined : AppError.notFound("Mailbox")));
  router.use(requireAuth, requireAdmin);

  router.get("/", async (req, res) => {
    const { to, limit } = mailboxQuerySchema.parse(req.query);
    res.json({ messages: await listDevMailbox(db, { to, limit }) });
  });

  return router;
}
