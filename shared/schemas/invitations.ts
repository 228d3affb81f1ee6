/**
 * Contract of invitations (`POST /api/projects/:id/invitations`, `POST /api/invitations/accept`) and password
 * resets (`POST /api/auth/password-reset`, `POST /api/auth/password-reset/confirm`). Both send a one-time link
 * whose token is 32 random bytes (base64url, 43 characters); it works once and expires after 72 hours.
 */
import { z } from "zod";
import { userText } from "./input-rules";
import { projectRoleSchema } from "./auth";

/** Shortest accepted password. NIST SP 800-63B §5.1.1.2 asks for at least 8 characters; we ask for 10. */
export const PASSWORD_MIN_LENGTH = 10;

export const passwordSchema = userText({ error: "must be a string" })
  .min(PASSWORD_MIN_LENGTH, `must have at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(200, "must have at most 200 characters");

const email = userText().trim().max(254, "must have at most 254 characters").pipe(z.email("must be an e-mail address"));
const token = userText({ error: "is required" })
  .trim()
  .regex(/^[A-Za-z0-9_-]{43}$/, "must be the token from the link (43 characters)");

export const createInvitationSchema = z.strictObject({
  email,
  role: projectRoleSchema,
  name: userText().trim().min(1, "must not be blank").max(200, "must have at most 200 characters").optional(),
});
export type CreateInvitationInput = z.input<typeof createInvitationSchema>;

export const acceptInvitationSchema = z.strictObject({
  token,
  password: passwordSchema,
  name: userText().trim().min(1, "must not be blank").max(200, "must have at most 200 characters"),
});
export type AcceptInvitationInput = z.input<typeof acceptInvitationSchema>;

export const passwordResetRequestSchema = z.strictObject({ email });
export const passwordResetConfirmSchema = z.strictObject({ token, password: passwordSchema });

export interface InvitationDto {
  id: string;
  projectId: string;
  email: string;
  name: string | null;
  role: z.infer<typeof projectRoleSchema>;
  expiresAt: string;
}
