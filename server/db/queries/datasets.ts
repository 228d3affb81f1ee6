import { asc, eq } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { aeroDatasets, alternatives, users, type NewAeroDataset } from "../schema/index.js";

/** Every column but the file bytes, with the project and the uploader's name. */
const columns = {
  id: aeroDatasets.id,
  alternativeId: aeroDatasets.alternativeId,
  projectId: alternatives.projectId,
  name: aeroDatasets.name,
  kind: aeroDatasets.kind,
  meanAngleDeg: aeroDatasets.meanAngleDeg,
  provenance: aeroDatasets.provenance,
  convention: aeroDatasets.convention,
  dragReference: aeroDatasets.dragReference,
  deckWidthM: aeroDatasets.deckWidthM,
  deckDepthM: aeroDatasets.deckDepthM,
  delivered: aeroDatasets.delivered,
  converted: aeroDatasets.converted,
  slopes: aeroDatasets.slopes,
  testedMin: aeroDatasets.testedMin,
  testedMax: aeroDatasets.testedMax,
  warnings: aeroDatasets.warnings,
  fileName: aeroDatasets.fileName,
  fileSha256: aeroDatasets.fileSha256,
  fileSizeBytes: aeroDatasets.fileSizeBytes,
  createdAt: aeroDatasets.createdAt,
  createdById: aeroDatasets.createdBy,
  createdByName: users.name,
};

function selectDatasets(db: DbOrTx) {
  return db
    .select(columns)
    .from(aeroDatasets)
    .innerJoin(alternatives, eq(alternatives.id, aeroDatasets.alternativeId))
    .leftJoin(users, eq(users.id, aeroDatasets.createdBy));
}

export type DatasetRow = Awaited<ReturnType<typeof findDataset>> & {};

export async function listDatasets(db: DbOrTx, alternativeId: number) {
  return selectDatasets(db).where(eq(aeroDatasets.alternativeId, alternativeId)).orderBy(asc(aeroDatasets.id));
}

export async function findDataset(db: DbOrTx, id: number) {
  const [row] = await selectDatasets(db).where(eq(aeroDatasets.id, id)).limit(1);
  return row;
}

export async function insertDataset(db: DbOrTx, values: NewAeroDataset): Promise<number> {
  const [row] = await db.insert(aeroDatasets).values(values).returning({ id: aeroDatasets.id });
  return row.id;
}

export async function updateDataset(
  db: DbOrTx,
  id: number,
  patch: Partial<Pick<NewAeroDataset, "name" | "meanAngleDeg" | "provenance">>,
): Promise<void> {
  await db
    .update(aeroDatasets)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(aeroDatasets.id, id));
}

export async function deleteDataset(db: DbOrTx, id: number): Promise<void> {
  await db.delete(aeroDatasets).where(eq(aeroDatasets.id, id));
}

export async function findDatasetFile(db: DbOrTx, id: number) {
  const [row] = await db
    .select({ bytes: aeroDatasets.fileBytes, name: aeroDatasets.fileName, sha256: aeroDatasets.fileSha256 })
    .from(aeroDatasets)
    .where(eq(aeroDatasets.id, id))
    .limit(1);
  return row;
}
