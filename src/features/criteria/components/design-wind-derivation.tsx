import type { MeanWindAtDeck } from "@shared/criteria/mean-wind-at-deck";
import { cn } from "@/lib/cn";
import { fixed, sig } from "@/features/criteria/utils/format";

interface Row {
  symbol: string;
  name: string;
  value: string;
  /** The expression with this project's numbers substituted. */
  working: string;
  clause: string;
}

const EN = "EN 1991-1-4";

function rowsOf(wind: MeanWindAtDeck): Row[] {
  const z0 = sig(wind.roughnessLengthM);
  const held = wind.heightUsedM !== wind.deckHeightM;
  const terrainClause = wind.terrainCategory !== null ? `${EN} Table 4.1 (category ${wind.terrainCategory})` : "entered for the site";
  return [
    {
      symbol: "z0, z_min",
      name: "Roughness length, minimum height",
      value: `${z0} m, ${sig(wind.minimumHeightM)} m`,
      working: wind.terrainCategory !== null ? `terrain category ${wind.terrainCategory}` : "site roughness",
      clause: terrainClause,
    },
    {
      symbol: "k_r",
      name: "Terrain factor",
      value: fixed(wind.terrainFactor, 4),
      working: `0.19 × (${z0} / 0.05)^0.07`,
      clause: `${EN} §4.3.2, Expr. (4.5)`,
    },
    {
      symbol: "c_r",
      name: "Roughness factor",
      value: fixed(wind.roughnessFactor, 4),
      working: `${fixed(wind.terrainFactor, 4)} × ln(${sig(wind.heightUsedM)} / ${z0})${held ? ` — z held at z_min` : ""}`,
      clause: `${EN} §4.3.2, Expr. (4.4)`,
    },
    {
      symbol: "c_prob",
      name: "Probability factor",
      value: fixed(wind.probabilityFactor, 4),
      working:
        wind.annualProbability === null
          ? "given directly (see its basis)"
          : `p = ${sig(wind.annualProbability)}, K = 0.2, n = 0.5`,
      clause: wind.annualProbability === null ? "project specification" : `${EN} §4.2(2) Note 4, Expr. (4.2)`,
    },
    {
      symbol: "c_o",
      name: "Orography factor",
      value: fixed(wind.orographyFactor, 3),
      working: wind.orographyFactor === 1 ? "flat terrain or open water" : "entered for the site",
      clause: `${EN} §4.3.3`,
    },
  ];
}

/**
 * The design mean wind at deck level with every factor, the numbers substituted and the clause — so a reviewer
 * can redo v_m by hand from the screen.
 */
export function DesignWindDerivation({ wind, className, live = false }: { wind: MeanWindAtDeck; className?: string; live?: boolean }) {
  return (
    <div className={cn("space-y-3", className)}>
      <div className="rounded-md border border-ink-200 bg-white px-3 py-2">
        <p className="text-xs font-semibold tracking-wide text-ink-600 uppercase">Mean wind at deck level</p>
        <p className="flex flex-wrap items-baseline gap-x-2">
          <span className="text-sm text-ink-700">v_m({sig(wind.deckHeightM)} m) =</span>
          <output
            data-testid="design-speed"
            aria-live={live ? "polite" : undefined}
            className="num text-2xl font-semibold text-ink-950"
          >
            {fixed(wind.meanSpeedMps, 2)} m/s
          </output>
        </p>
        <p className="num text-sm text-ink-700">
          c_r c_o c_prob v_b = {fixed(wind.roughnessFactor, 4)} × {fixed(wind.orographyFactor, 3)} ×{" "}
          {fixed(wind.probabilityFactor, 4)} × {sig(wind.basicSpeedMps)} m/s · {EN} §4.3.1, Expr. (4.3)
        </p>
      </div>
      <div className="relative overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Factors of the design mean wind at deck level</caption>
          <thead>
            <tr className="border-b border-ink-200 text-left text-xs tracking-wide text-ink-600 uppercase">
              <th scope="col" className="py-1 pr-3 font-semibold">Factor</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Value</th>
              <th scope="col" className="py-1 pr-3 font-semibold">Working</th>
              <th scope="col" className="py-1 font-semibold">Clause</th>
            </tr>
          </thead>
          <tbody>
            {rowsOf(wind).map((row) => (
              <tr key={row.symbol} className="border-b border-ink-100 align-top last:border-b-0">
                <th scope="row" className="py-1.5 pr-3 text-left font-normal">
                  <span className="font-semibold text-ink-900">{row.symbol}</span>{" "}
                  <span className="text-ink-600">{row.name}</span>
                </th>
                <td data-testid={`factor-${row.symbol}`} className="num py-1.5 pr-3 text-right whitespace-nowrap">
                  {row.value}
                </td>
                <td className="num py-1.5 pr-3 text-ink-700">{row.working}</td>
                <td className="py-1.5 text-ink-700">{row.clause}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {wind.notes.length > 0 ? (
        <ul className="space-y-1 text-sm text-caution-700">
          {wind.notes.map((note) => (
            <li key={note}>{note}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
