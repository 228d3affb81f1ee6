import { Router, type CookieOptions, type Request, type Response } from "express";
import { rateLimit } from "express-rate-limit";
import { signInInputSchema } from "../../shared/schemas/auth.js";
import type { AppContext } from "../app-context.js";
import { AppError } from "../errors.js";
import { currentUser, requireAuth } from "../middleware/auth.js";
import {
  createSessionToken,
  describeMe,
  endSession,
  SESSION_COOKIE,
  SESSION_TTL_SECONDS,
  signIn,
} from "../services/auth.js";

/** httpOnly, SameSite=Lax; Secure when the request came over HTTPS (directly, or via a trusted proxy). */
function cookieOptions(req: Request): CookieOptions {
  return { httpOnly: true, sameSite: "lax", secure: req.secure, path: "/" };
}

function setSessionCookie(req: Request, res: Response, token: string): void {
  res.cookie(SESSION_COOKIE, token, { ...cookieOptions(req), maxAge: SESSION_TTL_SECONDS * 1000 });
}

/** POST /api/auth/sign-in, POST /api/auth/sign-out, GET /api/auth/me. */
export function authRoutes({ db, config }: AppContext): Router {
  const router = Router();

  // Counts failed attempts only, per client address.
  const signInLimiter = rateLimit({
    windowMs: config.signInRateLimit.windowMs,
    limit: config.signInRateLimit.limit,
    skipSuccessfulRequests: true,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new AppError(429, "too_many_attempts", "Too many failed sign-in attempts. Wait a few minutes and retry.")),
  });

  router.post("/sign-in", signInLimiter, async (req, res) => {
    const input = signInInputSchema.parse(req.body ?? {});
    const user = await signIn(db, input, req.ip);
    setSessionCookie(req, res, await createSessionToken(config.sessionSecret, user.id));
    res.json(await describeMe(db, user));
  });

  router.post("/sign-out", async (req, res) => {
    const token: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof token === "string" && token) await endSession(db, config.sessionSecret, token, req.ip);
    res.clearCookie(SESSION_COOKIE, cookieOptions(req));
    res.status(204).end();
  });

  router.get("/me", requireAuth, async (req, res) => {
    res.setHeader("Cache-Control", "no-store");
    res.json(await describeMe(db, currentUser(req)));
  });

  return router;
}
