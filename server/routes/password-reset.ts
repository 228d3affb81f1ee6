import { Router } from "express";
import { rateLimit } from "express-rate-limit";
import { passwordResetConfirmSchema, passwordResetRequestSchema } from "../../shared/schemas/invitations.js";
import type { AppContext } from "../app-context.js";
import { AppError } from "../errors.js";
import { confirmPasswordReset, requestPasswordReset } from "../services/one-time-links.js";

/** /api/auth/password-reset and /api/auth/password-reset/confirm (no session). */
export function passwordResetRoutes(ctx: AppContext): Router {
  const router = Router();
  const limiter = rateLimit({
    windowMs: ctx.config.signInRateLimit.windowMs,
    limit: ctx.config.signInRateLimit.limit,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, "too_many_attempts", "Too many requests. Wait a few minutes and retry.")),
  });

  router.post("/", limiter, async (req, res) => {
    const { email } = passwordResetRequestSchema.parse(req.body ?? {});
    requestPasswordReset(ctx, email, req.ip);
    // The same answer, after the same work, whether or not the account exists.
    res.status(202).json({
      message: "If an account exists for this address, a link to choose a new password is on its way. It works once, for 72 hours.",
    });
  });

  router.post("/confirm", limiter, async (req, res) => {
    const { token, password } = passwordResetConfirmSchema.parse(req.body ?? {});
    await confirmPasswordReset(ctx, token, password, req.ip);
    res.json({ message: "Your password is changed. Sign in with the new one." });
  });

  return router;
}
