import type { ScreeningResult } from "@shared/criteria/screen-study";
import type { ReactNode } from "react";
import type { SweepWarning } from "@shared/schemas/result";
import { cn } from "@/lib/cn";
import { SourceList } from "@/features/criteria/components/source-badge";
import { StatusBadge } from "@/features/criteria/components/status-badge";
import { VortexSheddingTable } from "@/features/criteria/components/vortex-shedding-table";
import { fixed, sig } from "@/features/criteria/utils/format";

/** What the sweep said about divergence, shown beside the closed form. */
export interface EngineDivergence {
  /** The engine's divergence speed, m/s; null when the sweep reports none. */
  speedMps: number | null;
  /** Warnings of the sweep; `static-instability` ones are shown here. */
  warnings: readonly SweepWarning[];
}

interface ScreeningTableProps {
  screening: ScreeningResult;
  engine?: EngineDivergence | null;
  className?: string;
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="space-y-2">
      <h3 className="text-sm font-semibold tracking-wide text-ink-600 uppercase">{title}</h3>
      {children}
    </section>
  );
}

function Assumptions({ title, items, sources }: { title: string; items: readonly string[]; sources: readonly string[] }) {
  return (
    <details className="text-sm">
      <summary className="w-fit cursor-pointer font-semibold text-tide-700 hover:underline">{title}</summary>
      <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-700">
        {items.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
      <p className="mt-2 font-semibold text-ink-800">Sources</p>
      <SourceList sources={sources} />
    </details>
  );
}

function Galloping({ galloping }: { galloping: ScreeningResult["galloping"] }) {
  const { standard, denHartog, critical } = galloping;
  return (
    <div className="space-y-2">
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="text-ink-600">Heave mode, Scruton Sc</dt>
        <dd className="num">
          {galloping.modeId}, Sc = {fixed(galloping.scruton, 2)}
        </dd>
        <dt className="text-ink-600">Standard: v_CG = 2 Sc n D / a_G</dt>
        <dd>
          {standard ? (
            <>
              <span className="num font-semibold" data-testid="galloping-standard">
                {fixed(standard.onsetSpeedMps, 2)} m/s
              </span>{" "}
              with a_G = <span className="num">{sig(standard.factor, 3)}</span> (
              {standard.factorOrigin === "input" ? standard.factorSource : "rectangle table, from memory"}) · EN 1991-1-4 E.2.2,
              Expr. (E.18)
              {galloping.governing === "standard" ? <StatusBadge tone="none" className="ml-2">governs</StatusBadge> : null}
            </>
          ) : (
            <span className="text-ink-700" data-testid="galloping-standard">
              not evaluated — no a_G for this section
            </span>
          )}
        </dd>
        <dt className="text-ink-600">Den Hartog: dC_L/dα + C_D</dt>
        <dd>
          {denHartog ? (
            <>
              <span className="num font-semibold">{fixed(denHartog.coefficient, 3)}</span>{" "}
              {denHartog.unstable ? (
                <>
                  &lt; 0: galloping possible, onset{" "}
                  <span className="num font-semibold">{fixed(denHartog.onsetSpeedMps, 2)} m/s</span>
                </>
              ) : (
                "≥ 0: no quasi-steady galloping"
              )}{" "}
              ({denHartog.coefficientsOrigin})
              {galloping.governing === "den-hartog" ? <StatusBadge tone="none" className="ml-2">governs</StatusBadge> : null}
            </>
          ) : (
            <span className="text-ink-600">not evaluated — no static coefficients</span>
          )}
        </dd>
      </dl>
      {critical.kind === "not-evaluated" ? (
        <p className="rounded-md border-l-4 border-l-ink-300 bg-ink-50 px-3 py-1.5 text-sm text-ink-800" data-testid="galloping-not-evaluated">
          <StatusBadge tone="none" className="mr-2">not evaluated</StatusBadge>
          {critical.reason}
        </p>
      ) : null}
      {galloping.coveredBySweep ? <p className="text-sm text-ink-700">{galloping.coveredBySweep}</p> : null}
    </div>
  );
}

function Divergence({ divergence, engine }: { divergence: ScreeningResult["divergence"]; engine?: EngineDivergence | null }) {
  const staticWarnings = engine?.warnings.filter((warning) => warning.code === "static-instability") ?? [];
  return (
    <div className="space-y-2">
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="text-ink-600">Closed form v_div = [2 k_Θ / (ρ B² dC_M/dα)]^½</dt>
        <dd>
          <span className="num font-semibold" data-testid="divergence-closed-form">
            {divergence.speedMps !== null
              ? `${fixed(divergence.speedMps, 2)} m/s`
              : divergence.critical?.kind === "none"
                ? "none (dC_M/dα ≤ 0)"
                : "not evaluated"}
          </span>{" "}
          · EN 1991-1-4 E.4.3, Expr. (E.24)
        </dd>
        {engine !== undefined && engine !== null ? (
          <>
            <dt className="text-ink-600">Engine (sweep)</dt>
            <dd className="num font-semibold" data-testid="divergence-engine">
              {engine.speedMps !== null ? `${fixed(engine.speedMps, 2)} m/s` : "none within the sweep"}
            </dd>
          </>
        ) : null}
        <dt className="text-ink-600">Moment slope, stiffness</dt>
        <dd className="num">
          {divergence.momentSlope ? `dC_M/dα = ${fixed(divergence.momentSlope.value, 4)} /rad` : "no slope"} · k_Θ ={" "}
          {divergence.torsionalStiffnessNmPerM.toExponential(3)} N·m/rad per m
        </dd>
      </dl>
      {staticWarnings.map((warning) => (
        <p key={warning.message} role="note" className="rounded-md border-l-4 border-l-signal-600 bg-signal-50 px-3 py-1.5 text-sm text-signal-700">
          <span className="font-semibold">Static instability in the sweep:</span> {warning.message}
        </p>
      ))}
    </div>
  );
}

/**
 * The screening of one study: vortex shedding per mode, galloping (standard and Den Hartog), divergence by the
 * closed form beside the engine's value, each check's assumptions and sources, and the cautions.
 */
export function ScreeningTable({ screening, engine, className }: ScreeningTableProps) {
  return (
    <div className={cn("space-y-5", className)} data-testid="screening">
      <Section title="Vortex shedding">
        <VortexSheddingTable vortex={screening.vortexShedding} />
        <Assumptions title="Assumptions and sources: vortex shedding" items={screening.vortexShedding.assumptions} sources={screening.vortexShedding.sources} />
      </Section>
      <Section title="Galloping">
        <Galloping galloping={screening.galloping} />
        <Assumptions title="Assumptions and sources: galloping" items={screening.galloping.assumptions} sources={screening.galloping.sources} />
      </Section>
      <Section title="Torsional divergence">
        <Divergence divergence={screening.divergence} engine={engine} />
        <Assumptions title="Assumptions and sources: divergence" items={screening.divergence.assumptions} sources={screening.divergence.sources} />
      </Section>
      <ul className="space-y-0.5 border-t border-ink-100 pt-2 text-xs leading-snug text-ink-600" aria-label="Cautions">
        {screening.cautions.map((caution) => (
          <li key={caution}>{caution}</li>
        ))}
      </ul>
    </div>
  );
}
