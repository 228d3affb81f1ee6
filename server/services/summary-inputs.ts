/**
 * The inputs a signed summary carries (`inputs` of `stillspan.summary/2`): what the result depends on, copied from the
 * revision's study document and from the aerodynamic data set its derivative table was copied from (with the set's
 * provenance and delivered convention). The ratios are the usual dimensionless groups of the section model.
 */
import type { DerivativeConventionInput } from "../../shared/schemas/datasets.js";
import type { StudyAerodynamics, StudyDocument } from "../../shared/schemas/study.js";
import { STUDY_CONVENTIONS, type SummaryInputs } from "../../shared/schemas/summary.js";
import { derivedQuantities } from "../../shared/study-derived-quantities.js";
import type { listDatasets } from "../db/queries/datasets.js";

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

function aerodynamics(aero: StudyAerodynamics, dataset: Dataset | undefined): SummaryInputs["aerodynamics"] {
  const common = { conventions: STUDY_CONVENTIONS, interpolation: null, tableRows: null, testedReducedVelocity: null, staticMomentSlopePerRad: null, quasiSteady: null, dataset: null };
  if (aero.model === "flat-plate") {
    return { ...common, model: "flat-plate", description: "Thin-plate (Theodorsen) flutter derivatives" };
  }
  if (aero.model === "quasi-steady") {
    return {
      ...common,
      model: "quasi-steady",
      description: "Quasi-steady flutter derivatives from static coefficient slopes",
      quasiSteady: { liftSlopePerRad: aero.liftSlope, dragCoefficient: aero.dragCoefficient, momentSlopePerRad: aero.momentSlope },
    };
  }
  const ur = aero.reducedVelocity;
  const p = dataset?.provenance;
  return {
    ...common,
    model: "tabulated",
    description: dataset
      ? `Measured flutter derivatives: data set “${dataset.name}”`
      : "Flutter derivatives entered in the study (no matching data set on record)",
    interpolation: aero.interpolation,
    tableRows: ur.length,
    testedReducedVelocity: [ur[0], ur[ur.length - 1]],
    staticMomentSlopePerRad: aero.staticMomentSlope ?? null,
    dataset:
      dataset && p && dataset.convention
        ? {
            name: dataset.name,
            fileSha256: dataset.fileSha256,
            deliveredConvention: {
              abscissa: ABSCISSA[dataset.convention.abscissa],
              normalisation: NORMALISATION[dataset.convention.normalisation],
              signConvention: SIGN[dataset.convention.sign],
            },
            meanAngleDeg: dataset.meanAngleDeg,
            facility: p.facility.trim() ? p.facility.trim() : null,
            modelScale: p.modelScale,
            flow: p.flow,
            turbulenceIntensityPct: p.turbulenceIntensityPct,
            reynoldsNumber: p.reynoldsNumber,
            testDate: p.testDate,
          }
        : null,
  };
}

/** Every input the result depends on, with the section model's dimensionless ratios. */
export function summaryInputs(document: StudyDocument, dataset: Dataset | undefined): SummaryInputs {
  const { mass, inertia, modes } = document.structure;
  // The quantities the study form shows beside the structure, from the same routine.
  const derived = derivedQuantities(document);
  return {
    airDensityKgM3: document.air.density,
    deck: { widthM: document.deck.width, depthM: document.deck.depth },
    structure: {
      massKgPerM: mass,
      inertiaKgM2PerM: inertia,
      modes: modes.map((m) => ({ id: m.id, dof: m.dof, frequencyHz: m.frequency, dampingRatio: m.damping })),
      massRatio: derived.massRatio,
      inertiaRatio: derived.inertiaRatio,
      frequencyRatio: derived.frequencyRatio!,
      radiusOfGyrationM: derived.radiusOfGyrationM!,
    },
    aerodynamics: aerodynamics(document.aerodynamics, dataset),
    sweep: { fromMps: document.sweep.from, toMps: document.sweep.to, stepMps: document.sweep.step },
  };
}
