import type { StabilityCheck } from "@shared/schemas/assessment";
import { STABILITY_CHECKS } from "@shared/schemas/assessment";
import type { ReactNode } from "react";
import type { Phenomenon } from "@shared/schemas/criteria";
import type { SummaryPayload } from "@shared/schemas/summary";
import { Card } from "@/components/ui/card";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { cn } from "@/lib/cn";
import { formatDateTime } from "@/lib/format";
import { flutterTone, warningCountText } from "@/lib/verdict";
import { CriteriaList, Facts, Figure, mps, PHENOMENON } from "@/features/summaries/components/summary-parts";

const VERDICT_LINE: Record<SummaryPayload["assessment"]["verdict"], { text: string; tone: string }> = {
  pass: { text: "Every stability margin passes.", tone: "border-steady-600 bg-steady-100 text-steady-700" },
  fail: { text: "A stability margin fails.", tone: "border-signal-600 bg-signal-50 text-signal-700" },
  undetermined: { text: "A stability check is undetermined: the sweep ends below its required speed.", tone: "border-caution-400 bg-caution-100 text-caution-700" },
  "no-criteria": { text: "No criteria: no margins were evaluated.", tone: "border-ink-200 bg-ink-50 text-ink-700" },
};

const value = (v: unknown) => (v === undefined ? "—" : typeof v === "number" ? String(Number(v.toPrecision(8))) : JSON.stringify(v));

/**
 * The body of a signed summary (format 2), read from the signed payload only: its assessment — the same figures,
 * bases, margins and warnings the workspace, the comparison and the review queue show — its inputs, what changed
 * since the previously signed revision, and who prepared, checked and approved it.
 */
