import { oneTimeLinkNote } from "./invitation.js";
import { greet, renderMail, type RenderedMail } from "./layout.js";

export interface PasswordResetMail {
  recipientName?: string | null;
  /** One-time link to choose a new password. */
  link: string;
  expiresAt: Date;
}

export function passwordResetMail(m: PasswordResetMail): RenderedMail {
  return renderMail("Choose a new Stillspan password", greet(m.recipientName), [
    { kind: "paragraph", text: "Someone asked to reset the password of your Stillspan account." },
    { kind: "action", label: "Choose a new password", href: m.link },
    oneTimeLinkNote(m.expiresAt, "If you did not ask for this, ignore this message: your password stays as it is."),
  ]);
}
