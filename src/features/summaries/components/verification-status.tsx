import type { Verification } from "@/features/summaries/hooks/use-summary-verification";
import { Spinner } from "@/components/ui/spinner";
import { cn } from "@/lib/cn";

/** The outcome of the in-browser signature check, worded for the owner's representative. */
export function VerificationStatus({ verification, code, jwksUrl, verificationUrl }: {
  verification: Verification;
  code: string;
  jwksUrl: string;
  /** The public page that checks this summary by its code (printed on the PDF). */
  verificationUrl?: string;
}) {
  const tone =
    verification.status === "verified"
      ? "border-steady-600 bg-steady-100 text-steady-700"
      : verification.status === "failed"
        ? "border-signal-600 bg-signal-50 text-signal-700"
        : "border-ink-200 bg-ink-50 text-ink-700";
  return (
    <section aria-label="Signature" aria-live="polite" className={cn("rounded-lg border-2 px-4 py-3", tone)}>
      {verification.status === "checking" ? (
        <p className="flex items-center gap-2 font-semibold">
          <Spinner size="sm" label={null} /> Checking the signature…
        </p>
      ) : verification.status === "verified" ? (
        <>
          <p className="text-lg font-semibold" data-testid="verification-status">
            ✓ Verified
          </p>
          <p className="text-sm">
            Checked in your browser: the signature matches every number on this page, under the server's published key{" "}
            <span className="num break-all">{verification.kid}</span> (<a className="underline" href={jwksUrl}>{jwksUrl}</a>).
            Verification code <span className="num font-semibold">{code}</span> — the same code is printed on the PDF.
            {verificationUrl ? (
              <>
                {" "}Anyone holding the PDF can check it without an account at{" "}
                <a className="break-all underline" href={verificationUrl}>{verificationUrl}</a>.
              </>
            ) : null}
          </p>
        </>
      ) : (
        <>
          <p className="text-lg font-semibold" data-testid="verification-status">
            ✗ Not verified
          </p>
          <p className="text-sm">
            Do not rely on this summary: {verification.reason}. Ask the reviewing engineer for a fresh copy.
          </p>
        </>
      )}
    </section>
  );
}
