/**
 * The API's body shapes as the client reads them. The contract itself lives in shared/schemas (zod, used by
 * the server to build the responses); these are its inferred types under the names the client uses.
 */
export type { Me as User, ProjectRole } from "@shared/schemas/auth";
export type { ProjectDto as Project } from "@shared/schemas/projects";

/** Every error response: `{ error: { code, message, details? } }` (server/middleware/error-handler.ts). */
export interface ApiErrorBody {
  error: { code: string; message: string; details?: unknown };
}
