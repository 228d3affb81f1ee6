/**
 * Builds the signed stability summary (`stillspan.summary/1`) of one stored revision. Every number is copied from
 * what is stored — the revision's document and sweep result, the project's current criteria evaluated by
 * shared/criteria, the aerodynamic data set the derivatives came from — never recomputed by the engine here.
 */
import { evaluateCriteria } from "../../shared/criteria/evaluate-criteria.js";
import { screenStudy } from "../../shared/criteria/screen-study.js";
import { sweepMargins } from "../../shared/criteria/sweep-margins.js";
import { PHENOMENA, type ProjectCriteria } from "../../shared/schemas/criteria.js";
import type { DerivativeConventionInput } from "../../shared/schemas/datasets.js";
import type { StudyAerodynamics } from "../../shared/schemas/study.js";
import { SUMMARY_FORMAT, type SummaryPayload } from "../../shared/schemas/summary.js";
import type { DbOrTx } from "../db/client.js";
import { listDatasets } from "../db/queries/datasets.js";
import type { RevisionRow } from "../db/queries/revisions.js";

type Dataset = Awaited<ReturnType<typeof listDatasets>>[number];

const ABSCISSA: Record<DerivativeConventionInput["abscissa"], string> = {
  Ur: "U/(fB)",
  "Ur-half": "U/(fb), b = B/2",
  K: "K = Bω/U",
  "k-half": "k = bω/U, b = B/2",
};
const NORMALISATION: Record<DerivativeConventionInput["normalisation"], string> = { B: "½ρU²B, ½ρU²B²", "2B": "½ρU²(2B), ½ρU²(2B²)" };
const SIGN: Record<DerivativeConventionInput["sign"], string> = { "h-down": "h and L downward", "h-up": "h and L upward" };
const COLUMNS = ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const;

function sameNumbers(a: readonly number[] | undefined, b: readonly number[] | undefined, length: number): boolean {
  const x = a ?? new Array<number>(length).fill(0);
  const y = b ?? new Array<number>(length).fill(0);
  if (x.length !== y.length) return false;
  return x.every((v, i) => Math.abs(v - y[i]) <= 1e-9 * Math.max(1, Math.abs(v), Math.abs(y[i])));
}

/**
 * The flutter-derivative data set of the alternative whose converted table is the study's table (the workspace
 * copies a data set's converted table into the study document), or undefined when the table was typed in.
 */
export function matchingDataset(datasets: Dataset[], aero: StudyAerodynamics): Dataset | undefined {
  if (aero.model !== "tabulated") return undefined;
  const n = aero.reducedVelocity.length;
  return datasets.find((d) => {
    if (d.kind !== "flutter-derivatives" || !("reducedVelocity" in d.converted)) return false;
    const c = d.converted as Record<string, number[]>;
    return sameNumbers(c.reducedVelocity, aero.reducedVelocity, n) && COLUMNS.every((k) => sameNumbers(c[k], aero[k], n));
  });
}

function facilityText(d: Dataset): string | null {
  const p = d.provenance;
  const parts = [
    p.facility,
    p.modelScale ? `1:${p.modelScale} section model` : "",
    `${p.flow} flow${p.turbulenceIntensityPct !== null ? ` (I_u ${p.turbulenceIntensityPct} %)` : ""}`,
    p.reynoldsNumber ? `Re ${p.reynoldsNumber.toExponential(2)}` : "",
    p.testDate ? `tested ${p.testDate}` : "",
  ].filter(Boolean);
  return parts.length ? parts.join(", ").slice(0, 500) : null;
}

