import { greet, renderMail, RESULTS_CAUTION, type RenderedMail } from "./layout.js";

export interface ReturnedMail {
  analystName?: string | null;
  reviewerName: string;
  projectName: string;
  studyName: string;
  revisionNumber: number;
  /** The reviewer's comments, in the reviewer's words. */
  comments: string;
  link: string;
}

export function returnedMail(m: ReturnedMail): RenderedMail {
  return renderMail(`Returned with comments: ${m.studyName}, revision ${m.revisionNumber}`, greet(m.analystName), [
    {
      kind: "paragraph",
      text:
        `${m.reviewerName} has returned revision ${m.revisionNumber} of "${m.studyName}" (${m.projectName}) ` +
        "without signing it. The comments:",
    },
    { kind: "quote", text: m.comments },
    { kind: "paragraph", text: "Address them in a new revision and submit it for review again." },
    { kind: "action", label: "Open the revision", href: m.link },
    { kind: "caution", text: RESULTS_CAUTION },
  ]);
}
