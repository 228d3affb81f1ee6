import type { ReactNode } from "react";
import { Link } from "react-router-dom";
import type { SummaryDto } from "@shared/schemas/review";
import { SUMMARY_CAUTIONS, type SummaryPayload } from "@shared/schemas/summary";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { Plot } from "@/components/ui/plot";
import { apiPaths, paths } from "@/config/paths";
import { cn } from "@/lib/cn";
import { formatDateTime } from "@/lib/format";
import { samplingNote } from "@/lib/sampling-note";
import { VerificationStatus } from "@/features/summaries/components/verification-status";
import { useSummaryVerification } from "@/features/summaries/hooks/use-summary-verification";
import { dampingFigure, frequencyFigure, polePathFigure } from "@/features/summaries/utils/summary-figures";

const PHENOMENON: Record<string, string> = {
  flutter: "Flutter",
  divergence: "Torsional divergence",
  vortexOnset: "Vortex-shedding onset",
  gallopingOnset: "Galloping onset",
};
/** Failure colour for a failed stability check only; "investigate" is a caution, "not evaluated" neutral. */
const STATUS: Record<SummaryPayload["margins"][number]["status"], { label: string; tone: string }> = {
  pass: { label: "Pass", tone: "bg-steady-100 text-steady-700" },
  fail: { label: "Fail", tone: "bg-signal-50 text-signal-700" },
  undetermined: { label: "Undetermined", tone: "bg-caution-100 text-caution-700" },
  investigate: { label: "Investigate", tone: "bg-caution-100 text-caution-700" },
  clear: { label: "Clear", tone: "bg-steady-100 text-steady-700" },
  "not-evaluated": { label: "Not evaluated", tone: "bg-ink-50 text-ink-700" },
};
const mps = (v: number | null | undefined) => (v === null || v === undefined ? "—" : `${v.toFixed(1)} m/s`);

function Figure({ label, value, detail }: { label: string; value: string; detail?: string }) {
  return (
    <div className="rounded-md border border-ink-200 bg-white px-3 py-2">
      <p className="text-xs tracking-wide text-ink-600 uppercase">{label}</p>
      <p className="num text-2xl leading-tight font-semibold text-ink-950">{value}</p>
      {detail ? <p className="text-sm text-ink-600">{detail}</p> : null}
    </div>
  );
}

function Banners({ summary }: { summary: SummaryDto }) {
  const n = summary.payload.revision.number;
  return (
    <>
      {!summary.current && summary.currentSummary ? (
        <div role="alert" className="rounded-lg border-2 border-signal-600 bg-signal-50 px-4 py-3 text-signal-700">
          <p className="font-semibold">Superseded — this summary is no longer the current one.</p>
          <p className="text-sm">
            Revision {summary.currentSummary.revisionNumber} of this study was signed on {formatDateTime(summary.currentSummary.signedAt)}.
            This summary of revision {n} is kept for the record.{" "}
            <Link className="font-semibold underline" to={paths.app.summary.getHref(summary.currentSummary.id)}>
              Open the current summary (revision {summary.currentSummary.revisionNumber})
            </Link>
          </p>
        </div>
      ) : null}
      {summary.newerUnsigned ? (
        <div role="note" className="rounded-lg border border-caution-400 bg-caution-100 px-4 py-2 text-caution-700">
          <p className="text-sm">
            <span className="font-semibold">Newer work exists:</span> the study has revisions up to {summary.newestRevisionNumber}{" "}
            that are not signed yet. This summary covers revision {n} only.
          </p>
        </div>
      ) : null}
    </>
  );
}

