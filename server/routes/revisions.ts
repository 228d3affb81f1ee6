import { Router } from "express";
import { rerunRevisionSchema } from "../../shared/schemas/revisions.js";
import type { AppContext } from "../app-context.js";
import { currentUser, requireAuth } from "../middleware/auth.js";
import { parseObjectId } from "../services/access.js";
import { diffRevisions, exportRevision, getRevision, rerunRevision } from "../services/revisions.js";

const revisionId = (raw: string | string[] | undefined) => parseObjectId(raw, "Revision");

/** /api/revisions/:id: read (document + result), diff, re-run with the current engine, export. */
export function revisionRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);
  router.get("/:id", async (req, res) => {
    res.json(await getRevision(db, currentUser(req), revisionId(req.params.id)));
  });
  router.get("/:a/diff/:b", async (req, res) => {
    res.json(await diffRevisions(db, currentUser(req), revisionId(req.params.a), revisionId(req.params.b)));
  });
  router.post("/:id/rerun", async (req, res) => {
    const id = revisionId(req.params.id);
    const { parentRevision } = rerunRevisionSchema.parse(req.body ?? {});
    res.status(201).json(await rerunRevision(db, currentUser(req), id, parentRevision, req.ip));
  });
  router.get("/:id/export", async (req, res) => {
    const file = await exportRevision(db, currentUser(req), revisionId(req.params.id));
    res.setHeader("X-Content-SHA256", file.sha256);
    res.attachment(file.fileName);
    res.type("application/json").send(file.text);
  });
  return router;
}
