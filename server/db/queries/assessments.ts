import { and, desc, eq, inArray } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { revisionAssessments, type RevisionAssessmentRow } from "../schema/index.js";

export type { RevisionAssessmentRow };

/** Every assessment of the given revisions by one assessor version, newest first. */
export async function listAssessmentsOfRevisions(db: DbOrTx, revisionIds: number[], assessor: string): Promise<RevisionAssessmentRow[]> {
  if (revisionIds.length === 0) return [];
  return db
    .select()
    .from(revisionAssessments)
    .where(and(inArray(revisionAssessments.revisionId, revisionIds), eq(revisionAssessments.assessor, assessor)))
    .orderBy(desc(revisionAssessments.id));
}

export async function findAssessmentById(db: DbOrTx, id: number): Promise<RevisionAssessmentRow | undefined> {
  const [row] = await db.select().from(revisionAssessments).where(eq(revisionAssessments.id, id)).limit(1);
  return row;
}

/**
 * Stores an assessment unless one with the same key exists (a concurrent reader computed it first): returns the new
 * row's id, or undefined when the key was taken.
 */
export async function insertAssessment(
  db: DbOrTx,
  values: Omit<RevisionAssessmentRow, "id" | "createdAt">,
): Promise<number | undefined> {
  const [row] = await db.insert(revisionAssessments).values(values).onConflictDoNothing().returning({ id: revisionAssessments.id });
  return row?.id;
}
