import { Link } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { useProjectMembers } from "@/features/projects/api/get-project-members";
import { ProjectRoleBadge } from "@/features/projects/components/project-role-badge";

/** Who works on the project and in which role (shown to administrators). */
export function ProjectMembers({ projectId }: { projectId: string }) {
  const members = useProjectMembers(projectId);
  return (
    <Card
      title="Members"
      subtitle={members.data ? `${members.data.length} people` : undefined}
      actions={
        <Link to={paths.app.admin.getHref(projectId)} className="text-sm text-tide-700 hover:underline">
          Manage members and invitations
        </Link>
      }
      className="mt-4"
      flush
    >
      {members.isPending ? (
        <LoadingBlock label="Loading the members…" />
      ) : members.isError ? (
        <div className="p-3">
          <ErrorPanel title="Members could not be loaded" message={members.error.message}
            code={members.error instanceof ApiError ? members.error.code : undefined}
            onRetry={() => void members.refetch()} isRetrying={members.isFetching} />
        </div>
      ) : (
        <table className="w-full text-left text-sm" aria-label="Project members">
          <tbody>
            {members.data.map((m) => (
              <tr key={m.userId} className="border-b border-ink-100 last:border-b-0">
                <th scope="row" className="px-4 py-1.5 font-semibold">{m.name}</th>
                <td className="px-2 py-1.5 text-ink-700">{m.email}</td>
                <td className="px-4 py-1.5 text-right"><ProjectRoleBadge role={m.role} isAdmin={false} /></td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Card>
  );
}
