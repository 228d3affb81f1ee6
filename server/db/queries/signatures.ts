import { and, desc, eq, inArray, lt, sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { alternatives, projects, signatures, studies, studyRevisions, users, type Signature } from "../schema/index.js";

/** Inserts a signature; a second one for the same revision violates the unique key (23505). */
export async function insertSignature(db: DbOrTx, values: Omit<Signature, "id">): Promise<number> {
  const [row] = await db.insert(signatures).values(values).returning({ id: signatures.id });
  return row.id;
}

/**
 * Revisions newer than the study's newest signed one exist (work after the current summary). An unsigned revision
 * between this summary and a later signed one is not "newer work": the later signature covers the study.
 */
const newerUnsigned = sql<boolean>`exists (
  select 1 from ${studyRevisions} r2
  where r2.study_id = ${studyRevisions.studyId}
    and r2.number > (select max(r3.number) from ${studyRevisions} r3 join ${signatures} s3 on s3.revision_id = r3.id
                     where r3.study_id = ${studyRevisions.studyId}))`;

/** The newest signed revision's signature id of the row's study. */
const currentSignatureId = sql<number>`(
  select s2.id from ${signatures} s2 join ${studyRevisions} r2 on r2.id = s2.revision_id
  where r2.study_id = ${studyRevisions.studyId} order by r2.number desc limit 1)`;

const columns = {
  id: signatures.id,
  revisionId: signatures.revisionId,
  signerId: signatures.signerId,
  signerName: users.name,
  jws: signatures.jws,
  kid: signatures.kid,
  payload: signatures.payload,
  payloadSha256: signatures.payloadSha256,
  signedAt: signatures.signedAt,
  assessmentId: signatures.assessmentId,
  revisionNumber: studyRevisions.number,
  studyId: studyRevisions.studyId,
  studyName: studies.name,
  alternativeName: alternatives.name,
  projectId: alternatives.projectId,
  projectName: projects.name,
  newerUnsigned,
  currentSignatureId,
  newestRevisionNumber: sql<number>`(select max(r3.number)::int from ${studyRevisions} r3 where r3.study_id = ${studyRevisions.studyId})`,
};

function selectSignatures(db: DbOrTx) {
  return db
    .select(columns)
    .from(signatures)
    .innerJoin(studyRevisions, eq(studyRevisions.id, signatures.revisionId))
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .innerJoin(projects, eq(projects.id, alternatives.projectId))
    .innerJoin(users, eq(users.id, signatures.signerId));
}

export type SignatureRow = NonNullable<Awaited<ReturnType<typeof findSignature>>>;

export async function findSignature(db: DbOrTx, id: number) {
  const [row] = await selectSignatures(db).where(eq(signatures.id, id)).limit(1);
  return row;
}

export async function findSignatureOfRevision(db: DbOrTx, revisionId: number) {
  const [row] = await selectSignatures(db).where(eq(signatures.revisionId, revisionId)).limit(1);
  return row;
}

/** The signature of the study's newest signed revision numbered below `number` (what changed since it). */
export async function findPreviousSignature(db: DbOrTx, studyId: number, number: number) {
  const [row] = await selectSignatures(db)
    .where(and(eq(studyRevisions.studyId, studyId), lt(studyRevisions.number, number)))
    .orderBy(desc(studyRevisions.number))
    .limit(1);
  return row;
}

/**
 * The signature whose verification code (the first 12 hex digits of SHA-256 over the JWS text) is `hex12`. Codes are
 * not stored: PostgreSQL hashes each JWS (signatures are few: one per signed revision).
 */
export async function findSignatureByCode(db: DbOrTx, hex12: string) {
  const [row] = await selectSignatures(db)
    .where(sql`substr(encode(sha256(convert_to(${signatures.jws}, 'UTF8')), 'hex'), 1, 12) = ${hex12}`)
    .orderBy(signatures.id)
    .limit(1);
  return row;
}

export async function findSignatureByJws(db: DbOrTx, jws: string) {
  const [row] = await selectSignatures(db).where(eq(signatures.jws, jws)).limit(1);
  return row;
}

/** Signed summaries of the given projects (every project when `projectIds` is null), newest first. */
export async function listSignatures(db: DbOrTx, projectIds: number[] | null) {
  if (projectIds && projectIds.length === 0) return [];
  return selectSignatures(db)
    .where(projectIds ? inArray(alternatives.projectId, projectIds) : undefined)
    .orderBy(desc(signatures.signedAt), desc(signatures.id));
}

