import { RoleBadge } from "@/components/ui/role-badge";
import { roleLabel } from "@/lib/authorization";
import type { ProjectRole } from "@/types/api";

export function ProjectRoleBadge({ role, isAdmin }: { role: ProjectRole | null; isAdmin: boolean }) {
  return <RoleBadge tone={role ?? (isAdmin ? "admin" : "viewer")}>{roleLabel(role, isAdmin)}</RoleBadge>;
}