function aerodynamicData(aero: StudyAerodynamics, dataset: Dataset | undefined): SummaryPayload["aerodynamicData"] {
  if (aero.model === "flat-plate") {
    return {
      name: "Thin-plate (Theodorsen) flutter derivatives",
      origin: "theoretical",
      sha256: null,
      deliveredConvention: null,
      testedReducedVelocity: null,
      facility: null,
    };
  }
  if (aero.model === "quasi-steady") {
    return {
      name: `Quasi-steady theory (dC_L/dα ${aero.liftSlope}, C_D ${aero.dragCoefficient}, dC_M/dα ${aero.momentSlope} per rad)`,
      origin: "theoretical",
      sha256: null,
      deliveredConvention: null,
      testedReducedVelocity: null,
      facility: null,
    };
  }
  const ur = aero.reducedVelocity;
  if (!dataset) {
    return {
      name: "Flutter derivatives entered in the study (no matching data set on record)",
      origin: "measured",
      sha256: null,
      deliveredConvention: null,
      testedReducedVelocity: [ur[0], ur[ur.length - 1]],
      facility: null,
    };
  }
  const convention = dataset.convention;
  return {
    name: dataset.name,
    origin: "measured",
    sha256: dataset.fileSha256,
    deliveredConvention: convention
      ? { abscissa: ABSCISSA[convention.abscissa], normalisation: NORMALISATION[convention.normalisation], signConvention: SIGN[convention.sign] }
      : null,
    testedReducedVelocity: [dataset.testedMin, dataset.testedMax],
    facility: facilityText(dataset),
  };
}

export interface SummaryInput {
  revision: RevisionRow;
  projectName: string;
  alternativeName: string;
  criteria: ProjectCriteria;
  signer: { name: string; email: string };
  signedAt: Date;
  statement: string;
}

/** The summary payload of a revision, ready to be signed (validated by the signer against the schema). */
export async function buildSummaryPayload(db: DbOrTx, input: SummaryInput): Promise<SummaryPayload> {
  const { revision, criteria } = input;
  const { document, result } = revision;
  const evaluated = evaluateCriteria(criteria);
  let screening: ReturnType<typeof screenStudy> | null;
  try {
    screening = document.air.density > 0 ? screenStudy(document, criteria) : null;
  } catch {
    screening = null; // screening is optional for the margins; the sweep's own numbers still count
  }
  const margins = sweepMargins(result, evaluated.required, screening);
  const dataset = matchingDataset(await listDatasets(db, revision.alternativeId), document.aerodynamics);
  const divergenceSpeed = result.divergence?.speed ?? revision.critical.divergenceSpeedMps;

  return {
    format: SUMMARY_FORMAT,
    project: { id: String(revision.projectId), name: input.projectName },
    alternative: { id: String(revision.alternativeId), name: input.alternativeName },
    study: { id: String(revision.studyId), name: revision.studyName },
    revision: {
      id: String(revision.id),
      number: revision.number,
      contentHash: revision.documentSha256,
      createdAt: revision.createdAt.toISOString(),
    },
    engineVersion: revision.engineVersion,
    model: { kind: "section-model", degreesOfFreedom: document.structure.modes.length, aerodynamics: document.aerodynamics.model },
    aerodynamicData: aerodynamicData(document.aerodynamics, dataset),
    sweep: { fromMps: document.sweep.from, toMps: document.sweep.to, airDensityKgM3: document.air.density },
    flutter: result.flutter
      ? {
          speedMps: result.flutter.speed,
          frequencyHz: result.flutter.frequency,
          mode: result.flutter.mode,
          kind: result.flutter.kind,
          reducedVelocity: result.flutter.reducedVelocity,
        }
      : null,
    divergence: divergenceSpeed !== null && divergenceSpeed !== undefined ? { speedMps: divergenceSpeed, frequencyHz: 0 } : null,
    designWind: {
      meanSpeedMps: evaluated.designWind.meanSpeedMps,
      basicSpeedMps: evaluated.designWind.basicSpeedMps,
      deckHeightM: evaluated.designWind.deckHeightM,
      sources: evaluated.designWind.sources,
    },
    criteria: PHENOMENA.map((phenomenon) => ({ phenomenon, ...evaluated.required[phenomenon] })),
    margins: PHENOMENA.map((phenomenon) => ({ phenomenon, ...margins[phenomenon] })),
    warnings: result.warnings.map((w) => ({ code: w.code, message: w.message })),
    signer: input.signer,
    signedAt: input.signedAt.toISOString(),
    statement: input.statement,
  };
}
