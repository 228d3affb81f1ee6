import type { ProjectCriteriaDto } from "@shared/schemas/criteria";
import type { SweepResult } from "@shared/schemas/result";
import type { StudyDocument } from "@shared/schemas/study";
import { createAeroModel } from "@shared/engine/aero/create-aero-model";
import { divergenceSpeed } from "@shared/engine/divergence-speed";
import { computeMargins, type CriticalSpeed, type Margin } from "@shared/criteria/margins";
import { cn } from "@/lib/cn";
import { explainWarning, WARNING_TITLES, warningSpeeds } from "@/features/studies/utils/warning-text";

interface ResultSummaryProps {
  result: SweepResult;
  /** The document the result was computed from. */
  document: StudyDocument;
  criteria: ProjectCriteriaDto | null;
  showKmh: boolean;
}

const KIND_LABEL = { coupled: "coupled (heave and torsion)", torsional: "torsional", heave: "heave" } as const;

export function Speed({ mps, showKmh, digits = 1 }: { mps: number; showKmh: boolean; digits?: number }) {
  return (
    <span className="num">
      {mps.toFixed(digits)} m/s
      {showKmh ? <span className="ml-1 text-ink-600">({(mps * 3.6).toFixed(0)} km/h)</span> : null}
    </span>
  );
}

/**
 * Torsional divergence from its closed form for the document (also beyond the sweep, which the result leaves
 * out), or null when the static moment slope gives none.
 */
export function closedFormDivergence(document: StudyDocument): number | null {
  try {
    const torsion = document.structure.modes.find((m) => m.dof === "torsion");
    const slope = createAeroModel(document.aerodynamics).staticMomentSlope;
    if (!torsion || slope === null) return null;
    return divergenceSpeed(document.structure.inertia, torsion.frequency, document.air.density, document.deck.width, slope);
  } catch {
    return null;
  }
}

/**
 * Critical speeds as the margin bookkeeping reads them: flutter found, or none up to the sweep's end;
 * divergence from its closed form (or impossible).
 */
export function criticalSpeedsOf(result: SweepResult, document: StudyDocument): { flutter: CriticalSpeed; divergence: CriticalSpeed } {
  const divergence = result.divergence?.speed ?? closedFormDivergence(document);
  return {
    flutter: result.flutter ? { kind: "speed", speedMps: result.flutter.speed } : { kind: "above", speedMps: document.sweep.to },
    divergence:
      divergence !== null
        ? { kind: "speed", speedMps: divergence }
        : { kind: "none", reason: "the static moment slope dC_M/dα is not positive." },
  };
}

/**
 * The result in words and numbers: flutter (speed, frequency, reduced velocity, kind), divergence, Selberg's
 * estimate, margins against the project's required speeds, and every warning explained with its speeds.
 */
