import { formatUtc, greet, renderMail, RESULTS_CAUTION, type RenderedMail } from "./layout.js";

export interface SignedMail {
  recipientName?: string | null;
  reviewerName: string;
  projectName: string;
  alternativeName: string;
  studyName: string;
  revisionNumber: number;
  signedAt: Date;
  /** Link to the signed stability summary. */
  link: string;
}

export function signedMail(m: SignedMail): RenderedMail {
  return renderMail(`Signed stability summary: ${m.studyName}, revision ${m.revisionNumber}`, greet(m.recipientName), [
    {
      kind: "paragraph",
      text:
        `${m.reviewerName} has signed the stability summary of revision ${m.revisionNumber} of "${m.studyName}" ` +
        `(${m.alternativeName}, ${m.projectName}) on ${formatUtc(m.signedAt)}.`,
    },
    {
      kind: "paragraph",
      text:
        "The summary page shows the critical speeds, the required speeds and margins, and checks the signature " +
        "against the published keys; a PDF copy can be downloaded there.",
    },
    { kind: "action", label: "Read the signed summary", href: m.link },
    { kind: "caution", text: RESULTS_CAUTION },
  ]);
}
