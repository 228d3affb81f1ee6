import { Router } from "express";
import { createAlternativeSchema, MAX_IMAGE_BYTES, patchAlternativeSchema } from "../../shared/schemas/alternatives.js";
import type { AppContext } from "../app-context.js";
import { uploadOne } from "../lib/uploads.js";
import { currentUser, fromParam, requireAuth } from "../middleware/auth.js";
import { parseObjectId, parseProjectId } from "../services/access.js";
import {
  createAlternative,
  getAlternative,
  getImage,
  listProjectAlternatives,
  patchAlternative,
  removeAlternative,
  removeImage,
  setImage,
} from "../services/alternatives.js";

/** /api/projects/:projectId/alternatives: list (analysts, reviewers) and create (analysts). */
export function projectAlternativeRoutes({ db }: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  router.get("/", async (req, res) => {
    res.json(await listProjectAlternatives(db, currentUser(req), parseProjectId(fromParam()(req))));
  });
  router.post("/", async (req, res) => {
    const projectId = parseProjectId(fromParam()(req));
    const input = createAlternativeSchema.parse(req.body ?? {});
    res.status(201).json(await createAlternative(db, currentUser(req), projectId, input, req.ip));
  });
  return router;
}

const altId = (raw: string | string[] | undefined) => parseObjectId(raw, "Alternative");

/** /api/alternatives/:id: read, edit, delete, cross-section image. */
export function alternativeRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);

  router.get("/:id", async (req, res) => {
    res.json(await getAlternative(db, currentUser(req), altId(req.params.id)));
  });
  router.patch("/:id", async (req, res) => {
    const id = altId(req.params.id);
    const patch = patchAlternativeSchema.parse(req.body ?? {});
    res.json(await patchAlternative(db, currentUser(req), id, patch, req.ip));
  });
  router.delete("/:id", async (req, res) => {
    await removeAlternative(db, currentUser(req), altId(req.params.id), req.ip);
    res.status(204).end();
  });

  router.put("/:id/image", uploadOne("image", MAX_IMAGE_BYTES), async (req, res) => {
    const id = altId(req.params.id);
    res.json(await setImage(db, currentUser(req), id, req.file, req.ip));
  });
  router.get("/:id/image", async (req, res) => {
    const image = await getImage(db, currentUser(req), altId(req.params.id));
    res.setHeader("Content-Type", image.contentType);
    res.setHeader("Cache-Control", "private, no-cache");
    res.setHeader("ETag", `"${image.sha256}"`);
    // An SVG is a document: never let it run anything, even when opened directly.
    res.setHeader("Content-Security-Policy", "default-src 'none'; style-src 'unsafe-inline'; sandbox");
    res.send(image.bytes);
  });
  router.delete("/:id/image", async (req, res) => {
    await removeImage(db, currentUser(req), altId(req.params.id), req.ip);
    res.status(204).end();
  });
  return router;
}
