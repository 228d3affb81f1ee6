import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../app-context.js";
import { verifyStabilitySummary } from "../services/signing.js";
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
 * and the keys are public). `current` is filled in by the review workflow (null until then).
 */
export function signatureRoutes({ config }: AppContext): Router {
  const router = Router();

  router.post("/verify", async (req, res) => {
    const { jws } = verifyRequestSchema.parse(req.body ?? {});
    const result = await verifyStabilitySummary(config, jws);
    res.json({
      valid: result.valid,
      kid: result.kid,
      summary: result.summary,
      reason: result.valid ? null : result.reason,
      verificationCode: verificationCode(jws),
      current: null,
    });
  });

  return router;
}
