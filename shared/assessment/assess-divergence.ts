import { staticMomentSlope } from "../criteria/static-moment-slope";
import { divergenceSpeed } from "../engine/divergence-speed";
import type { AssessedDivergence } from "../schemas/assessment";
import type { SweepResult } from "../schemas/result";
import type { StudyDocument } from "../schemas/study";
import { speedText } from "./format";

const CLOSED_FORM_BASIS = "Closed-form torsional divergence √(2Iω_α²/(ρB²S)), EN 1991-1-4 E.4.3, Expr. (E.24): torsion only, from the static moment slope S";
const STATIC_BASIS =
  "Static instability of the sweep: a real pole crosses zero where the coupled static stiffness det(K_s − K_ae) vanishes " +
  "(H3*, H4*, A4* as well as A3*)";

/**
 * The closed-form value as the engine reported it: `divergence` inside the sweep, `divergenceOutsideSweep` outside it.
 * Results stored before engine 1.1.0 lack the second field; for them the same engine routine gives the value.
 */
function closedFormSpeed(document: StudyDocument, result: SweepResult, slope: number | null): { speed: number | null; withinSweep: boolean } {
  if (result.divergence) return { speed: result.divergence.speed, withinSweep: true };
  if (result.divergenceOutsideSweep !== undefined) return { speed: result.divergenceOutsideSweep?.speed ?? null, withinSweep: false };
  const torsion = document.structure.modes.find((m) => m.dof === "torsion")!;
  const speed = divergenceSpeed(document.structure.inertia, torsion.frequency, document.air.density, document.deck.width, slope);
  return { speed, withinSweep: false };
}

/** The static-instability warning's crossings with their branches (the field from engine 1.1.0 on, else the message). */
function staticCrossings(result: SweepResult): { speeds: number[]; branches: (string | null)[] } {
  const warning = result.warnings.find((w) => w.code === "static-instability");
  if (!warning?.speeds?.length) return { speeds: [], branches: [] };
  const named = [...warning.message.matchAll(/on the branch that started as mode (\S+?)(?=[:,;.]?\s|[:,;.]?$)/g)].map((m) => m[1]);
  return { speeds: warning.speeds, branches: warning.speeds.map((_, i) => warning.branches?.[i] ?? named[i] ?? null) };
}

/**
 * Divergence named by its basis: the closed form of EN 1991-1-4 E.4.3 (from the static moment slope, inside or
 * beyond the sweep) and the sweep's static instability (the coupled static root crossing zero, with its branch),
 * and which of the two the margin uses — the lower of those found, since either marks the loss of static
 * torsional stiffness and the lower one is reached first.
 *
 * @param document - the study document
 * @param result - its sweep result
 * @param lastSolvedMps - highest speed solved, m/s
 */
export function assessDivergence(document: StudyDocument, result: SweepResult, lastSolvedMps: number): AssessedDivergence {
  const slope = staticMomentSlope(document.aerodynamics);
  const still = !(document.air.density > 0);
  const closed = still ? { speed: null, withinSweep: false } : closedFormSpeed(document, result, slope?.value ?? null);
  const slopeSource = slope ? `S = dC_M/dα = ${slope.value.toFixed(4)} per rad: ${slope.origin}` : "no static moment slope available";
  const closedStatement = still
    ? "Closed-form divergence: none — air density 0 (still-air check)."
    : closed.speed !== null
      ? `Closed-form torsional divergence (EN 1991-1-4 E.24) at ${speedText(closed.speed)}${closed.withinSweep ? "" : `, beyond the swept range (up to ${speedText(lastSolvedMps)})`}; ${slopeSource}.`
      : `Closed-form torsional divergence: none — ${slopeSource}, not positive.`;

  const crossings = staticCrossings(result);
  const first = crossings.speeds.length > 0 ? crossings.speeds[0] : null;
  const branch = crossings.branches[0] ?? null;
  const staticStatement =
    first !== null
      ? `Static instability of the sweep at ${speedText(first)}${branch ? ` on branch ${branch}` : ""}: a real pole crosses zero there` +
        (crossings.speeds.length > 1 ? `; further crossings at ${crossings.speeds.slice(1).map(speedText).join(", ")}.` : ".")
      : `Static instability of the sweep: no real pole crosses zero up to ${speedText(lastSolvedMps)}.`;

  const candidates = [
    ...(closed.speed !== null ? [{ basis: "closed-form" as const, speed: closed.speed }] : []),
    ...(first !== null ? [{ basis: "static-instability" as const, speed: first }] : []),
  ].sort((a, b) => a.speed - b.speed);
  const governing = candidates[0] ?? null;
  let marginBasis: string;
  if (!governing) {
    marginBasis = still
      ? "No divergence margin: without air there is no aerodynamic moment."
      : `No divergence figure: the closed form gives none (S ≤ 0) and no real pole crosses zero up to ${speedText(lastSolvedMps)}.`;
  } else if (candidates.length === 2) {
    const other = candidates[1];
    marginBasis =
      `The divergence margin uses the ${governing.basis === "closed-form" ? "closed form" : "sweep's static instability"} ` +
      `(${speedText(governing.speed)}), the lower of the two figures: the ${other.basis === "closed-form" ? "closed form" : "static instability"} ` +
      `lies at ${speedText(other.speed)}. Either marks the loss of static torsional stiffness, and the lower one is reached first.`;
  } else {
    marginBasis =
      governing.basis === "closed-form"
        ? `The divergence margin uses the closed form (${speedText(governing.speed)}): no real pole of the sweep crosses zero up to ${speedText(lastSolvedMps)}.`
        : `The divergence margin uses the sweep's static instability (${speedText(governing.speed)}): the closed form gives none (S ≤ 0).`;
  }

  return {
    closedForm: {
      speedMps: closed.speed,
      withinSweep: closed.withinSweep,
      momentSlope: slope?.value ?? null,
      slopeSource,
      basis: CLOSED_FORM_BASIS,
      statement: closedStatement,
    },
    staticInstability: {
      speedMps: first,
      branch,
      furtherSpeedsMps: crossings.speeds.slice(1),
      upToMps: lastSolvedMps,
      basis: STATIC_BASIS,
      statement: staticStatement,
    },
    governing: governing?.basis ?? "none",
    governingSpeedMps: governing?.speed ?? null,
    marginBasis,
  };
}
