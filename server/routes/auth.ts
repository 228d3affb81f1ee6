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

/** The account a sign-in attempt names (its e-mail, trimmed and lower-cased), when the body names one. */
function accountKey(req: Request): string | undefined {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === "string" && email.trim() !== "" ? `account:${email.trim().toLowerCase().slice(0, 254)}` : undefined;
}

/** POST /api/auth/sign-in, POST /api/auth/sign-out, GET /api/auth/me. */
export function authRoutes({ db, config }: AppContext): Router {
  const router = Router();

  // Failed attempts only, counted twice: per client address, and per account (whatever the address), so moving
  // to another address gives no more guesses at the same account.
  const tooMany = new AppError(429, "too_many_attempts", "Too many failed sign-in attempts. Wait a few minutes and retry.");
  const limiterOptions = {
    windowMs: config.signInRateLimit.windowMs,
    limit: config.signInRateLimit.limit,
    skipSuccessfulRequests: true,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req: Request, _res: Response, next: (err: unknown) => void) => next(tooMany),
  } as const;
  const perAddress = rateLimit(limiterOptions);
  const perAccount = rateLimit({
    ...limiterOptions,
    // Each limiter keeps its own counters; the account's e-mail, normalised as the lookup does, is the key.
    identifier: "sign-in-per-account",
    skip: (req) => accountKey(req) === undefined,
    keyGenerator: (req) => accountKey(req)!,
  });

  router.post("/sign-in", perAddress, perAccount, async (req, res) => {
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
