import { Link } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { LoadingBlock } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { formatDate } from "@/lib/format";
import { useProject } from "@/features/projects/api/get-project";
import { ProjectRoleBadge } from "@/features/projects/components/project-role-badge";

const backLink = (
  <Link to={paths.app.projects.getHref()} className="text-tide-700 hover:underline">
    ← Projects
  </Link>
);

/** The project's identity and site notes; alternatives, studies and data sets are added beside them. */
export function ProjectOverview({ projectId, isAdmin }: { projectId: string; isAdmin: boolean }) {
  const project = useProject(projectId);

  if (project.isPending) {
    return (
      <>
        <PageHeader eyebrow={backLink} title="Project" />
        <LoadingBlock label="Loading the project…" />
      </>
    );
  }

  if (project.isError) {
    const error = project.error;
    const notFound = error instanceof ApiError && (error.status === 404 || error.status === 403);
    return (
      <>
        <PageHeader eyebrow={backLink} title="Project" />
        <ErrorPanel
          title={notFound ? "Project not available" : "The project could not be loaded"}
          message={
            notFound ? "This project does not exist, or you are not a member of it." : error.message
          }
          code={error instanceof ApiError ? error.code : undefined}
          onRetry={notFound ? undefined : () => void project.refetch()}
          isRetrying={project.isFetching}
        />
      </>
    );
  }

  const { name, description, siteNotes, role, createdAt } = project.data;
  return (
    <>
      <PageHeader
        eyebrow={backLink}
        title={name}
        description={description || undefined}
        actions={
          <span className="flex items-center gap-2 text-sm text-ink-700">
            Your role <ProjectRoleBadge role={role} isAdmin={isAdmin} />
          </span>
        }
      />
      <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(16rem,1fr)]">
        <Card title="Site notes">
          {siteNotes ? (
            <p className="max-w-prose whitespace-pre-line text-ink-800">{siteNotes}</p>
          ) : (
            <p className="text-ink-600">No site notes recorded.</p>
          )}
        </Card>
        <Card title="Project record">
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-[0.95rem]">
            <dt className="text-ink-600">Created</dt>
            <dd className="num">
              <time dateTime={createdAt}>{formatDate(createdAt)}</time>
            </dd>
            <dt className="text-ink-600">Your role</dt>
            <dd>
              <ProjectRoleBadge role={role} isAdmin={isAdmin} />
            </dd>
            <dt className="text-ink-600">Identifier</dt>
            <dd className="truncate font-mono text-xs leading-6 text-ink-700" title={projectId}>
              {projectId}
            </dd>
          </dl>
        </Card>
      </div>
    </>
  );
}
