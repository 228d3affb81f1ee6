import { evaluateCriteria } from "../../shared/criteria/evaluate-criteria.js";
import type { ComparisonDto } from "../../shared/schemas/comparison.js";
import type { Db } from "../db/client.js";
import { findCurrentCriteria } from "../db/queries/criteria.js";
import { listProjectRevisions, listProjectStudies } from "../db/queries/revisions.js";
import { assertRole, person, READ_ROLES } from "./access.js";
import { currentAssessments, toAssessmentDto } from "./assessments.js";
import type { SessionUser } from "./auth.js";

/** The project's current criteria evaluated (for the comparison's header), or null when there are none or they cannot be evaluated. */
async function criteriaHeader(db: Db, projectId: number): Promise<ComparisonDto["criteria"]> {
  const current = await findCurrentCriteria(db, projectId);
  if (!current) return null;
  try {
    const { designWind, required } = evaluateCriteria(current.criteria);
    return {
      version: current.version,
      meanSpeedMps: designWind.meanSpeedMps,
      requiredFlutterSpeedMps: required.flutter.requiredSpeedMps,
      requiredDivergenceSpeedMps: required.divergence.requiredSpeedMps,
    };
  } catch (err) {
    if (err instanceof RangeError) return null;
    throw err;
  }
}

/**
 * Every study's latest revision side by side with its current assessment (critical speeds with their basis, margins
 * against the project's required speeds, warnings), and per study every revision's figures in order — all read from
 * the revisions' stored assessments, none derived here.
 */
export async function getComparison(db: Db, user: SessionUser, projectId: number): Promise<ComparisonDto> {
  await assertRole(db, user, projectId, READ_ROLES);
  const [studyRows, revisions, criteria] = await Promise.all([
    listProjectStudies(db, projectId),
    listProjectRevisions(db, projectId),
    criteriaHeader(db, projectId),
  ]);
  const assessments = await currentAssessments(db, revisions, user.id);
  const byStudy = new Map<number, typeof revisions>();
  for (const r of revisions) byStudy.set(r.studyId, [...(byStudy.get(r.studyId) ?? []), r]);

  const rows: ComparisonDto["rows"] = studyRows.map((s) => {
    const latest = byStudy.get(s.studyId)?.at(-1);
    return {
      alternativeId: String(s.alternativeId),
      alternativeName: s.alternativeName,
      studyId: String(s.studyId),
      studyName: s.studyName,
      latest: latest
        ? {
            revisionId: String(latest.id),
            number: latest.number,
            createdAt: latest.createdAt.toISOString(),
            author: person(latest.authorId, latest.authorName),
            engineVersion: latest.engineVersion,
            assessment: toAssessmentDto(assessments.get(latest.id)!),
            deck: { widthM: latest.deck.width, depthM: latest.deck.depth },
            structure: {
              massKgPerM: latest.structure.mass,
              inertiaKgM2PerM: latest.structure.inertia,
              modes: latest.structure.modes.map((m) => ({ id: m.id, dof: m.dof, frequencyHz: m.frequency, damping: m.damping })),
            },
            aerodynamicModel: latest.aerodynamicModel,
          }
        : null,
    };
  });

  return {
    projectId: String(projectId),
    criteria,
    rows,
    trends: studyRows.map((s) => ({
      studyId: String(s.studyId),
      studyName: s.studyName,
      alternativeName: s.alternativeName,
      points: (byStudy.get(s.studyId) ?? []).map((r) => {
        const a = assessments.get(r.id)!.assessment;
        return {
          revisionId: String(r.id),
          number: r.number,
          createdAt: r.createdAt.toISOString(),
          changeNote: r.changeNote,
          flutterSpeedMps: a.flutter.found ? a.flutter.speedMps : null,
          flutterFrequencyHz: a.flutter.found ? a.flutter.frequencyHz : null,
          divergenceSpeedMps: a.divergence.governingSpeedMps,
          divergenceBasis: a.divergence.governing,
          sweepToMps: a.sweep.lastSolvedMps,
          warningCount: a.warningCount,
        };
      }),
    })),
  };
}
