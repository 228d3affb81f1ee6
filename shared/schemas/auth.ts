/**
 * Contract of the sign-in API (`/api/auth/*`). Identifiers travel as decimal strings.
 */
import { z } from "zod";
import { userText } from "./input-rules";

export const PROJECT_ROLES = ["analyst", "reviewer", "viewer"] as const;
export const projectRoleSchema = z.enum(PROJECT_ROLES);
export type ProjectRole = z.infer<typeof projectRoleSchema>;

export const signInInputSchema = z.strictObject({
  email: userText().trim().max(254, "must have at most 254 characters").pipe(z.email("must be an e-mail address")),
  password: userText().min(1, "must not be empty").max(200, "must have at most 200 characters"),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const membershipSchema = z.object({
  projectId: z.string(),
  role: projectRoleSchema,
});

/** Body of GET /api/auth/me and of a successful POST /api/auth/sign-in. */
export const meSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  memberships: z.array(membershipSchema),
});
export type Me = z.infer<typeof meSchema>;
