import { asc, eq, sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { alternatives, studies, studyRevisions, users, type NewStudy } from "../schema/index.js";

const columns = {
  id: studies.id,
  alternativeId: studies.alternativeId,
  alternativeName: alternatives.name,
  projectId: alternatives.projectId,
  name: studies.name,
  purpose: studies.purpose,
  createdAt: studies.createdAt,
  createdById: studies.createdBy,
  createdByName: users.name,
  // Outer column qualified by hand (drizzle leaves it bare in single-table selects).
  revisionCount: sql<number>`(select count(*)::int from ${studyRevisions} r where r.study_id = "studies"."id")`,
};

function selectStudies(db: DbOrTx) {
  return db
    .select(columns)
    .from(studies)
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .leftJoin(users, eq(users.id, studies.createdBy));
}

export type StudyRow = NonNullable<Awaited<ReturnType<typeof findStudy>>>;

export async function findStudy(db: DbOrTx, id: number) {
  const [row] = await selectStudies(db).where(eq(studies.id, id)).limit(1);
  return row;
}

export async function listStudies(db: DbOrTx, alternativeId: number) {
  return selectStudies(db).where(eq(studies.alternativeId, alternativeId)).orderBy(asc(studies.name), asc(studies.id));
}

export async function insertStudy(db: DbOrTx, values: NewStudy): Promise<number> {
  const [row] = await db.insert(studies).values(values).returning({ id: studies.id });
  return row.id;
}

export async function updateStudy(db: DbOrTx, id: number, patch: Partial<Pick<NewStudy, "name" | "purpose">>): Promise<void> {
  await db
    .update(studies)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(studies.id, id));
}

/**
 * Locks the study row until the end of the transaction: revision saves on the same study queue here, so the
 * second one sees the first one's revision and is answered 409 instead of racing for the same number.
 */
export async function lockStudy(tx: DbOrTx, id: number): Promise<boolean> {
  const rows = await tx.select({ id: studies.id }).from(studies).where(eq(studies.id, id)).for("update");
  return rows.length > 0;
}
