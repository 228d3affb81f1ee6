import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import type { StudyDocument } from "../../../shared/schemas/study.js";
import type { DbOrTx } from "../client.js";
import { alternatives, studies, studyRevisions, users, type NewStudyRevision } from "../schema/index.js";

// Outer column qualified by hand: drizzle renders ${studyRevisions.studyId} bare in single-table selects, where it
// would bind to r2 and give the maximum over every study.
const latestNumber = sql<number>`(select max(r2.number)::int from ${studyRevisions} r2 where r2.study_id = "study_revisions"."study_id")`;

/** A revision without its document and result, with its project (whose criteria its assessment uses). */
const summaryColumns = {
  id: studyRevisions.id,
  studyId: studyRevisions.studyId,
  projectId: alternatives.projectId,
  number: studyRevisions.number,
  parentNumber: studyRevisions.parentNumber,
  authorId: studyRevisions.authorId,
  authorName: users.name,
  changeNote: studyRevisions.changeNote,
  documentSha256: studyRevisions.documentSha256,
  engineVersion: studyRevisions.engineVersion,
  createdAt: studyRevisions.createdAt,
  latestNumber,
};

/** Revisions with their study, alternative (for the project) and author. */
function selectSummaries(db: DbOrTx) {
  return db
    .select(summaryColumns)
    .from(studyRevisions)
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .leftJoin(users, eq(users.id, studyRevisions.authorId));
}

export type RevisionSummaryRow = Awaited<ReturnType<typeof listRevisions>>[number];

export async function listRevisions(db: DbOrTx, studyId: number) {
  return selectSummaries(db).where(eq(studyRevisions.studyId, studyId)).orderBy(asc(studyRevisions.number));
}

/** The newest revision of each of the studies (none for a study without revisions). */
export async function latestRevisionsOf(db: DbOrTx, studyIds: number[]): Promise<Map<number, RevisionSummaryRow>> {
  if (studyIds.length === 0) return new Map();
  const rows = await db
    .selectDistinctOn([studyRevisions.studyId], summaryColumns)
    .from(studyRevisions)
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .leftJoin(users, eq(users.id, studyRevisions.authorId))
    .where(inArray(studyRevisions.studyId, studyIds))
    .orderBy(studyRevisions.studyId, desc(studyRevisions.number));
  return new Map(rows.map((r) => [r.studyId, r]));
}

export async function findLatestRevision(db: DbOrTx, studyId: number) {
  const [row] = await selectSummaries(db).where(eq(studyRevisions.studyId, studyId)).orderBy(desc(studyRevisions.number)).limit(1);
  return row;
}

/** One revision with its document and result, its study's name and its project. */
export async function findRevision(db: DbOrTx, id: number) {
  const [row] = await db
    .select({
      ...summaryColumns,
      document: studyRevisions.document,
      result: studyRevisions.result,
      studyName: studies.name,
      alternativeId: studies.alternativeId,
    })
    .from(studyRevisions)
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .leftJoin(users, eq(users.id, studyRevisions.authorId))
    .where(eq(studyRevisions.id, id))
    .limit(1);
  return row;
}

export type RevisionRow = NonNullable<Awaited<ReturnType<typeof findRevision>>>;

/** A revision's summary with its project, to check access before reading more (diff). */
export async function findRevisionSummary(db: DbOrTx, id: number) {
  const [row] = await db
    .select({ ...summaryColumns, document: studyRevisions.document })
    .from(studyRevisions)
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .leftJoin(users, eq(users.id, studyRevisions.authorId))
    .where(eq(studyRevisions.id, id))
    .limit(1);
  return row;
}

export async function insertRevision(db: DbOrTx, values: NewStudyRevision): Promise<number> {
  const [row] = await db.insert(studyRevisions).values(values).returning({ id: studyRevisions.id });
  return row.id;
}

/** Every revision summary of every study of a project, with study and alternative names (comparison, trends). */
export async function listProjectRevisions(db: DbOrTx, projectId: number) {
  return db
    .select({
      ...summaryColumns,
      studyName: studies.name,
      alternativeId: alternatives.id,
      alternativeName: alternatives.name,
      // Only the small parts of the document a comparison shows (joined select: columns come out qualified).
      deck: sql<StudyDocument["deck"]>`${studyRevisions.document}->'deck'`,
      structure: sql<StudyDocument["structure"]>`${studyRevisions.document}->'structure'`,
      aerodynamicModel: sql<StudyDocument["aerodynamics"]["model"]>`${studyRevisions.document}->'aerodynamics'->>'model'`,
    })
    .from(studyRevisions)
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .leftJoin(users, eq(users.id, studyRevisions.authorId))
    .where(eq(alternatives.projectId, projectId))
    .orderBy(asc(alternatives.name), asc(studies.name), asc(studyRevisions.studyId), asc(studyRevisions.number));
}

/** Every study of a project with its alternative (also those without revisions). */
export async function listProjectStudies(db: DbOrTx, projectId: number) {
  return db
    .select({ studyId: studies.id, studyName: studies.name, alternativeId: alternatives.id, alternativeName: alternatives.name })
    .from(studies)
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .where(and(eq(alternatives.projectId, projectId)))
    .orderBy(asc(alternatives.name), asc(alternatives.id), asc(studies.name), asc(studies.id));
}

/** The aerodynamics of every revision of every study of a deck alternative (to tell which use a data set). */
export async function listAlternativeRevisionAerodynamics(db: DbOrTx, alternativeId: number) {
  return db
    .select({
      studyName: studies.name,
      number: studyRevisions.number,
      aerodynamics: sql<StudyDocument["aerodynamics"]>`${studyRevisions.document} -> 'aerodynamics'`,
    })
    .from(studyRevisions)
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .where(eq(studies.alternativeId, alternativeId))
    .orderBy(asc(studies.name), asc(studyRevisions.number));
}

/** What a download of a revision's step table needs: its project (access), study name, number and engine. */
export async function findRevisionHeader(db: DbOrTx, id: number) {
  const [row] = await db
    .select({
      id: studyRevisions.id,
      number: studyRevisions.number,
      engineVersion: studyRevisions.engineVersion,
      studyName: studies.name,
      projectId: alternatives.projectId,
    })
    .from(studyRevisions)
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .where(eq(studyRevisions.id, id))
    .limit(1);
  return row;
}