export function ResultSummary({ result, document, criteria, showKmh }: ResultSummaryProps) {
  const { flutter, divergence, selberg, warnings } = result;
  const sweepToMps = document.sweep.to;
  const required = criteria?.evaluated?.required ?? null;
  const margins = required ? computeMargins(criticalSpeedsOf(result, document), required) : null;
  const closedForm = divergence ? null : closedFormDivergence(document);
  return (
    <div className="space-y-3">
      <p role="status" className="sr-only">
        {flutter ? `Flutter at ${flutter.speed.toFixed(2)} metres per second.` : `No flutter up to ${sweepToMps} metres per second.`}
        {warnings.length > 0 ? ` ${warnings.length} warning${warnings.length > 1 ? "s" : ""}.` : ""}
      </p>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-3 sm:grid-cols-4">
        <div className="col-span-2 rounded-md border border-ink-200 bg-white px-3 py-2">
          <dt className="text-xs font-semibold tracking-wide text-ink-600 uppercase">Flutter</dt>
          <dd data-testid="flutter-speed" className={cn("text-2xl font-semibold", flutter ? "text-signal-700" : "text-steady-700")}>
            {flutter ? <Speed mps={flutter.speed} showKmh={showKmh} digits={2} /> : <>None up to <Speed mps={sweepToMps} showKmh={showKmh} /></>}
          </dd>
          {flutter ? (
            <dd className="num text-sm text-ink-700">
              {flutter.frequency.toFixed(4)} Hz · Ur {flutter.reducedVelocity.toFixed(2)} · {KIND_LABEL[flutter.kind]} · branch {flutter.mode}
            </dd>
          ) : (
            <dd className="text-sm text-ink-700">Every branch stays damped over the sweep.</dd>
          )}
        </div>
        <div>
          <dt className="text-xs font-semibold tracking-wide text-ink-600 uppercase">Divergence</dt>
          <dd className="text-lg font-semibold">
            {divergence ? <Speed mps={divergence.speed} showKmh={showKmh} /> : <span className="text-base text-ink-700">none in the sweep</span>}
          </dd>
          {!divergence ? (
            <dd className="text-xs text-ink-600">
              {closedForm !== null ? <>closed form <Speed mps={closedForm} showKmh={showKmh} /></> : "not possible (dC_M/dα ≤ 0)"}
            </dd>
          ) : null}
        </div>
        <div>
          <dt className="text-xs font-semibold tracking-wide text-ink-600 uppercase">Selberg estimate</dt>
          <dd className="text-lg font-semibold">
            {selberg !== null ? <Speed mps={selberg} showKmh={showKmh} /> : <span className="text-base text-ink-700">n/a (f<sub>α</sub> ≤ f<sub>h</sub>)</span>}
          </dd>
          <dd className="text-xs text-ink-600">thin plate, no damping</dd>
        </div>
      </dl>

      {margins ? (
        <div className="grid gap-2 sm:grid-cols-2" aria-label="Margins against the required speeds">
          <MarginLine label="Flutter" margin={margins.flutter} />
          <MarginLine label="Divergence" margin={margins.divergence} />
        </div>
      ) : (
        <p className="text-sm text-ink-600">No design wind saved for this project yet: margins appear once its criteria are set.</p>
      )}

      {warnings.length > 0 ? (
        <ul className="space-y-1.5" aria-label="Warnings">
          {warnings.map((warning, i) => (
            <li key={i} className="rounded-md border-l-4 border-l-caution-400 bg-caution-100 px-3 py-1.5 text-sm text-ink-900">
              <span className="font-semibold text-caution-700">{WARNING_TITLES[warning.code]}</span>
              {warningSpeeds(warning) ? <span className="num ml-1 text-caution-700">({warningSpeeds(warning)})</span> : null}
              {": "}
              {explainWarning(warning.code)}
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-600">No warnings from the engine.</p>
      )}
    </div>
  );
}

const STATUS = {
  pass: { text: "Pass", tone: "bg-steady-100 text-steady-700" },
  fail: { text: "Fail", tone: "bg-signal-600 text-white" },
  undetermined: { text: "Extend sweep", tone: "bg-caution-100 text-caution-700" },
  investigate: { text: "Investigate", tone: "bg-caution-100 text-caution-700" },
  clear: { text: "Clear", tone: "bg-steady-100 text-steady-700" },
  "not-evaluated": { text: "Not evaluated", tone: "bg-ink-100 text-ink-700" },
} as const;

function MarginLine({ label, margin }: { label: string; margin: Margin }) {
  const status = STATUS[margin.status];
  return (
    <div className="flex items-start gap-2 rounded-md border border-ink-200 bg-white px-3 py-1.5 text-sm">
      <span className={cn("mt-0.5 shrink-0 rounded-sm px-1.5 text-xs leading-5 font-semibold", status.tone)}>{status.text}</span>
      <span>
        <span className="font-semibold">{label}</span>{" "}
        <span className="num text-ink-700">
          required {margin.requiredSpeedMps.toFixed(1)} m/s
          {margin.margin !== null ? ` · margin ${margin.marginIsLowerBound ? "≥ " : ""}${margin.margin.toFixed(2)}` : ""}
        </span>
      </span>
    </div>
  );
}
