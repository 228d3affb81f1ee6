import type { QueryClient } from "@tanstack/react-query";
import { useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/select-field";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { canAdminister } from "@/lib/authorization";
import { useMe } from "@/features/auth/api/get-me";
import { getProjectsQueryOptions, useProjects } from "@/features/projects/api/get-projects";
import { getUsersQueryOptions } from "@/features/admin/api/get-users";
import { CreateProjectForm } from "@/features/admin/components/create-project-form";
import { DeleteProjectPanel } from "@/features/admin/components/delete-project-panel";
import { ProjectMembersManager } from "@/features/admin/components/project-members-manager";
import { UsersTable } from "@/features/admin/components/users-table";
import { requireAccess } from "@/app/routes/guards";

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireAccess(queryClient, request, canAdminister);
    void queryClient.prefetchQuery(getProjectsQueryOptions());
    void queryClient.prefetchQuery(getUsersQueryOptions());
    return null;
  };

/** Administration: projects and their members (`?project=<id>` picks the project), new projects, accounts. */
export function AdminRoute() {
  const me = useMe();
  const projects = useProjects();
  const [searchParams, setSearchParams] = useSearchParams();
  const selectProject = (projectId: string | null) =>
    setSearchParams(projectId ? { project: projectId } : {}, { replace: true });

  const list = projects.data ?? [];
  const selected = list.find((p) => p.id === searchParams.get("project")) ?? list[0];

  return (
    <>
      <PageHeader
        title="Administration"
        description="Projects and who works on them, and the accounts that sign in to Stillspan."
      />
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(18rem,1fr)]">
        <div className="space-y-4">
          <Card title="Project" subtitle="Choose the project whose members you manage">
            {projects.isPending ? (
              <LoadingBlock label="Loading projects…" className="min-h-16" />
            ) : projects.isError ? (
              <ErrorPanel
                title="Projects could not be loaded"
                message={projects.error.message}
                code={projects.error instanceof ApiError ? projects.error.code : undefined}
                onRetry={() => void projects.refetch()}
                isRetrying={projects.isFetching}
              />
            ) : !selected ? (
              <p className="text-ink-700">There is no project yet. Create the first one with the form.</p>
            ) : (
              <div className="space-y-3">
                <SelectField
                  label="Project"
                  value={selected.id}
                  onChange={(e) => selectProject(e.target.value)}
                  containerClassName="max-w-xl"
                >
                  {list.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}
                    </option>
                  ))}
                </SelectField>
                <div className="border-t border-ink-100 pt-3">
                  <DeleteProjectPanel
                    key={selected.id}
                    projectId={selected.id}
                    projectName={selected.name}
                    onDeleted={() => selectProject(null)}
                  />
                </div>
              </div>
            )}
          </Card>
          {selected ? (
            <ProjectMembersManager key={selected.id} projectId={selected.id} projectName={selected.name} />
          ) : null}
        </div>
        <CreateProjectForm onCreated={(project) => selectProject(project.id)} />
      </div>
      <UsersTable className="mt-4" currentUserId={me.data?.id ?? ""} />
    </>
  );
}
