import type { ScreeningResult } from "@shared/criteria/screen-study";
import type { ReactNode } from "react";
import type { AssessedDivergence } from "@shared/schemas/assessment";
import { cn } from "@/lib/cn";
import { SourceList } from "@/features/criteria/components/source-badge";
import { StatusBadge } from "@/features/criteria/components/status-badge";
import { VortexSheddingTable } from "@/features/criteria/components/vortex-shedding-table";
import { fixed, sig } from "@/features/criteria/utils/format";

interface ScreeningTableProps {
  screening: ScreeningResult;
  /** The result's divergence figures from its assessment (the screening computes none of its own). */
  divergence?: AssessedDivergence | null;
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

function Divergence({ divergence }: { divergence: AssessedDivergence }) {
  const { closedForm, staticInstability } = divergence;
  return (
    <div className="space-y-2">
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="text-ink-600">Closed form v_div = [2 k_Θ / (ρ B² dC_M/dα)]^½ · EN 1991-1-4 E.4.3, Expr. (E.24)</dt>
        <dd>
          <span className="num font-semibold" data-testid="divergence-closed-form">
            {closedForm.speedMps !== null ? `${fixed(closedForm.speedMps, 2)} m/s` : "none"}
          </span>{" "}
          <span className="text-ink-700">{closedForm.speedMps !== null && !closedForm.withinSweep ? "(beyond the sweep) " : ""}{closedForm.slopeSource}</span>
        </dd>
        <dt className="text-ink-600">Static instability of the sweep (real pole crossing zero)</dt>
        <dd>
          <span className="num font-semibold" data-testid="divergence-static">
            {staticInstability.speedMps !== null ? `${fixed(staticInstability.speedMps, 2)} m/s` : `none up to ${fixed(staticInstability.upToMps, 2)} m/s`}
          </span>
          {staticInstability.branch ? <span className="text-ink-700"> on branch {staticInstability.branch}</span> : null}
        </dd>
      </dl>
      <p className="text-sm text-ink-800" data-testid="divergence-basis">{divergence.marginBasis}</p>
    </div>
  );
}

/**
 * The screening of one study: vortex shedding per mode, galloping (standard and Den Hartog), each check's assumptions
 * and sources, and the cautions; beside them the result's two divergence figures as its assessment names them.
 */
export function ScreeningTable({ screening, divergence, className }: ScreeningTableProps) {
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
      {divergence ? (
        <Section title="Torsional divergence">
          <Divergence divergence={divergence} />
        </Section>
      ) : null}
      <ul className="space-y-0.5 border-t border-ink-100 pt-2 text-xs leading-snug text-ink-600" aria-label="Cautions">
        {screening.cautions.map((caution) => (
          <li key={caution}>{caution}</li>
        ))}
      </ul>
    </div>
  );
}
