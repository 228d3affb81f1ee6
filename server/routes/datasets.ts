import { Router } from "express";
import { MAX_DATASET_FILE_BYTES, patchDatasetSchema } from "../../shared/schemas/datasets.js";
import type { AppContext } from "../app-context.js";
import { uploadOne } from "../lib/uploads.js";
import { currentUser, fromParam, requireAuth } from "../middleware/auth.js";
import { parseObjectId } from "../services/access.js";
import {
  getDataset,
  getDatasetFile,
  listAlternativeDatasets,
  patchDataset,
  removeDataset,
  uploadDataset,
} from "../services/datasets.js";

/** /api/alternatives/:alternativeId/datasets: list (analysts, reviewers), upload (analysts; multipart file + meta). */
export function alternativeDatasetRoutes({ db }: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  router.get("/", async (req, res) => {
    res.json(await listAlternativeDatasets(db, currentUser(req), parseObjectId(fromParam("alternativeId")(req), "Alternative")));
  });
  router.post("/", uploadOne("file", MAX_DATASET_FILE_BYTES), async (req, res) => {
    const alternativeId = parseObjectId(fromParam("alternativeId")(req), "Alternative");
    const upload = { metaField: req.body?.meta, file: req.file };
    res.status(201).json(await uploadDataset(db, currentUser(req), alternativeId, upload, req.ip));
  });
  return router;
}

const datasetId = (raw: string | string[] | undefined) => parseObjectId(raw, "Data set");

/** /api/datasets/:id: read, original file, edit name and provenance, delete. */
export function datasetRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);
  router.get("/:id", async (req, res) => {
    res.json(await getDataset(db, currentUser(req), datasetId(req.params.id)));
  });
  router.get("/:id/original", async (req, res) => {
    const file = await getDatasetFile(db, currentUser(req), datasetId(req.params.id));
    res.setHeader("X-Content-SHA256", file.sha256);
    res.attachment(file.name);
    res.type("text/csv").send(file.bytes);
  });
  router.patch("/:id", async (req, res) => {
    const id = datasetId(req.params.id);
    const patch = patchDatasetSchema.parse(req.body ?? {});
    res.json(await patchDataset(db, currentUser(req), id, patch, req.ip));
  });
  router.delete("/:id", async (req, res) => {
    await removeDataset(db, currentUser(req), datasetId(req.params.id), req.ip);
    res.status(204).end();
  });
  return router;
}
