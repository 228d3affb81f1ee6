import type { ScreeningResult } from "@shared/criteria/screen-study";
import { LockInBadge } from "@/features/criteria/components/status-badge";
import { SourceBadge } from "@/features/criteria/components/source-badge";
import { fixed, sig } from "@/features/criteria/utils/format";

/**
 * Vortex shedding per mode: onset speed v_crit = D n / St, Scruton number, lock-in statement with its clause.
 * Compact enough for the workspace's result column: the statement runs under each mode's row.
 */
export function VortexSheddingTable({ vortex }: { vortex: ScreeningResult["vortexShedding"] }) {
  const { strouhal, modes } = vortex;
  const required = modes.find((mode) => mode.requiredSpeedMps !== null)?.requiredSpeedMps ?? null;
  const depth = modes[0]?.referenceLengthM;
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
      <p className="text-sm text-ink-700">
        v_crit = D n / St with D = {sig(depth)} m (EN 1991-1-4 E.1.3.1, Expr. (E.2)); Sc = 2δ_s m/(ρD²) for heave (E.1.3.3,
        Expr. (E.4)), 2δ_s I/(ρB⁴) for torsion (common practice); lock-in by E.1.2(2), Expr. (E.1)
        {required !== null ? (
          <>
            {" "}
            against the required <span className="num font-semibold">{fixed(required, 2)} m/s</span>
          </>
        ) : null}
        .
      </p>
      {/* relative: the caption's sr-only (absolute) text stays inside the scroller instead of widening the page */}
      <div className="relative overflow-x-auto">
        <table className="w-full text-sm" data-testid="vortex-table">
          <caption className="sr-only">Vortex-shedding screening per mode</caption>
          <thead>
            <tr className="border-b border-ink-200 text-left text-xs tracking-wide text-ink-600 uppercase">
              <th scope="col" className="py-1 pr-3 font-semibold">Mode</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold normal-case">n</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold normal-case">ζ · δ_s</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Onset</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold normal-case">Sc</th>
              <th scope="col" className="py-1 font-semibold">Lock-in</th>
            </tr>
          </thead>
          {modes.map((mode) => (
            <tbody key={mode.modeId} data-mode={mode.modeId} className="border-b border-ink-100 last:border-b-0">
              <tr className="align-top">
                <th scope="row" className="pt-1.5 pr-3 text-left font-semibold whitespace-nowrap text-ink-900">
                  {mode.modeId} <span className="font-normal text-ink-600">{mode.dof}</span>
                </th>
                <td className="num pt-1.5 pr-3 text-right whitespace-nowrap">{fixed(mode.frequencyHz, 3)} Hz</td>
                <td className="num pt-1.5 pr-3 text-right whitespace-nowrap">
                  {fixed(mode.dampingRatio * 100, 2)} % · {fixed(mode.logDecrement, 4)}
                </td>
                <td className="num pt-1.5 pr-3 text-right font-semibold whitespace-nowrap" data-testid={`onset-${mode.modeId}`}>
                  {mode.onsetSpeedMps === null ? "—" : `${fixed(mode.onsetSpeedMps, 2)} m/s`}
                </td>
                <td className="pt-1.5 pr-3 text-right whitespace-nowrap">
                  <span className="num font-semibold" data-testid={`scruton-${mode.modeId}`}>
                    {fixed(mode.scruton.value, 2)}
                  </span>{" "}
                  <span className="text-xs text-ink-600">{mode.scruton.form === "translational" ? "(E.4)" : "inertia form"}</span>
                </td>
                <td className="pt-1.5">
                  <LockInBadge lockIn={mode.lockIn} />
                </td>
              </tr>
              <tr>
                <td colSpan={6} className="pt-0.5 pb-1.5 text-ink-700">
                  {mode.statement}
                </td>
              </tr>
            </tbody>
          ))}
        </table>
      </div>
    </div>
  );
}
