/**
 * Contract of the account administration API (`/api/users*`, administrators only). Identifiers travel as
 * decimal strings; times as ISO 8601.
 */
import { z } from "zod";
import { userText } from "./input-rules";
import { projectRoleSchema } from "./auth";

/** One account as the administration page lists it, with every project membership. */
export const adminUserSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  createdAt: z.string(),
  memberships: z.array(z.object({ projectId: z.string(), projectName: z.string(), role: projectRoleSchema })),
});
export type AdminUser = z.infer<typeof adminUserSchema>;

/** PATCH /api/users/:id — rename an account or set its administrator flag (not one's own flag to false). */
export const userPatchSchema = z
  .strictObject({
    name: userText().trim().min(1, "must not be blank").max(200, "must have at most 200 characters"),
    isAdmin: z.boolean(),
  })
  .partial()
  .refine((p) => Object.keys(p).length > 0, "give at least one of name, isAdmin");
export type UserPatch = z.infer<typeof userPatchSchema>;
