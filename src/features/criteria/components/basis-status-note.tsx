import type { BasisStatus } from "@shared/schemas/criteria";
import { formatDate } from "@/lib/format";

const badge = "inline-flex items-center rounded-sm px-1.5 py-px align-[0.1em] text-xs font-semibold whitespace-nowrap";

/**
 * Who stands behind a requirement's basis: "Default text — not confirmed" (signing refused until a reviewer confirms
 * or replaces it), "Not confirmed", or "Confirmed by … / Written by …" with the date and criteria version.
 */
export function BasisStatusNote({ status }: { status: BasisStatus }) {
  const { defaultText, confirmation } = status;
  if (!confirmation) {
    return (
      <span className="text-xs text-caution-700" data-basis-state={defaultText ? "default" : "unconfirmed"}>
        <span className={`${badge} bg-caution-100 text-caution-700`}>{defaultText ? "Default text — not confirmed" : "Not confirmed"}</span>{" "}
        {defaultText
          ? "a reviewer must confirm or replace it before a summary is signed"
          : "no reviewer has confirmed it; summaries cannot be signed until one does"}
      </span>
    );
  }
  return (
    <span className="text-xs text-ink-600" data-basis-state="confirmed">
      {defaultText ? (
        <>
          <span className={`${badge} bg-ink-100 text-ink-700`}>Default text</span>{" "}
        </>
      ) : null}
      {confirmation.how === "confirmed" ? "Confirmed" : "Written"} by {confirmation.by.name}, {formatDate(confirmation.at)} (version{" "}
      {confirmation.version})
    </span>
  );
}
