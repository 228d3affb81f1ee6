import type { ScreeningResult } from "@shared/criteria/screen-study";
import { LockInBadge } from "@/features/criteria/components/status-badge";
import { SourceBadge } from "@/features/criteria/components/source-badge";
import { fixed, sig } from "@/features/criteria/utils/format";

const CLAUSE = {
  onset: "EN 1991-1-4 E.1.3.1, Expr. (E.2)",
  translational: "EN 1991-1-4 E.1.3.3, Expr. (E.4)",
  torsional: "inertia form, common practice",
  lockIn: "EN 1991-1-4 E.1.2(2), Expr. (E.1)",
} as const;

/** Vortex shedding per mode: onset speed v = D n / St, Scruton number, lock-in statement with its clause. */
export function VortexSheddingTable({ vortex }: { vortex: ScreeningResult["vortexShedding"] }) {
  const { strouhal } = vortex;
  return (
    <div className="space-y-2">
      <p className="text-sm text-ink-800">
        Strouhal number St ={" "}
        <span className="num font-semibold" data-testid="strouhal">
          {strouhal.value === null ? "none" : sig(strouhal.value, 3)}
        </span>{" "}
        ({strouhal.origin === "input" ? "measured / given" : "rectangle table"}): {strouhal.source}{" "}
        <SourceBadge text={strouhal.source} />
        {strouhal.note ? <span className="block text-caution-700">{strouhal.note}</span> : null}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full text-sm" data-testid="vortex-table">
          <caption className="sr-only">Vortex-shedding screening per mode</caption>
          <thead>
            <tr className="border-b border-ink-200 text-left text-xs tracking-wide text-ink-600 uppercase">
              <th scope="col" className="py-1 pr-3 font-semibold">Mode</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">n</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">ζ / δ_s</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Onset v_crit</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Scruton Sc</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Required</th>
              <th scope="col" className="py-1 font-semibold">Lock-in</th>
            </tr>
          </thead>
          <tbody>
            {vortex.modes.map((mode) => (
              <tr key={mode.modeId} data-mode={mode.modeId} className="border-b border-ink-100 align-top last:border-b-0">
                <th scope="row" className="py-1.5 pr-3 text-left font-semibold whitespace-nowrap text-ink-900">
                  {mode.modeId} <span className="font-normal text-ink-600">{mode.dof}</span>
                </th>
                <td className="num py-1.5 pr-3 text-right whitespace-nowrap">{fixed(mode.frequencyHz, 3)} Hz</td>
                <td className="num py-1.5 pr-3 text-right whitespace-nowrap">
                  {fixed(mode.dampingRatio * 100, 2)} % / {fixed(mode.logDecrement, 4)}
                </td>
                <td className="py-1.5 pr-3 text-right whitespace-nowrap">
                  <span className="num font-semibold" data-testid={`onset-${mode.modeId}`}>
                    {mode.onsetSpeedMps === null ? "—" : `${fixed(mode.onsetSpeedMps, 2)} m/s`}
                  </span>
                  <span className="block text-xs text-ink-600">
                    D n / St, D = {sig(mode.referenceLengthM)} m · {CLAUSE.onset}
                  </span>
                </td>
                <td className="py-1.5 pr-3 text-right whitespace-nowrap">
                  <span className="num font-semibold" data-testid={`scruton-${mode.modeId}`}>
                    {fixed(mode.scruton.value, 2)}
                  </span>
                  <span className="block text-xs text-ink-600">
                    {mode.scruton.form === "translational" ? "2δm/(ρD²)" : "2δI/(ρB⁴)"} · {CLAUSE[mode.scruton.form]}{" "}
                    <SourceBadge text={mode.scruton.source} />
                  </span>
                </td>
                <td className="num py-1.5 pr-3 text-right whitespace-nowrap">
                  {mode.requiredSpeedMps === null ? "—" : `${fixed(mode.requiredSpeedMps, 2)} m/s`}
                </td>
                <td className="min-w-[18rem] py-1.5 text-ink-700">
                  <LockInBadge lockIn={mode.lockIn} /> <span className="text-xs text-ink-600">{CLAUSE.lockIn}</span>
                  <p className="mt-0.5">{mode.statement}</p>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
