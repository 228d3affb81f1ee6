import type { SummaryPayloadV1 } from "@shared/schemas/summary-v1";
import { Card } from "@/components/ui/card";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { formatDateTime } from "@/lib/format";
import { CriteriaList, Facts, Figure, mps, PHENOMENON } from "@/features/summaries/components/summary-parts";

/**
 * A summary signed in format 1 (before summaries carried their inputs and assessment), shown exactly as signed.
 * Its numbers are printed to the 0.1 m/s it used.
 */
export function SummaryBodyV1({ payload: p }: { payload: SummaryPayloadV1 }) {
  const flutterRequired = p.criteria.find((c) => c.phenomenon === "flutter");
  const aero = p.aerodynamicData;
  return (
    <>
      <p role="note" className="rounded-md border border-ink-200 bg-ink-50 px-4 py-2 text-sm text-ink-800">
        Signed in summary format 1 ({p.format}): shown as signed. Later summaries also state every input and the basis of each figure.
      </p>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Figure
          label="Flutter speed"
          value={p.flutter ? mps(p.flutter.speedMps, 1) : `> ${mps(p.sweep.toMps, 1)}`}
          detail={p.flutter ? `${p.flutter.frequencyHz.toFixed(3)} Hz · ${p.flutter.kind}, from ${p.flutter.mode} · U/(fB) ${p.flutter.reducedVelocity.toFixed(2)}` : "no flutter up to the end of the sweep"}
        />
        <Figure label="Torsional divergence" value={p.divergence ? mps(p.divergence.speedMps, 1) : "not possible"} detail="closed form (static)" />
        <Figure label="Required flutter speed" value={mps(flutterRequired?.requiredSpeedMps, 1)} detail={flutterRequired ? `${flutterRequired.totalFactor} × v_m` : undefined} />
        <Figure label="Design mean wind at deck" value={mps(p.designWind.meanSpeedMps, 1)} detail={`v_b ${p.designWind.basicSpeedMps} m/s · deck at ${p.designWind.deckHeightM} m`} />
      </div>
      <Card title="Margins against the required speeds" aria-label="Margins against the required speeds" flush>
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left text-[0.95rem]">
            <thead>
              <tr className="border-b border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
                <th scope="col" className="px-4 py-2 font-semibold">Check</th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">Critical speed</th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">Required speed</th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">Margin</th>
                <th scope="col" className="px-4 py-2 font-semibold">Outcome</th>
              </tr>
            </thead>
            <tbody>
              {p.margins.map((m) => (
                <tr key={m.phenomenon} className="border-b border-ink-100 last:border-b-0">
                  <th scope="row" className="px-4 py-2 align-top font-semibold">
                    {PHENOMENON[m.phenomenon]}
                    <p className="text-sm font-normal text-ink-600">{m.statement}</p>
                  </th>
                  <td className="num px-4 py-2 text-right align-top">{m.criticalSpeedMps !== null ? mps(m.criticalSpeedMps, 1) : m.marginIsLowerBound ? "none found" : "—"}</td>
                  <td className="num px-4 py-2 text-right align-top">{mps(m.requiredSpeedMps, 1)}</td>
                  <td className="num px-4 py-2 text-right align-top">{m.margin === null ? "—" : `${m.marginIsLowerBound ? "≥ " : ""}${m.margin.toFixed(2)}`}</td>
                  <td className="px-4 py-2 align-top"><VerdictBadge status={m.status} /></td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>
      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="Criteria and their basis">
          <CriteriaList required={p.criteria} sources={p.designWind.sources} />
        </Card>
        <Card title="Model and data">
          <Facts
            rows={[
              ["Model", `${p.model.kind === "section-model" ? "Section model" : "Multimode"}, ${p.model.degreesOfFreedom} degrees of freedom, ${p.model.aerodynamics} aerodynamics`],
              ["Aerodynamic data", `${aero.name} (${aero.origin})`],
              ["Data file SHA-256", aero.sha256 ? <span className="num text-sm break-all">{aero.sha256}</span> : "—"],
              ["Delivered convention", aero.deliveredConvention ? `${aero.deliveredConvention.abscissa}; ${aero.deliveredConvention.normalisation}; ${aero.deliveredConvention.signConvention}` : "—"],
              ["Tested U/(fB)", aero.testedReducedVelocity ? `${aero.testedReducedVelocity[0]} – ${aero.testedReducedVelocity[1]}` : "—"],
              ["Facility", aero.facility ?? "—"],
              ["Sweep", `${p.sweep.fromMps} – ${p.sweep.toMps} m/s, air ${p.sweep.airDensityKgM3} kg/m³`],
              ["Engine", p.engineVersion],
              ["Revision", `${p.revision.number}, computed ${formatDateTime(p.revision.createdAt)}`],
            ]}
          />
        </Card>
      </div>
      {p.warnings.length > 0 ? (
        <Card title={`Warnings of the computation (${p.warnings.length})`}>
          <ul className="list-disc space-y-1 pl-5 text-ink-800">
            {p.warnings.map((w) => (
              <li key={w.code + w.message}>{w.message}</li>
            ))}
          </ul>
        </Card>
      ) : null}
    </>
  );
}