function MarginsTable({ payload }: { payload: SummaryPayload }) {
  return (
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
          {payload.margins.map((m) => (
            <tr key={m.phenomenon} className="border-b border-ink-100 last:border-b-0">
              <th scope="row" className="px-4 py-2 align-top font-semibold">
                {PHENOMENON[m.phenomenon]}
                <p className="text-sm font-normal text-ink-600">{m.statement}</p>
              </th>
              <td className="num px-4 py-2 text-right align-top">{m.criticalSpeedMps !== null ? mps(m.criticalSpeedMps) : m.marginIsLowerBound ? "none found" : "—"}</td>
              <td className="num px-4 py-2 text-right align-top">{mps(m.requiredSpeedMps)}</td>
              <td className="num px-4 py-2 text-right align-top">{m.margin === null ? "—" : `${m.marginIsLowerBound ? "≥ " : ""}${m.margin.toFixed(2)}`}</td>
              <td className="px-4 py-2 align-top">
                <span className={cn("rounded-sm px-1.5 py-0.5 text-sm font-semibold whitespace-nowrap", STATUS[m.status].tone)}>{STATUS[m.status].label}</span>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Facts({ rows }: { rows: [string, ReactNode][] }) {
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

/** A signed summary's title, its currency banners and the in-browser check of its signature. */
function SignedHead({ summary }: { summary: SummaryDto }) {
  const p = summary.payload;
  const verification = useSummaryVerification(summary.id, summary.jws, p);
  return (
    <>
      <PageHeader
        eyebrow={
          <>
            <Link className="underline-offset-2 hover:underline" to={paths.app.signedSummaries.getHref()}>
              Signed summaries
            </Link>{" "}
            · {p.project.name} · {p.alternative.name}
          </>
        }
        title={`Stability summary — ${p.study.name}, revision ${p.revision.number}`}
        description={`Signed by ${p.signer.name} on ${formatDateTime(p.signedAt)}.`}
        actions={
          <a
            href={apiPaths.summaries.pdf(summary.id)}
            download
            className="inline-flex h-9 items-center rounded-md bg-ink-800 px-3.5 font-semibold text-white hover:bg-ink-700"
          >
            Download PDF
          </a>
        }
      />
      <Banners summary={summary} />
      <VerificationStatus verification={verification} code={summary.verificationCode} jwksUrl={summary.jwksUrl} />
    </>
  );
}

/**
 * What a summary preview shows in place of a signed summary's head (title, currency, signature check) and of the
 * reviewer's statement (the decision form, whose statement is signed with the summary).
 */
export interface SummaryPreviewSlots {
  head: ReactNode;
  decision: ReactNode;
  /** A mark beside a criterion whose basis stands unconfirmed (signing is refused until it is confirmed). */
  criterionNote?: (phenomenon: SummaryPayload["criteria"][number]["phenomenon"]) => ReactNode;
}

type SummaryViewProps =
  | { summary: SummaryDto; preview?: undefined }
  | { summary: Pick<SummaryDto, "id" | "payload" | "branches" | "branchSampling">; preview: SummaryPreviewSlots };

/**
 * The signed stability summary as the owner's representative reads it — or, with `preview`, the summary of a revision
 * exactly as the server would sign it now, as the reviewer reads it before signing.
 */
export function SummaryView({ summary, preview }: SummaryViewProps) {
  const p = summary.payload;
  const flutterRequired = p.criteria.find((c) => c.phenomenon === "flutter");
  const aero = p.aerodynamicData;

  return (
    <div className="space-y-4">
      {preview ? preview.head : <SignedHead summary={summary} />}

      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Figure
          label="Flutter speed"
          value={p.flutter ? mps(p.flutter.speedMps) : `> ${mps(p.sweep.toMps)}`}
          detail={p.flutter ? `${p.flutter.frequencyHz.toFixed(3)} Hz · ${p.flutter.kind}, from ${p.flutter.mode} · U/(fB) ${p.flutter.reducedVelocity.toFixed(2)}` : "no flutter up to the end of the sweep"}
        />
        <Figure label="Torsional divergence" value={p.divergence ? mps(p.divergence.speedMps) : "not possible"} detail="closed form (static)" />
        <Figure label="Required flutter speed" value={mps(flutterRequired?.requiredSpeedMps)} detail={flutterRequired ? `${flutterRequired.totalFactor} × v_m` : undefined} />
        <Figure label="Design mean wind at deck" value={mps(p.designWind.meanSpeedMps)} detail={`v_b ${p.designWind.basicSpeedMps} m/s · deck at ${p.designWind.deckHeightM} m`} />
      </div>

      <Card
        title="Margins against the required speeds"
        subtitle="Critical speed ÷ required speed: stability limits pass at 1.00 or more; a vortex-shedding onset below the required speed is to investigate (amplitudes, accelerations), not a failure"
        aria-label="Margins against the required speeds"
        flush
      >
        <MarginsTable payload={p} />
      </Card>

      <div className="rounded-lg border border-caution-400 bg-caution-100 px-4 py-3 text-caution-700" role="note" aria-label="Cautions">
        <p className="font-semibold">Cautions</p>
        <ul className="list-disc space-y-0.5 pl-5 text-sm">
          {SUMMARY_CAUTIONS.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </div>

      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="Damping of each branch" subtitle="Damping ratio ζ against wind speed; flutter where a branch crosses zero">
          <Plot height={300} label="Damping ratio of each pole branch against mean wind speed" downloadName={`summary-${summary.id}-damping-ratio`} {...dampingFigure(p, summary.branches)} />
        </Card>
        <Card title="Frequency of each branch" subtitle="Frequency against wind speed">
          <Plot height={300} label="Frequency of each pole branch against mean wind speed" downloadName={`summary-${summary.id}-frequency`} {...frequencyFigure(p, summary.branches)} />
        </Card>
        <Card title="Pole paths" subtitle="λ through the sweep; right of the axis is unstable" className="lg:col-span-2">
          <Plot height={320} label="Pole paths in the complex plane" downloadName={`summary-${summary.id}-pole-paths`} {...polePathFigure(summary.branches)} />
        </Card>
        {samplingNote(summary.branchSampling) ? (
          <p className="text-sm text-ink-600 lg:col-span-2">{samplingNote(summary.branchSampling)}</p>
        ) : null}
      </div>

      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="Criteria and their basis">
          <ul className="space-y-2">
            {p.criteria.map((c) => (
              <li key={c.phenomenon}>
                <p className="font-semibold">
                  {PHENOMENON[c.phenomenon]}: <span className="num">{mps(c.requiredSpeedMps)}</span>{" "}
                  <span className="font-normal text-ink-600">
                    = {c.factor}
                    {c.gustFactor ? ` × ${c.gustFactor}` : ""}
                    {c.angleFactor ? ` × ${c.angleFactor}` : ""} × v_m
                  </span>{" "}
                  {preview?.criterionNote?.(c.phenomenon)}
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
            {p.designWind.sources.map((s) => (
              <li key={s}>{s}</li>
            ))}
          </ul>
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
              ["Content hash", <span className="num text-sm break-all">{p.revision.contentHash}</span>],
            ]}
          />
        </Card>
      </div>

      {p.warnings.length > 0 ? (
        <Card title="Warnings of the computation">
          <ul className="list-disc space-y-1 pl-5 text-ink-800">
            {p.warnings.map((w) => (
              <li key={w.code + w.message}>{w.message}</li>
            ))}
          </ul>
        </Card>
      ) : null}

      {preview ? (
        preview.decision
      ) : (
        <Card title="Reviewer's statement" subtitle={`${p.signer.name} <${p.signer.email}> · signed ${formatDateTime(p.signedAt)}`}>
          <p className="whitespace-pre-wrap text-ink-900">{p.statement}</p>
        </Card>
      )}
    </div>
  );
}
