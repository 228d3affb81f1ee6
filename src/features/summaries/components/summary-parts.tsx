import type { ReactNode } from "react";
import type { Phenomenon } from "@shared/schemas/criteria";

export const PHENOMENON: Record<string, string> = {
  flutter: "Flutter",
  divergence: "Torsional divergence",
  vortexOnset: "Vortex-shedding onset",
  gallopingOnset: "Galloping onset",
};

export const mps = (v: number | null | undefined, digits = 2) => (v === null || v === undefined ? "—" : `${v.toFixed(digits)} m/s`);

export function Figure({ label, value, detail, tone, testId }: { label: string; value: string; detail?: ReactNode; tone?: string; testId?: string }) {
  return (
    <div className="rounded-md border border-ink-200 bg-white px-3 py-2">
      <p className="text-xs tracking-wide text-ink-600 uppercase">{label}</p>
      <p className={`num text-2xl leading-tight font-semibold ${tone ?? "text-ink-950"}`} data-testid={testId}>{value}</p>
      {detail ? <div className="text-sm text-ink-600">{detail}</div> : null}
    </div>
  );
}

export function Facts({ rows }: { rows: [string, ReactNode][] }) {
  return (
    <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-[0.95rem]">
      {rows.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="text-ink-600">{label}</dt>
          <dd className="min-w-0 break-words text-ink-900">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

interface Required {
  phenomenon: Phenomenon;
  requiredSpeedMps: number;
  factor: number;
  gustFactor: number | null;
  angleFactor: number | null;
  basis: string[];
}

/**
 * The required speeds with the basis of every factor, and the design wind's sources; `note` adds a mark beside a
 * criterion (the summary preview marks a basis that stands unconfirmed).
 */
export function CriteriaList({
  required,
  sources,
  note,
}: {
  required: readonly Required[];
  sources: readonly string[];
  note?: (phenomenon: Phenomenon) => ReactNode;
}) {
  return (
    <>
      <ul className="space-y-2">
        {required.map((c) => (
          <li key={c.phenomenon}>
            <p className="font-semibold">
              {PHENOMENON[c.phenomenon]}: <span className="num">{mps(c.requiredSpeedMps)}</span>{" "}
              <span className="font-normal text-ink-600">
                = {c.factor}
                {c.gustFactor ? ` × ${c.gustFactor}` : ""}
                {c.angleFactor ? ` × ${c.angleFactor}` : ""} × v_m
              </span>{" "}
              {note?.(c.phenomenon)}
            </p>
            <ul className="list-disc pl-5 text-sm text-ink-700">
              {c.basis.map((b) => (
                <li key={b}>{b}</li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
      <p className="mt-3 text-sm font-semibold text-ink-800">Design wind</p>
      <ul className="list-disc pl-5 text-sm text-ink-700">
        {sources.map((s) => (
          <li key={s}>{s}</li>
        ))}
      </ul>
    </>
  );
}
