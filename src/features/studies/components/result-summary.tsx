import type { Assessment, StabilityMargin } from "@shared/schemas/assessment";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { cn } from "@/lib/cn";
import { flutterTone, warningCountText } from "@/lib/verdict";

interface ResultSummaryProps {
  /** The result's assessment: stored with the revision, or computed for an unsaved run by the same function. */
  assessment: Assessment;
  showKmh: boolean;
}

const KIND_LABEL = { coupled: "coupled (heave and torsion)", torsional: "torsional", heave: "heave" } as const;

function Speed({ mps, showKmh }: { mps: number; showKmh: boolean }) {
  return (
    <span className="num">
      {mps.toFixed(2)} m/s
      {showKmh ? <span className="ml-1 text-ink-600">({(mps * 3.6).toFixed(0)} km/h)</span> : null}
    </span>
  );
}

function Label({ children }: { children: string }) {
  return <dt className="text-xs font-semibold tracking-wide text-ink-600 uppercase">{children}</dt>;
}

/**
 * The result in words and numbers, all read from its assessment: flutter with the data behind it (inside or beyond
 * the tested range), both divergence figures named by their basis and which one the margin uses, Selberg's estimate,
 * the margins, the vortex-shedding screening in its own words, and every warning.
 */
export function ResultSummary({ assessment: a, showKmh }: ResultSummaryProps) {
  const f = a.flutter;
  const d = a.divergence;
  return (
    <div className="space-y-3" data-testid="result-summary">
      <p role="status" className="sr-only">
        {f.found ? `Flutter at ${f.speedMps.toFixed(2)} metres per second.` : `No flutter up to ${f.upToMps.toFixed(2)} metres per second.`}{" "}
        {warningCountText(a)}.
      </p>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-3 sm:grid-cols-4">
        <div className="col-span-2 rounded-md border border-ink-200 bg-white px-3 py-2">
          <Label>Flutter</Label>
          <dd data-testid="flutter-speed" className={cn("text-2xl font-semibold", flutterTone(a))}>
            {f.found ? <Speed mps={f.speedMps} showKmh={showKmh} /> : <>None up to <Speed mps={f.upToMps} showKmh={showKmh} /></>}
          </dd>
          {f.found ? (
            <>
              <dd className="num text-sm text-ink-700">
                {f.frequencyHz.toFixed(4)} Hz · Ur {f.reducedVelocity.toFixed(2)} · {KIND_LABEL[f.kind]} · branch {f.branch}
              </dd>
              <dd data-testid="flutter-tested-range" className={cn("text-sm", f.testedRange.status === "beyond" ? "font-semibold text-caution-700" : "text-ink-700")}>
                {f.testedRange.statement.charAt(0).toUpperCase() + f.testedRange.statement.slice(1)}.
              </dd>
            </>
          ) : (
            <dd className="text-sm text-ink-700">Every branch stays damped over the sweep.</dd>
          )}
        </div>
        <div className="col-span-2 sm:col-span-1">
          <Label>Divergence</Label>
          <dd className="text-sm" data-testid="divergence-closed-form">
            <span className="text-ink-600">Closed form (E.24): </span>
            <span className="font-semibold">{d.closedForm.speedMps !== null ? <Speed mps={d.closedForm.speedMps} showKmh={showKmh} /> : "none"}</span>
            {d.closedForm.speedMps !== null && !d.closedForm.withinSweep ? <span className="text-ink-600"> (beyond the sweep)</span> : null}
          </dd>
          <dd className="text-sm" data-testid="divergence-static">
            <span className="text-ink-600">Static instability (sweep{d.staticInstability.branch ? `, ${d.staticInstability.branch}` : ""}): </span>
            <span className="font-semibold">{d.staticInstability.speedMps !== null ? <Speed mps={d.staticInstability.speedMps} showKmh={showKmh} /> : "none"}</span>
          </dd>
        </div>
        <div className="col-span-2 sm:col-span-1">
          <Label>Selberg estimate</Label>
          <dd className="text-lg font-semibold">
            {a.selberg.speedMps !== null ? <Speed mps={a.selberg.speedMps} showKmh={showKmh} /> : <span className="text-base text-ink-700">n/a (f<sub>α</sub> ≤ f<sub>h</sub>)</span>}
          </dd>
          <dd className="text-xs text-ink-600">thin plate, no damping; no margin uses it</dd>
        </div>
      </dl>
      <p className="text-sm text-ink-700" data-testid="divergence-basis">{d.marginBasis}</p>

      {a.margins ? (
        <div className="grid gap-2 sm:grid-cols-2" aria-label="Margins against the required speeds">
          <MarginLine label="Flutter" margin={a.margins.flutter} />
          <MarginLine label={`Divergence (${d.governing === "static-instability" ? "static instability" : "closed form"})`} margin={a.margins.divergence} />
        </div>
      ) : (
        <p className="text-sm text-ink-600">{a.criteriaNote ?? "No criteria: no margins."}</p>
      )}
      <p className="flex items-start gap-2 text-sm" data-testid="vortex-screening">
        <VerdictBadge status={a.vortexShedding.status} className="mt-0.5" />
        <span>
          <span className="font-semibold">Vortex shedding (screening):</span> {a.vortexShedding.statement}
        </span>
      </p>

      {a.warnings.length > 0 ? (
        <div>
          <p className="text-sm font-semibold text-caution-700" data-testid="warning-count">{warningCountText(a)}</p>
          <ul className="mt-1 space-y-1.5" aria-label="Warnings">
            {a.warnings.map((warning, i) => (
              <li key={i} className="rounded-md border-l-4 border-l-caution-400 bg-caution-100 px-3 py-1.5 text-sm text-ink-900">
                <span className="font-semibold text-caution-700">{warning.title}</span>
                {warning.speeds ? <span className="num ml-1 text-caution-700">({warning.speeds})</span> : null}
                {": "}
                {warning.message}
                {warning.explanation ? <span className="block text-xs text-ink-700">{warning.explanation}</span> : null}
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <p className="text-sm text-ink-600" data-testid="warning-count">No warnings from the engine.</p>
      )}
    </div>
  );
}

function MarginLine({ label, margin }: { label: string; margin: StabilityMargin }) {
  return (
    <div className="flex items-start gap-2 rounded-md border border-ink-200 bg-white px-3 py-1.5 text-sm">
      <VerdictBadge status={margin.status} className="mt-0.5" />
      <span>
        <span className="font-semibold">{label}</span>{" "}
        <span className="num text-ink-700">
          required {margin.requiredSpeedMps.toFixed(2)} m/s
          {margin.margin !== null ? ` · margin ${margin.marginIsLowerBound ? "≥ " : ""}${margin.margin.toFixed(2)}` : ""}
        </span>
      </span>
    </div>
  );
}
