import { Link } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { formatDate } from "@/lib/format";
import { useProjects } from "@/features/projects/api/get-projects";
import { ProjectRoleBadge } from "@/features/projects/components/project-role-badge";

/** Every project the caller can open, one dense row each. */
export function ProjectsTable({ isAdmin }: { isAdmin: boolean }) {
  const projects = useProjects();

  if (projects.isPending) {
    return (
      <Card title={isAdmin ? "All projects" : "Your projects"}>
        <LoadingBlock label="Loading projects…" />
      </Card>
    );
  }

  if (projects.isError) {
    const error = projects.error;
    return (
      <ErrorPanel
        title="Projects could not be loaded"
        message={error.message}
        code={error instanceof ApiError ? error.code : undefined}
        onRetry={() => void projects.refetch()}
        isRetrying={projects.isFetching}
      />
    );
  }

  const rows = projects.data;
  return (
    <Card
      title={isAdmin ? "All projects" : "Your projects"}
      subtitle={`${rows.length} ${rows.length === 1 ? "project" : "projects"}`}
      flush
    >
      {rows.length === 0 ? (
        <p className="px-4 py-6 text-ink-700">
          You are not a member of any project yet. An administrator adds members to a project.
        </p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left text-[0.95rem]">
            <thead>
              <tr className="border-b border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
                <th scope="col" className="px-4 py-2 font-semibold">Project</th>
                <th scope="col" className="px-4 py-2 font-semibold">Description</th>
                <th scope="col" className="px-4 py-2 font-semibold whitespace-nowrap">Your role</th>
                <th scope="col" className="px-4 py-2 font-semibold">Created</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((project) => (
                <tr key={project.id} className="border-b border-ink-100 last:border-b-0 hover:bg-tide-50/60">
                  <th scope="row" className="px-4 py-2 align-top font-semibold">
                    <Link
                      to={paths.app.project.getHref(project.id)}
                      className="text-tide-700 underline-offset-2 hover:underline"
                    >
                      {project.name}
                    </Link>
                  </th>
                  <td className="max-w-xl px-4 py-2 align-top text-ink-700">
                    <span className="line-clamp-2">{project.description || "—"}</span>
                  </td>
                  <td className="px-4 py-2 align-top">
                    <ProjectRoleBadge role={project.role} isAdmin={isAdmin} />
                  </td>
                  <td className="num px-4 py-2 align-top whitespace-nowrap text-ink-700">
                    <time dateTime={project.createdAt}>{formatDate(project.createdAt)}</time>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}
