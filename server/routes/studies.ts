import { Router } from "express";
import { importRevisionFieldsSchema, createRevisionSchema } from "../../shared/schemas/revisions.js";
import { createStudySchema, patchStudySchema } from "../../shared/schemas/studies.js";
import type { AppContext } from "../app-context.js";
import { requestSweeps } from "../lib/request-sweeps.js";
import { uploadOne } from "../lib/uploads.js";
import { currentUser, fromParam, requireAuth } from "../middleware/auth.js";
import { parseObjectId } from "../services/access.js";
import { importRevision, listStudyRevisions, saveRevision } from "../services/revisions.js";
import { createStudy, getStudy, listAlternativeStudies, patchStudy } from "../services/studies.js";

const MAX_STUDY_FILE_BYTES = 1024 * 1024;

/** Splits the raw `study` member off a body: it is validated by the study format, with JSON paths. */
function withRawStudy(body: unknown): { rest: Record<string, unknown>; study: unknown } {
  const { study, ...rest } = (typeof body === "object" && body !== null ? body : {}) as Record<string, unknown>;
  return { rest, study };
}

/** /api/alternatives/:alternativeId/studies: list (analysts, reviewers), create (analysts). */
export function alternativeStudyRoutes({ db, sweeps }: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  router.get("/", async (req, res) => {
    res.json(await listAlternativeStudies(db, currentUser(req), parseObjectId(fromParam("alternativeId")(req), "Alternative")));
  });
  router.post("/", async (req, res) => {
    const alternativeId = parseObjectId(fromParam("alternativeId")(req), "Alternative");
    const { rest, study } = withRawStudy(req.body);
    const input = createStudySchema.omit({ study: true }).parse(rest);
    const user = currentUser(req);
    res.status(201).json(await createStudy(db, requestSweeps(sweeps, user, res), user, alternativeId, { ...input, study }, req.ip));
  });
  return router;
}

const studyId = (raw: string | string[] | undefined) => parseObjectId(raw, "Study");

/** /api/studies/:id: read, rename, revisions (list, save), import of a study file as a new revision. */
export function studyRoutes({ db, sweeps }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);
  router.get("/:id", async (req, res) => {
    res.json(await getStudy(db, currentUser(req), studyId(req.params.id)));
  });
  router.patch("/:id", async (req, res) => {
    const id = studyId(req.params.id);
    res.json(await patchStudy(db, currentUser(req), id, patchStudySchema.parse(req.body ?? {}), req.ip));
  });
  router.get("/:id/revisions", async (req, res) => {
    res.json(await listStudyRevisions(db, currentUser(req), studyId(req.params.id)));
  });
  router.post("/:id/revisions", async (req, res) => {
    const id = studyId(req.params.id);
    const { rest, study } = withRawStudy(req.body);
    const input = createRevisionSchema.omit({ study: true }).parse(rest);
    const user = currentUser(req);
    res.status(201).json(await saveRevision(db, requestSweeps(sweeps, user, res), user, id, { ...input, study }, req.ip, "api"));
  });
  router.post("/:id/import", uploadOne("file", MAX_STUDY_FILE_BYTES), async (req, res) => {
    const id = studyId(req.params.id);
    const fields = importRevisionFieldsSchema.parse(req.body ?? {});
    const user = currentUser(req);
    res.status(201).json(await importRevision(db, requestSweeps(sweeps, user, res), user, id, fields, req.file, req.ip));
  });
  return router;
}
