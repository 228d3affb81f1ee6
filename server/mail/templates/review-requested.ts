import { greet, renderMail, RESULTS_CAUTION, type RenderedMail } from "./layout.js";

export interface ReviewRequestedMail {
  reviewerName?: string | null;
  analystName: string;
  projectName: string;
  alternativeName: string;
  studyName: string;
  revisionNumber: number;
  /** The analyst's note to the reviewer, if any. */
  note?: string | null;
  /** Link to the revision in the workspace (requires sign-in). */
  link: string;
}

export function reviewRequestedMail(m: ReviewRequestedMail): RenderedMail {
  return renderMail(
    `Review requested: ${m.studyName}, revision ${m.revisionNumber}`,
    greet(m.reviewerName),
    [
      { kind: "paragraph", text: `${m.analystName} asks you to review a study revision.` },
      {
        kind: "facts",
        rows: [
          ["Project", m.projectName],
          ["Alternative", m.alternativeName],
          ["Study", m.studyName],
          ["Revision", String(m.revisionNumber)],
        ],
      },
      ...(m.note ? [{ kind: "quote" as const, text: m.note }] : []),
      { kind: "action", label: "Open the revision", href: m.link },
      { kind: "caution", text: RESULTS_CAUTION },
    ],
  );
}
