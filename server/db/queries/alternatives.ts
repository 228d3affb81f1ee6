import { asc, eq, sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { aeroDatasets, alternatives, studies, type NewAlternative } from "../schema/index.js";

/** Every column but the image bytes, with the counts of studies and data sets. */
const summaryColumns = {
  id: alternatives.id,
  projectId: alternatives.projectId,
  name: alternatives.name,
  description: alternatives.description,
  deckWidthM: alternatives.deckWidthM,
  deckDepthM: alternatives.deckDepthM,
  imageContentType: alternatives.imageContentType,
  imageSha256: alternatives.imageSha256,
  imageSizeBytes: alternatives.imageSizeBytes,
  imageUploadedAt: alternatives.imageUploadedAt,
  createdAt: alternatives.createdAt,
  updatedAt: alternatives.updatedAt,
  // Outer columns written out qualified: in a single-table select drizzle renders ${alternatives.id} as a bare
  // "id", which inside the subquery would bind to the inner table.
  studyCount: sql<number>`(select count(*)::int from ${studies} s where s.alternative_id = "alternatives"."id")`,
  datasetCount: sql<number>`(select count(*)::int from ${aeroDatasets} d where d.alternative_id = "alternatives"."id")`,
};

export type AlternativeRow = Awaited<ReturnType<typeof listAlternatives>>[number];

export async function listAlternatives(db: DbOrTx, projectId: number) {
  return db
    .select(summaryColumns)
    .from(alternatives)
    .where(eq(alternatives.projectId, projectId))
    .orderBy(asc(alternatives.name), asc(alternatives.id));
}

export async function findAlternative(db: DbOrTx, id: number): Promise<AlternativeRow | undefined> {
  const [row] = await db.select(summaryColumns).from(alternatives).where(eq(alternatives.id, id)).limit(1);
  return row;
}

export async function insertAlternative(db: DbOrTx, values: NewAlternative): Promise<number> {
  const [row] = await db.insert(alternatives).values(values).returning({ id: alternatives.id });
  return row.id;
}

export async function updateAlternative(
  db: DbOrTx,
  id: number,
  patch: Partial<Pick<NewAlternative, "name" | "description" | "deckWidthM" | "deckDepthM">>,
): Promise<void> {
  await db
    .update(alternatives)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(alternatives.id, id));
}

export async function deleteAlternative(db: DbOrTx, id: number): Promise<void> {
  await db.delete(alternatives).where(eq(alternatives.id, id));
}

export async function setAlternativeImage(
  db: DbOrTx,
  id: number,
  image: { bytes: Buffer; contentType: string; sha256: string } | null,
): Promise<void> {
  await db
    .update(alternatives)
    .set({
      imageBytes: image?.bytes ?? null,
      imageContentType: image?.contentType ?? null,
      imageSha256: image?.sha256 ?? null,
      imageSizeBytes: image?.bytes.length ?? null,
      imageUploadedAt: image ? new Date() : null,
      updatedAt: new Date(),
    })
    .where(eq(alternatives.id, id));
}

export async function findAlternativeImage(
  db: DbOrTx,
  id: number,
): Promise<{ bytes: Buffer | null; contentType: string | null; sha256: string | null } | undefined> {
  const [row] = await db
    .select({ bytes: alternatives.imageBytes, contentType: alternatives.imageContentType, sha256: alternatives.imageSha256 })
    .from(alternatives)
    .where(eq(alternatives.id, id))
    .limit(1);
  return row;
}
