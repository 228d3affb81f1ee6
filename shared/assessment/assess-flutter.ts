import type { AssessedFlutter, TestedRange } from "../schemas/assessment";
import type { SweepResult } from "../schemas/result";
import type { StudyDocument } from "../schemas/study";
import { frequencyText, speedText, urText } from "./format";

const KIND = { coupled: "coupled (heave and torsion)", torsional: "torsional", heave: "heave" } as const;
/** The tabulated model's own tolerance on the table's ends (shared/engine/aero/tabulated.ts). */
const TOLERANCE = 1e-12;

/** The tested reduced-velocity range of a study's derivative table, or null for theory. */
export function tableRange(document: StudyDocument): [number, number] | null {
  const aero = document.aerodynamics;
  if (aero.model !== "tabulated") return null;
  return [aero.reducedVelocity[0], aero.reducedVelocity[aero.reducedVelocity.length - 1]];
}

function testedRangeOf(document: StudyDocument, flutter: NonNullable<SweepResult["flutter"]>): TestedRange {
  const range = tableRange(document);
  if (range === null) {
    return {
      status: "no-table",
      tableReducedVelocity: null,
      beyondBy: null,
      statement: `no derivative table: ${document.aerodynamics.model === "flat-plate" ? "thin-plate" : "quasi-steady"} theory at every reduced velocity`,
    };
  }
  const ur = flutter.reducedVelocity;
  const tested = `tested Ur ${urText(range[0])}–${urText(range[1])}`;
  // The engine says so itself from engine 1.1.0 on; for results stored before, the same test on the same numbers.
  const inside = flutter.insideTestedRange ?? (ur >= range[0] * (1 - TOLERANCE) && ur <= range[1] * (1 + TOLERANCE));
  if (inside) {
    return { status: "within", tableReducedVelocity: range, beyondBy: null, statement: `within the tested range (Ur ${urText(ur)} at flutter; ${tested})` };
  }
  const below = ur < range[0];
  const beyondBy = below ? range[0] - ur : ur - range[1];
  return {
    status: "beyond",
    tableReducedVelocity: range,
    beyondBy,
    statement:
      `beyond it by ΔUr ${urText(beyondBy)} (Ur ${urText(ur)} at flutter; ${tested}): the derivatives there are held from the ` +
      `table's ${below ? "first" : "last"} row, so this flutter speed rests on extrapolated data`,
  };
}

/**
 * Flutter as a reader is told it: the sweep's lowest zero-damping crossing with its branch and kind, and whether the
 * critical pole's own reduced velocity lies inside the derivative table's tested range; or none up to the highest
 * speed solved.
 *
 * @param document - the study document the result was computed from
 * @param result - its sweep result (`flutter` as the engine located it)
 * @param lastSolvedMps - highest speed solved, m/s
 */
export function assessFlutter(document: StudyDocument, result: SweepResult, lastSolvedMps: number): AssessedFlutter {
  const flutter = result.flutter;
  if (!flutter) {
    return {
      found: false,
      upToMps: lastSolvedMps,
      basis: "p-k sweep: no oscillating pole's damping ratio crosses zero on any branch",
      statement: `No flutter up to ${speedText(lastSolvedMps)}: every branch stays damped over the sweep.`,
    };
  }
  const testedRange = testedRangeOf(document, flutter);
  return {
    found: true,
    speedMps: flutter.speed,
    frequencyHz: flutter.frequency,
    reducedVelocity: flutter.reducedVelocity,
    kind: flutter.kind,
    branch: flutter.mode,
    testedRange,
    basis: `p-k sweep: lowest speed where an oscillating pole's damping ratio crosses zero, over every branch (branch ${flutter.mode}, ${KIND[flutter.kind]})`,
    statement:
      `Flutter at ${speedText(flutter.speed)} (${frequencyText(flutter.frequency)}, ${KIND[flutter.kind]}, branch ${flutter.mode}), ` +
      `${testedRange.statement}.`,
  };
}
