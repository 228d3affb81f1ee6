import { formatUtc, greet, renderMail, type MailBlock, type RenderedMail } from "./layout.js";

/** How long one-time links (invitation, password reset) stay valid. */
export const ONE_TIME_LINK_TTL_HOURS = 72;

/** The closing paragraph of a one-time-link message: single use, expiry, and what ignoring it means. */
export function oneTimeLinkNote(expiresAt: Date, ifIgnored: string): MailBlock {
  return {
    kind: "paragraph",
    text: `The link works once and expires on ${formatUtc(expiresAt)} (${ONE_TIME_LINK_TTL_HOURS} hours after it was sent). ${ifIgnored}`,
  };
}

export interface InvitationMail {
  recipientName?: string | null;
  inviterName: string;
  projectName: string;
  role: "analyst" | "reviewer" | "viewer";
  /** One-time link that sets the password; the only secret a message ever carries. */
  link: string;
  expiresAt: Date;
}

const ROLE_WORDS: Record<InvitationMail["role"], string> = {
  analyst: "an analyst (you run sweeps and edit studies)",
  reviewer: "a reviewer (you compare, return or sign study revisions)",
  viewer: "a reader of the signed stability summaries",
};

export function invitationMail(m: InvitationMail): RenderedMail {
  return renderMail(`You are invited to ${m.projectName} on Stillspan`, greet(m.recipientName), [
    {
      kind: "paragraph",
      text: `${m.inviterName} has invited you to the project "${m.projectName}" as ${ROLE_WORDS[m.role]}.`,
    },
    { kind: "paragraph", text: "Choose your password with the link below to activate your account." },
    { kind: "action", label: "Set your password", href: m.link },
    oneTimeLinkNote(m.expiresAt, "If you did not expect this invitation, ignore this message: nothing happens without the link."),
  ]);
}
