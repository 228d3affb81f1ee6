/**
 * Contract of the projects API (`/api/projects*`). Identifiers travel as decimal strings; times as ISO 8601.
 */
import { z } from "zod";
import { userText } from "./input-rules";
import { projectRoleSchema } from "./auth";

export const projectSchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  siteNotes: z.string(),
  /** The caller's membership role; null for an administrator who is not a member. */
  role: projectRoleSchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ProjectDto = z.infer<typeof projectSchema>;

/** PATCH /api/projects/:id — analysts (and administrators) edit the project's texts. */
export const projectPatchSchema = z
  .strictObject({
    name: userText().trim().min(1, "must not be blank").max(200, "must have at most 200 characters"),
    description: userText().trim().max(5000, "must have at most 5000 characters"),
    siteNotes: userText().trim().max(20000, "must have at most 20000 characters"),
  })
  .partial()
  .refine((p) => Object.keys(p).length > 0, "give at least one of name, description, siteNotes");
export type ProjectPatch = z.infer<typeof projectPatchSchema>;

export const projectMemberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  role: projectRoleSchema,
});
export type ProjectMember = z.infer<typeof projectMemberSchema>;

const projectNameSchema = userText().trim().min(1, "must not be blank").max(200, "must have at most 200 characters");

/** POST /api/projects — administrators create a project; description and site notes may be left out (empty). */
export const projectCreateSchema = z.strictObject({
  name: projectNameSchema,
  description: userText().trim().max(5000, "must have at most 5000 characters").optional(),
  siteNotes: userText().trim().max(20000, "must have at most 20000 characters").optional(),
});
export type ProjectCreateInput = z.infer<typeof projectCreateSchema>;

/** PUT /api/projects/:id/members/:userId — administrators add a member or change their role. */
export const memberRoleInputSchema = z.strictObject({ role: projectRoleSchema });
export type MemberRoleInput = z.infer<typeof memberRoleInputSchema>;
