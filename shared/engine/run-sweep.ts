import type { StudyDocument } from "../schemas/study";
import type { FlutterPoint, SweepResult, SweepWarning } from "../schemas/result";
import { createAeroModel } from "./aero/create-aero-model";
import { kineticParticipation } from "./core/participation";
import { locateFlutter, locateStaticCrossings } from "./core/locate-critical";
import { trackPoles, type TrackedStep } from "./core/track-poles";
import { divergenceSpeed } from "./divergence-speed";
import { sectionSystem } from "./section-system";
import { selbergSpeed } from "./selberg-speed";
import { sweepGrid } from "./sweep-grid";
import { collectSweepWarnings } from "./sweep-warnings";
import { ENGINE_VERSION } from "./version";

export interface SweepOptions {
  /** Overrides of `study.sweep` (m/s). */
  readonly from?: number;
  readonly to?: number;
  readonly step?: number;
  /**
   * Most speeds the sweep may solve (grid, hidden lead-in and local refinement together); past it the sweep
   * stops with a `SweepStepLimitError` (core/step-limit-error.ts). Default: no limit.
   */
  readonly maxSolvedSteps?: number;
}

/** Smaller participation at the critical point from which flutter is called coupled. */
const COUPLED_PARTICIPATION = 0.1;

/**
 * Runs the aeroelastic stability sweep of a section-model study: every pole tracked through the wind-speed
 * sweep by the p-k method, with the flutter speed, the divergence speed and Selberg's estimate.
 *
 * Method: the study is mapped onto the n-mode core (`sectionSystem`, docs/conventions.md §Equations of motion) with the
 * aerodynamic model of `createAeroModel`; `trackPoles` solves and tracks every branch over the grid (with local
 * refinement), `locateFlutter` finds the lowest zero-damping crossing over all oscillatory branches to 1e-4 m/s
 * (Brent), `locateStaticCrossings` the real roots crossing zero (static instability, one warning, lowest first); divergence from its closed
 * form (`divergenceSpeed`: in `divergence` inside [from, to], in `divergenceOutsideSweep` outside it) and Selberg's
 * estimate (`selbergSpeed`) complete the result. The flutter point says whether its own reduced frequency lies
 * inside the table's tested range (`insideTestedRange`; null without a table).
 * Notes: deterministic (no randomness, no clocks); results are indicative — critical cases need wind-tunnel
 * verification and review by a licensed engineer under local codes and standards.
 * @param study a study document that passed `studyDocumentSchema`
 * @param options optional overrides of the sweep range and step
 * @returns the result in the `stillspan.study/1` result format (shared/schemas/result.ts)
 */
export function runSweep(study: StudyDocument, options: SweepOptions = {}): SweepResult {
  const from = options.from ?? study.sweep.from;
  const to = options.to ?? study.sweep.to;
  const step = options.step ?? study.sweep.step;
  const speeds = sweepGrid(from, to, step);
  const aero = createAeroModel(study.aerodynamics);
  const system = sectionSystem(study, aero);
  const track = trackPoles(system, speeds, { stepLimit: options.maxSolvedSteps });
  const modes = study.structure.modes;
  const ids = modes.map((m) => m.id);
  const share = new Float64Array(2);
  const participationOf = (s: TrackedStep): Record<string, number> => {
    kineticParticipation(2, system.mass, s.vecRe, s.vecIm, share);
    return { [ids[0]]: share[0], [ids[1]]: share[1] };
  };

  const critical = locateFlutter(system, track);
  let flutter: FlutterPoint | null = null;
  if (critical) {
    const s = critical.step;
    const frequency = s.im / (2 * Math.PI);
    kineticParticipation(2, system.mass, s.vecRe, s.vecIm, share);
    const dominant = share[0] >= share[1] ? 0 : 1;
    flutter = {
      speed: critical.speedMps,
      frequency,
      mode: ids[critical.branch],
      reducedVelocity: critical.speedMps > 0 && frequency > 0 ? critical.speedMps / (frequency * study.deck.width) : 0,
      kind:
        Math.min(share[0], share[1]) >= COUPLED_PARTICIPATION
          ? "coupled"
          : modes[dominant].dof === "torsion"
            ? "torsional"
            : "heave",
      // The critical pole's own K against the table's tested range (the same test that marks extrapolated steps).
      insideTestedRange: aero.reducedVelocityRange === null ? null : !aero.isExtrapolated(s.reducedFrequency),
    };
  }
  const heave = modes.find((m) => m.dof === "heave")!;
  const torsion = modes.find((m) => m.dof === "torsion")!;
  const rho = study.air.density;
  const uDiv = divergenceSpeed(study.structure.inertia, torsion.frequency, rho, study.deck.width, aero.staticMomentSlope);
  const selberg = selbergSpeed(
    study.structure.mass,
    study.structure.inertia,
    heave.frequency,
    torsion.frequency,
    rho,
    study.deck.width,
  );
  const warnings: SweepWarning[] = collectSweepWarnings({
    track,
    ids,
    flutter: critical,
    staticCrossings: locateStaticCrossings(system, track),
    quasiSteady: aero.kind === "quasi-steady",
    testedRange: aero.reducedVelocityRange,
  });
  const divergenceInside = uDiv !== null && uDiv >= from && uDiv <= to;
  return {
    flutter,
    divergence: uDiv !== null && divergenceInside ? { speed: uDiv } : null,
    divergenceOutsideSweep: uDiv !== null && !divergenceInside ? { speed: uDiv } : null,
    selberg,
    modes: modes.map((mode, j) => ({
      id: mode.id,
      steps: track.branches[j].map((s) => {
        const modulus = Math.hypot(s.re, s.im);
        return {
          speed: s.speedMps,
          frequency: s.im / (2 * Math.PI),
          damping: modulus > 0 ? -s.re / modulus : 0,
          re: s.re,
          im: s.im,
          participation: participationOf(s),
          mac: s.mac,
          confidence: s.confidence,
        };
      }),
    })),
    warnings,
    engine: ENGINE_VERSION,
  };
}
