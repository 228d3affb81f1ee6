import { Router } from "express";
import { rateLimit } from "express-rate-limit";
import { z } from "zod";
import { verificationCodeSchema } from "../../shared/schemas/verification.js";
import type { AppContext } from "../app-context.js";
import { AppError } from "../errors.js";
import { checkSummaryByCode } from "../services/summary-check.js";
import { verifyStabilitySummary } from "../services/signing.js";
import { summaryCurrency } from "../services/summaries.js";
import { verificationCode } from "../signing/verification-code.js";

const verifyRequestSchema = z.strictObject({
  jws: z
    .string()
    .trim()
    .max(256 * 1024, "must be at most 256 KiB")
    .regex(/^[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+$/, "must be a compact JWS: three base64url parts"),
});

/**
 * /api/signatures: anyone holding a signed summary may check it (no sign-in: the JWS carries its own content,
 * and the keys are public). For a valid JWS that this server holds: `current` (no later revision of the study has
 * been signed), `newerUnsigned` and `summaryId`; null for a JWS it does not hold. GET /by-code/:code finds a summary
 * on record by the verification code printed on its PDF (rate-limited per client address, like sign-in).
 */
export function signatureRoutes({ config, db }: AppContext): Router {
  const router = Router();
  const byCodeLimiter = rateLimit({
    windowMs: config.signInRateLimit.windowMs,
    limit: 10 * config.signInRateLimit.limit,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, "too_many_attempts", "Too many look-ups. Wait a few minutes and retry.")),
  });

  router.get("/by-code/:code", byCodeLimiter, async (req, res) => {
    const code = verificationCodeSchema.safeParse(req.params.code);
    if (!code.success) {
      throw new AppError(400, "invalid_input", `code: ${code.error.issues[0].message}.`, {
        details: [{ path: "code", rule: "format", message: code.error.issues[0].message }],
      });
    }
    res.setHeader("Cache-Control", "no-store");
    res.json(await checkSummaryByCode(db, config, code.data));
  });

  router.post("/verify", async (req, res) => {
    const { jws } = verifyRequestSchema.parse(req.body ?? {});
    const result = await verifyStabilitySummary(config, jws);
    const record = result.valid ? await summaryCurrency(db, jws) : null;
    res.json({
      valid: result.valid,
      kid: result.kid,
      summary: result.summary,
      reason: result.valid ? null : result.reason,
      verificationCode: verificationCode(jws),
      current: record?.current ?? null,
      newerUnsigned: record?.newerUnsigned ?? null,
      summaryId: record?.summaryId ?? null,
    });
  });

  return router;
}
