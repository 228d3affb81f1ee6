import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../app-context.js";
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
 * been signed), `newerUnsigned` and `summaryId`; null for a JWS it does not hold.
 */
export function signatureRoutes({ config, db }: AppContext): Router {
  const router = Router();

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
