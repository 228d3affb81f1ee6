import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { ApiError } from "@/lib/api-client";
import { useDeleteProject } from "@/features/admin/api/delete-project";

/**
 * Deleting a project, in two steps. Only a project without work can go: the server refuses (409) one with deck
 * alternatives, whose study revisions are kept for good, and its message says what the project holds.
 */
export function DeleteProjectPanel({ projectId, projectName, onDeleted }: { projectId: string; projectName: string; onDeleted: () => void }) {
  const [confirming, setConfirming] = useState(false);
  const remove = useDeleteProject({ onSuccess: onDeleted });
  const refused = remove.error instanceof ApiError && remove.error.status === 409;

  return (
    <section aria-label="Delete the project" className="space-y-2">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="max-w-prose text-sm text-ink-700">
          A project can be deleted only while it has no deck alternatives, data sets or studies.
        </p>
        {confirming ? (
          <span className="flex items-center gap-1.5">
            <Button variant="danger" size="sm" isLoading={remove.isPending} onClick={() => remove.mutate(projectId, { onError: () => setConfirming(false) })}>
              Delete {projectName}
            </Button>
            <Button variant="ghost" size="sm" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
          </span>
        ) : (
          <Button variant="secondary" size="sm" onClick={() => { remove.reset(); setConfirming(true); }}>
            Delete project…
          </Button>
        )}
      </div>
      {remove.isError ? (
        <ErrorPanel
          title={refused ? "This project keeps its work" : "The project was not deleted"}
          message={remove.error.message}
          code={remove.error instanceof ApiError ? remove.error.code : undefined}
        />
      ) : null}
    </section>
  );
}
