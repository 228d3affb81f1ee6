import { evaluateCriteria } from "../../shared/criteria/evaluate-criteria.js";
import { computeMargins, type CriticalSpeed, type Margin } from "../../shared/criteria/margins.js";
import type { ComparisonDto, ComparisonMargin } from "../../shared/schemas/comparison.js";
import type { CriticalSpeeds } from "../../shared/schemas/revisions.js";
import type { Db, DbOrTx } from "../db/client.js";
import { findCurrentCriteria } from "../db/queries/criteria.js";
import { listProjectRevisions, listProjectStudies } from "../db/queries/revisions.js";
import { assertRole, person, READ_ROLES } from "./access.js";
import type { SessionUser } from "./auth.js";

export function flutterFound(c: CriticalSpeeds): CriticalSpeed {
  return c.flutter ? { kind: "speed", speedMps: c.flutter.speedMps } : { kind: "above", speedMps: c.sweepToMps };
}

export function divergenceFound(c: CriticalSpeeds): CriticalSpeed {
  return c.divergenceSpeedMps !== null
    ? { kind: "speed", speedMps: c.divergenceSpeedMps }
    : { kind: "none", reason: c.divergenceNote ?? "divergence cannot occur" };
}

/** Flutter and divergence are stability limits: never the onset screening's "investigate" or "clear". */
export function stabilityMargin(margin: Margin): ComparisonMargin {
  const { status } = margin;
  if (status === "investigate" || status === "clear") throw new Error(`a stability check cannot be "${status}"`);
  return { ...margin, status };
}

/** The project's current criteria evaluated, or null when there are none (or they cannot be evaluated). */
export async function requiredSpeedsOf(db: DbOrTx, projectId: number) {
  const current = await findCurrentCriteria(db, projectId);
  if (!current) return null;
  try {
    return { version: current.version, ...evaluateCriteria(current.criteria) };
  } catch (err) {
    if (err instanceof RangeError) return null;
    throw err;
  }
}

/**
 * Every study's latest revision side by side with margins against the project's required speeds, and per
 * study the critical speeds of all revisions in order. No flutter up to the end of the sweep counts as a lower
 * bound (margins/computeMargins); divergence comes from its closed form.
 */
export async function getComparison(db: Db, user: SessionUser, projectId: number): Promise<ComparisonDto> {
  await assertRole(db, user, projectId, READ_ROLES);
  const [studyRows, revisions, criteria] = await Promise.all([
    listProjectStudies(db, projectId),
    listProjectRevisions(db, projectId),
    requiredSpeedsOf(db, projectId),
  ]);
  const byStudy = new Map<number, typeof revisions>();
  for (const r of revisions) byStudy.set(r.studyId, [...(byStudy.get(r.studyId) ?? []), r]);

  const rows: ComparisonDto["rows"] = studyRows.map((s) => {
    const latest = byStudy.get(s.studyId)?.at(-1);
    let margins: ComparisonDto["rows"][number]["margins"] = null;
    if (latest && criteria) {
      const all = computeMargins({ flutter: flutterFound(latest.critical), divergence: divergenceFound(latest.critical) }, criteria.required);
      margins = { flutter: stabilityMargin(all.flutter), divergence: stabilityMargin(all.divergence) };
    }
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
            critical: latest.critical,
            deck: { widthM: latest.deck.width, depthM: latest.deck.depth },
            structure: {
              massKgPerM: latest.structure.mass,
              inertiaKgM2PerM: latest.structure.inertia,
              modes: latest.structure.modes.map((m) => ({ id: m.id, dof: m.dof, frequencyHz: m.frequency, damping: m.damping })),
            },
            aerodynamicModel: latest.aerodynamicModel,
          }
        : null,
      margins,
    };
  });

  return {
    projectId: String(projectId),
    criteria: criteria
      ? {
          version: criteria.version,
          meanSpeedMps: criteria.designWind.meanSpeedMps,
          requiredFlutterSpeedMps: criteria.required.flutter.requiredSpeedMps,
          requiredDivergenceSpeedMps: criteria.required.divergence.requiredSpeedMps,
        }
      : null,
    rows,
    trends: studyRows.map((s) => ({
      studyId: String(s.studyId),
      studyName: s.studyName,
      alternativeName: s.alternativeName,
      points: (byStudy.get(s.studyId) ?? []).map((r) => ({
        revisionId: String(r.id),
        number: r.number,
        createdAt: r.createdAt.toISOString(),
        changeNote: r.changeNote,
        flutterSpeedMps: r.critical.flutter?.speedMps ?? null,
        flutterFrequencyHz: r.critical.flutter?.frequencyHz ?? null,
        divergenceSpeedMps: r.critical.divergenceSpeedMps,
        sweepToMps: r.critical.sweepToMps,
      })),
    })),
  };
}
