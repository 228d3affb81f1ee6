import { useState, type FormEvent } from "react";
import { useNavigate } from "react-router-dom";
import type { SignedSummaryPayload } from "@shared/schemas/summary";
import type { SummaryCheckDto } from "@shared/schemas/verification";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field } from "@/components/ui/field";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { divergenceFigure, flutterFigure, warningCountText } from "@/lib/verdict";
import { useSummaryCodeCheck } from "@/features/summaries/api/check-summary-code";
import { VerificationStatus } from "@/features/summaries/components/verification-status";
import { useSummaryVerification } from "@/features/summaries/hooks/use-summary-verification";

/** The figures a reader compares with the paper copy, in either summary format. */
function headline(p: SignedSummaryPayload): [string, string][] {
  if (p.format === "stillspan.summary/1") {
    return [
      ["Flutter", p.flutter ? `${p.flutter.speedMps.toFixed(1)} m/s` : `none up to ${p.sweep.toMps.toFixed(1)} m/s`],
      ["Torsional divergence", p.divergence ? `${p.divergence.speedMps.toFixed(1)} m/s (closed form)` : "not possible"],
      ["Warnings", String(p.warnings.length)],
    ];
  }
  const a = p.assessment;
  return [
    ["Flutter", `${flutterFigure(a)}${a.flutter.found ? ` — ${a.flutter.testedRange.statement.split(" (")[0]}` : ""}`],
    ["Torsional divergence", divergenceFigure(a)],
    ["Verdict", a.verdict === "no-criteria" ? "no criteria" : a.verdict],
    ["Warnings", warningCountText(a)],
  ];
}

function CheckResult({ check }: { check: SummaryCheckDto }) {
  const p = check.payload;
  const verification = useSummaryVerification(`code:${check.verificationCode}`, check.jws, p);
  const rows: [string, string][] = [
    ["Project", p.project.name],
    ["Deck alternative", p.alternative.name],
    ["Study", `${p.study.name}, revision ${p.revision.number}`],
    ["Signed by", `${p.signer.name}, ${formatDateTime(p.signedAt)}`],
    ...headline(p),
    ["Revision content hash", p.revision.contentHash],
    ["Summary format", p.format],
  ];
  return (
    <div className="space-y-3" data-testid="code-check">
      <p className={check.valid ? "font-semibold text-steady-700" : "font-semibold text-signal-700"} data-testid="server-check">
        {check.valid
          ? "On record here, and the server's check of its signature succeeds."
          : `On record here, but its signature does not check: ${check.reason}. Do not rely on it.`}
      </p>
      <VerificationStatus verification={verification} code={check.verificationCode} jwksUrl={check.jwksUrl} />
      {!check.current && check.supersededBy ? (
        <p role="alert" className="rounded-md border-2 border-signal-600 bg-signal-50 px-3 py-2 text-sm text-signal-700">
          Superseded: revision {check.supersededBy.revisionNumber} of this study was signed on {formatDateTime(check.supersededBy.signedAt)}. Ask for the current summary.
        </p>
      ) : check.newerUnsigned ? (
        <p role="note" className="rounded-md bg-caution-100 px-3 py-2 text-sm text-caution-700">
          Later revisions of this study exist that are not signed: this summary covers revision {p.revision.number} only.
        </p>
      ) : null}
      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
        {rows.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-ink-600">{label}</dt>
            <dd className="min-w-0 break-words text-ink-900">{value}</dd>
          </div>
        ))}
      </dl>
      <p className="text-sm text-ink-700">Every figure above must equal the PDF you hold; the PDF states the rest (inputs, margins, warnings).</p>
      <details className="text-sm">
        <summary className="cursor-pointer font-semibold text-tide-700">The signed JWS, to check with your own tools</summary>
        <p className="num mt-1 break-all text-xs">{check.jws}</p>
      </details>
    </div>
  );
}

/** The public check of a signed summary by the verification code printed on its PDF. */
export function CodeCheck({ code }: { code: string | null }) {
  const navigate = useNavigate();
  const [typed, setTyped] = useState(code ?? "");
  const check = useSummaryCodeCheck(code);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (typed.trim()) navigate(paths.auth.verify.getHref(typed.trim()));
  };
  return (
    <div className="space-y-4">
      <form onSubmit={submit} className="flex items-end gap-2" aria-label="Verification code">
        <Field label="Verification code" placeholder="3f9a-07c2-b1e4" value={typed} onChange={(e) => setTyped(e.target.value)} containerClassName="flex-1" />
        <Button type="submit">Check</Button>
      </form>
      {code === null ? null : check.isPending ? (
        <LoadingBlock label="Looking up the summary…" />
      ) : check.isError ? (
        <ErrorPanel
          title={check.error instanceof ApiError && check.error.status === 404 ? "No summary with this code" : "The code could not be checked"}
          message={check.error.message}
          code={check.error instanceof ApiError ? check.error.code : undefined}
        />
      ) : (
        <CheckResult check={check.data} />
      )}
    </div>
  );
}
