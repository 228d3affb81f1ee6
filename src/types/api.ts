/**
 * Shapes of the API's JSON bodies as the client reads them. They mirror the server's responses
 * (see server/routes); when a zod schema for a resource lands in shared/schemas, import its type instead.
 */

export type ProjectRole = "analyst" | "reviewer" | "viewer";

export interface Membership {
  projectId: string;
  role: ProjectRole;
}

export interface User {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  memberships: Membership[];
}

export interface Project {
  id: string;
  name: string;
  description: string;
  siteNotes: string;
  /** The caller's role in this project; null for an administrator who is not a member. */
  role: ProjectRole | null;
  createdAt: string;
}

export interface ApiErrorBody {
  error: { code: string; message: string; details?: unknown };
}
