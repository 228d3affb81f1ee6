import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { publicJwks } from "../services/signing.js";

/** /.well-known: the public keys that verify signed stability summaries (RFC 7517 JWK Set). */
export function wellKnownRoutes({ config }: AppContext): Router {
  const router = Router();

  router.get("/jwks.json", async (_req, res) => {
    res.setHeader("Cache-Control", "public, max-age=300");
    res.type("application/jwk-set+json").send(JSON.stringify(await publicJwks(config)));
  });

  return router;
}