export function SummaryBody({ payload: p, criterionNote }: { payload: SummaryPayload; criterionNote?: (phenomenon: Phenomenon) => ReactNode }) {
  const a = p.assessment;
  const f = a.flutter;
  const d = a.divergence;
  const verdict = VERDICT_LINE[a.verdict];
  const label = (check: StabilityCheck) =>
    check === "divergence" ? `${PHENOMENON.divergence} (${d.governing === "static-instability" ? "static instability" : "closed form"})` : PHENOMENON[check];
  return (
    <>
      <p className={cn("rounded-lg border px-4 py-2 font-semibold", verdict.tone)} data-testid="summary-verdict">
        {verdict.text} <span className="font-normal">{warningCountText(a)} of the computation.</span>
      </p>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Figure
          label="Flutter speed"
          testId="summary-flutter"
          tone={flutterTone(a)}
          value={f.found ? mps(f.speedMps) : `none up to ${mps(f.upToMps)}`}
          detail={f.found ? <>{f.frequencyHz.toFixed(4)} Hz · {f.kind}, branch {f.branch} · Ur {f.reducedVelocity.toFixed(2)}<br /><span data-testid="summary-tested-range">{f.testedRange.statement}</span></> : "every branch stays damped"}
        />
        <Figure
          label="Divergence — closed form"
          testId="summary-divergence-closed-form"
          value={d.closedForm.speedMps !== null ? mps(d.closedForm.speedMps) : "none"}
          detail={`EN 1991-1-4 E.4.3, Expr. (E.24)${d.closedForm.speedMps !== null && !d.closedForm.withinSweep ? "; beyond the sweep" : ""}`}
        />
        <Figure
          label="Divergence — static instability"
          testId="summary-divergence-static"
          value={d.staticInstability.speedMps !== null ? mps(d.staticInstability.speedMps) : "none"}
          detail={d.staticInstability.speedMps !== null ? `sweep: real pole crossing zero, branch ${d.staticInstability.branch ?? "?"}` : `no real pole crosses zero up to ${mps(d.staticInstability.upToMps)}`}
        />
        <Figure
          label="Design mean wind at deck"
          value={a.designWind ? mps(a.designWind.meanSpeedMps) : "—"}
          detail={a.designWind ? `v_b ${a.designWind.basicSpeedMps} m/s · deck at ${a.designWind.deckHeightM} m` : a.criteriaNote ?? undefined}
        />
      </div>
      <p className="text-sm text-ink-800" data-testid="summary-divergence-basis">{d.marginBasis}</p>

      <Card title="Margins against the required speeds" subtitle="Critical ÷ required speed: stability limits pass at 1.00 or more" aria-label="Margins against the required speeds" flush>
        {a.margins ? (
          <div className="overflow-x-auto">
            <table className="w-full border-collapse text-left text-[0.95rem]">
              <thead>
                <tr className="border-b border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
                  <th scope="col" className="px-4 py-2 font-semibold">Stability check</th>
                  <th scope="col" className="px-4 py-2 text-right font-semibold">Critical speed</th>
                  <th scope="col" className="px-4 py-2 text-right font-semibold">Required speed</th>
                  <th scope="col" className="px-4 py-2 text-right font-semibold">Margin</th>
                  <th scope="col" className="px-4 py-2 font-semibold">Verdict</th>
                </tr>
              </thead>
              <tbody>
                {STABILITY_CHECKS.map((check) => {
                  const m = a.margins![check];
                  return (
                    <tr key={check} className="border-b border-ink-100 last:border-b-0" data-phenomenon={check}>
                      <th scope="row" className="px-4 py-2 align-top font-semibold">
                        {label(check)}
                        <p className="text-sm font-normal text-ink-600">{m.statement}</p>
                      </th>
                      <td className="num px-4 py-2 text-right align-top">{m.criticalSpeedMps !== null ? mps(m.criticalSpeedMps) : m.marginIsLowerBound ? "none found" : "—"}</td>
                      <td className="num px-4 py-2 text-right align-top">{mps(m.requiredSpeedMps)}</td>
                      <td className="num px-4 py-2 text-right align-top" data-testid={`summary-margin-${check}`}>
                        {m.margin === null ? "—" : `${m.marginIsLowerBound ? "≥ " : ""}${m.margin.toFixed(2)}`}
                      </td>
                      <td className="px-4 py-2 align-top"><VerdictBadge status={m.status} /></td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        ) : (
          <p className="px-4 py-3 text-ink-700">{a.criteriaNote}</p>
        )}
        <p className="flex items-start gap-2 border-t border-ink-100 px-4 py-2 text-sm" data-testid="summary-vortex">
          <VerdictBadge status={a.vortexShedding.status} className="mt-0.5" />
          <span><span className="font-semibold">Vortex shedding (screening, not a stability margin):</span> {a.vortexShedding.statement}</span>
        </p>
      </Card>

      <Card title={`Warnings of the computation (${a.warningCount})`} aria-label="Warnings of the computation">
        {a.warnings.length === 0 ? (
          <p className="text-ink-700">The computation raised no warning.</p>
        ) : (
          <ul className="list-disc space-y-1 pl-5 text-ink-800">
            {a.warnings.map((w, i) => (
              <li key={i}>
                <span className="font-semibold">{w.title}</span>
                {w.speeds ? ` (${w.speeds})` : ""}: {w.message}
              </li>
            ))}
          </ul>
        )}
      </Card>

      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="Inputs of the computation" aria-label="Inputs of the computation">
          <Facts rows={inputRows(p)} />
        </Card>
        <div className="space-y-4">
          <Card title="Changes since the previously signed revision">
            <p className="text-ink-800">{p.changes.statement}</p>
            {p.revision.changeNote ? <p className="mt-1 text-sm text-ink-600">Change note: {p.revision.changeNote}</p> : null}
            {p.changes.items.length > 0 ? (
              <ul className="mt-2 space-y-0.5 text-sm">
                {p.changes.items.map((c) => (
                  <li key={c.path} className="num">
                    <span className="text-ink-900">{c.label}</span>: <span className="text-ink-600">{value(c.old)}</span> → <span className="font-semibold">{value(c.new)}</span>
                  </li>
                ))}
              </ul>
            ) : null}
          </Card>
          <Card title="Prepared, checked, approved">
            <Facts
              rows={[
                ["Prepared", `${p.signoff.prepared.name} (analyst), ${formatDateTime(p.signoff.prepared.at)}`],
                ["Checked", `${p.signoff.checked.name} (reviewer), submitted ${formatDateTime(p.signoff.checked.submittedAt)}, checked ${formatDateTime(p.signoff.checked.at)}`],
                ["Approved", `${p.signoff.approved.name}, ${formatDateTime(p.signoff.approved.at)}, by ${p.signoff.approved.by}`],
              ]}
            />
          </Card>
          {a.required && a.designWind ? (
            <Card title="Criteria and their basis">
              <CriteriaList required={a.required} sources={a.designWind.sources} note={criterionNote} />
            </Card>
          ) : null}
        </div>
      </div>
    </>
  );
}

function inputRows(p: SummaryPayload): [string, React.ReactNode][] {
  const i = p.inputs;
  const st = i.structure;
  const ae = i.aerodynamics;
  const d = ae.dataset;
  return [
    ["Air density ρ", `${i.airDensityKgM3} kg/m³`],
    ["Deck width B, depth D", `${i.deck.widthM} m, ${i.deck.depthM} m`],
    ["Mass m", `${st.massKgPerM} kg/m`],
    ["Inertia I", `${st.inertiaKgM2PerM} kg·m²/m (r = √(I/m) = ${st.radiusOfGyrationM.toFixed(3)} m)`],
    ...st.modes.map((m): [string, string] => [`Mode ${m.id} (${m.dof})`, `f = ${m.frequencyHz} Hz, ζ = ${m.dampingRatio}`]),
    ["Mass ratio m/(ρB²)", st.massRatio !== null ? st.massRatio.toFixed(2) : "—"],
    ["Inertia ratio I/(ρB⁴)", st.inertiaRatio !== null ? st.inertiaRatio.toFixed(3) : "—"],
    ["Frequency ratio f_α/f_h", st.frequencyRatio.toFixed(3)],
    ["Aerodynamic model", ae.description],
    ...(ae.testedReducedVelocity ? [["Derivative table", `${ae.tableRows} rows, tested Ur ${ae.testedReducedVelocity[0]}–${ae.testedReducedVelocity[1]}, ${ae.interpolation}`] as [string, string]] : []),
    ...(ae.quasiSteady ? [["Static slopes", `dC_L/dα ${ae.quasiSteady.liftSlopePerRad}, C_D ${ae.quasiSteady.dragCoefficient}, dC_M/dα ${ae.quasiSteady.momentSlopePerRad} per rad`] as [string, string]] : []),
    ...(d
      ? ([
          ["Facility", d.facility ?? "—"],
          ["Model scale, flow", `${d.modelScale !== null ? `1:${d.modelScale}` : "—"}, ${d.flow}${d.turbulenceIntensityPct !== null ? ` (I_u ${d.turbulenceIntensityPct} %)` : ""}`],
          ["Mean angle of attack", `${d.meanAngleDeg}°`],
          ["Reynolds number (on B)", d.reynoldsNumber !== null ? d.reynoldsNumber.toExponential(2) : "—"],
          ["Test date", d.testDate ?? "—"],
          ["Delivered as", `${d.deliveredConvention.abscissa}; ${d.deliveredConvention.normalisation}; ${d.deliveredConvention.signConvention}`],
          ["Data file SHA-256", <span className="num text-sm break-all">{d.fileSha256}</span>],
        ] as [string, React.ReactNode][])
      : []),
    ["Conventions", ae.conventions],
    ["Sweep", `${i.sweep.fromMps} – ${i.sweep.toMps} m/s, step ${i.sweep.stepMps} m/s`],
    ["Engine, revision", `${p.engineVersion}, revision ${p.revision.number} computed ${formatDateTime(p.revision.createdAt)}`],
    ["Content hash", <span className="num text-sm break-all">{p.revision.contentHash}</span>],
  ];
}
