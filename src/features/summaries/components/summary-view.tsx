import { useMemo, type ReactNode } from "react";
import { Link } from "react-router-dom";
import type { SummaryDto } from "@shared/schemas/review";
import type { Phenomenon } from "@shared/schemas/criteria";
import { SUMMARY_CAUTIONS } from "@shared/schemas/summary";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { Plot } from "@/components/ui/plot";
import { apiPaths, paths } from "@/config/paths";
import { formatDateTime } from "@/lib/format";
import { samplingNote } from "@/lib/sampling-note";
import { SummaryBody } from "@/features/summaries/components/summary-body";
import { SummaryBodyV1 } from "@/features/summaries/components/summary-body-v1";
import { VerificationStatus } from "@/features/summaries/components/verification-status";
import { useSummaryVerification } from "@/features/summaries/hooks/use-summary-verification";
import { dampingFigure, frequencyFigure, polePathFigure } from "@/features/summaries/utils/summary-figures";

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
      <VerificationStatus verification={verification} code={summary.verificationCode} jwksUrl={summary.jwksUrl} verificationUrl={summary.verificationUrl} />
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
  criterionNote?: (phenomenon: Phenomenon) => ReactNode;
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
  // Stable between renders (the signature check re-renders the page): plotly redraws only for new data.
  const figures = useMemo(
    () => ({ damping: dampingFigure(p, summary.branches), frequency: frequencyFigure(p, summary.branches), poles: polePathFigure(p, summary.branches) }),
    [p, summary.branches],
  );

  return (
    <div className="space-y-4">
      {preview ? preview.head : <SignedHead summary={summary} />}

      {p.format === "stillspan.summary/1" ? <SummaryBodyV1 payload={p} /> : <SummaryBody payload={p} criterionNote={preview?.criterionNote} />}

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
          <Plot height={300} label="Damping ratio of each pole branch against mean wind speed" downloadName={`summary-${summary.id}-damping-ratio`} {...figures.damping} />
        </Card>
        <Card title="Frequency of each branch" subtitle="Frequency against wind speed">
          <Plot height={300} label="Frequency of each pole branch against mean wind speed" downloadName={`summary-${summary.id}-frequency`} {...figures.frequency} />
        </Card>
        <Card title="Pole paths" subtitle="λ through the sweep; right of the axis is unstable" className="lg:col-span-2">
          <Plot height={320} label="Pole paths in the complex plane" downloadName={`summary-${summary.id}-pole-paths`} {...figures.poles} />
        </Card>
        {samplingNote(summary.branchSampling) ? (
          <p className="text-sm text-ink-600 lg:col-span-2">{samplingNote(summary.branchSampling)}</p>
        ) : null}
      </div>

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
