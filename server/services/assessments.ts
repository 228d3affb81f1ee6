/**
 * The stored assessments of revisions (shared/assessment): each computed once for what it is computed from — the
 * revision, the project's current criteria version, the results it uses and the assessor's version — and kept. A
 * revision saved gets its assessment in the same transaction; a revision stored before assessments existed, or
 * read after the criteria changed, gets its new one on first read (with an audit event naming who asked). Screens
 * show the newest for the current key; a signature keeps the one it signed.
 */
import { assessRevision, ASSESSOR_VERSION } from "../../shared/assessment/assess-revision.js";
import type { Assessment, StoredAssessmentDto } from "../../shared/schemas/assessment.js";
import type { SweepResult } from "../../shared/schemas/result.js";
import type { StudyDocument } from "../../shared/schemas/study.js";
import type { DbOrTx } from "../db/client.js";
import { findAssessmentById, insertAssessment, listAssessmentsOfRevisions, type RevisionAssessmentRow } from "../db/queries/assessments.js";
import { writeAudit } from "../db/queries/audit.js";
import { findCurrentCriteria, type CriteriaVersionRow } from "../db/queries/criteria.js";
import { findRevision } from "../db/queries/revisions.js";

export interface StoredAssessment {
  id: number;
  revisionId: number;
  createdAt: Date;
  assessment: Assessment;
}

/** What picks a revision's assessment: the revision, its project (for the criteria) and its result's engine. */
export interface AssessmentTarget {
  id: number;
  projectId: number;
  engineVersion: string;
  /** The revision's document and result when the caller holds them (else they are read when needed). */
  document?: StudyDocument;
  result?: SweepResult;
}

/**
 * Who asks for an assessment (recorded in the audit event of one computed now), and whether computing it is a write of
 * its own (a read that finds none) or part of the caller's write (a revision saved, whose audit event names it).
 */
export interface AssessmentActor {
  id: number | null;
  audit: boolean;
}

const resultsKeyOf = (engineVersion: string) => `sweep@${engineVersion}`;

const stored = (row: RevisionAssessmentRow): StoredAssessment => ({
  id: row.id,
  revisionId: row.revisionId,
  createdAt: row.createdAt,
  assessment: row.assessment,
});

export function toAssessmentDto(a: StoredAssessment): StoredAssessmentDto {
  return { id: String(a.id), revisionId: String(a.revisionId), createdAt: a.createdAt.toISOString(), assessment: a.assessment };
}

/** Computes and stores the assessment of one revision against a criteria version (or returns the one a concurrent reader stored). */
async function computeAndStore(
  db: DbOrTx,
  revision: { id: number; document: StudyDocument; result: SweepResult },
  criteria: CriteriaVersionRow | undefined,
  actor: AssessmentActor,
): Promise<StoredAssessment> {
  const assessment = assessRevision({
    document: revision.document,
    result: revision.result,
    criteria: criteria ? { version: criteria.version, criteria: criteria.criteria } : null,
  });
  const key = {
    revisionId: revision.id,
    criteriaVersion: criteria?.version ?? null,
    resultsKey: resultsKeyOf(revision.result.engine),
    assessor: ASSESSOR_VERSION,
  };
  return db.transaction(async (tx) => {
    const id = await insertAssessment(tx, { ...key, source: assessment.computedFrom, assessment });
    if (id !== undefined) {
      // Saved with the revision, the assessment belongs to that write (its audit event names it); computed on a
      // read, it is a write of its own.
      if (actor.audit) {
        await writeAudit(tx, {
          actorId: actor.id,
        action: "assessment.create",
        objectType: "revision",
        objectId: revision.id,
          details: { assessmentId: id, criteriaVersion: key.criteriaVersion, results: key.resultsKey, assessor: key.assessor },
        });
      }
      return stored((await findAssessmentById(tx, id))!);
    }
    const rows = await listAssessmentsOfRevisions(tx, [revision.id], ASSESSOR_VERSION);
    const match = rows.find((r) => r.criteriaVersion === key.criteriaVersion && r.resultsKey === key.resultsKey);
    if (!match) throw new Error(`assessment of revision ${revision.id} neither stored nor found`);
    return stored(match);
  });
}

/**
 * The current assessment of each revision: the stored one for the project's current criteria version and the
 * revision's results, computed and stored first when there is none yet.
 *
 * @param db - the pool or the caller's transaction
 * @param revisions - the revisions, with their project and their result's engine version
 * @param actor - who asks; a reader by default (an assessment computed now is audited as its own write)
 */
export async function currentAssessments(
  db: DbOrTx,
  revisions: readonly AssessmentTarget[],
  actor: AssessmentActor | number | null,
): Promise<Map<number, StoredAssessment>> {
  const who = typeof actor === "object" && actor !== null ? actor : { id: actor, audit: true };
  const criteria = new Map<number, CriteriaVersionRow | undefined>();
  for (const r of revisions) if (!criteria.has(r.projectId)) criteria.set(r.projectId, await findCurrentCriteria(db, r.projectId));
  const rows = await listAssessmentsOfRevisions(db, [...new Set(revisions.map((r) => r.id))], ASSESSOR_VERSION);
  const out = new Map<number, StoredAssessment>();
  for (const r of revisions) {
    if (out.has(r.id)) continue;
    const version = criteria.get(r.projectId)?.version ?? null;
    const match = rows.find((a) => a.revisionId === r.id && a.criteriaVersion === version && a.resultsKey === resultsKeyOf(r.engineVersion));
    if (match) {
      out.set(r.id, stored(match));
      continue;
    }
    const full = r.document && r.result ? { document: r.document, result: r.result } : await findRevision(db, r.id);
    if (!full) throw new Error(`revision ${r.id} not found`);
    out.set(r.id, await computeAndStore(db, { id: r.id, document: full.document, result: full.result }, criteria.get(r.projectId), who));
  }
  return out;
}

/** The current assessment of one revision. */
export async function currentAssessment(db: DbOrTx, revision: AssessmentTarget, actor: AssessmentActor | number | null): Promise<StoredAssessment> {
  return (await currentAssessments(db, [revision], actor)).get(revision.id)!;
}
