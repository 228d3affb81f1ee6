import { PROJECT_ROLES } from "@shared/schemas/auth";
import { roleLabel } from "@/lib/authorization";

/** What each project role may do, in the words of the administration page. */
export const ROLE_DUTIES = {
  analyst: "runs sweeps and edits studies",
  reviewer: "compares, returns or signs",
  viewer: "reads signed summaries",
} as const;

/** The three project roles as <option>s; `withDuties` adds what each role may do. */
export function RoleOptions({ withDuties = false }: { withDuties?: boolean }) {
  return PROJECT_ROLES.map((role) => (
    <option key={role} value={role}>
      {withDuties ? `${roleLabel(role)} — ${ROLE_DUTIES[role]}` : roleLabel(role)}
    </option>
  ));
}
