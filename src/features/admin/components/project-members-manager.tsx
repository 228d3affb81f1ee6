import { useState } from "react";
import type { ProjectRole } from "@shared/schemas/auth";
import type { AdminUser } from "@shared/schemas/users";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock, Spinner } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { useUsers } from "@/features/admin/api/get-users";
import { useRemoveMember } from "@/features/admin/api/remove-member";
import { useSetMember } from "@/features/admin/api/set-member";
import { AddMemberForm } from "@/features/admin/components/add-member-form";
import { InviteForm } from "@/features/admin/components/invite-form";
import { RoleOptions } from "@/features/admin/components/role-options";

interface Member {
  user: AdminUser;
  role: ProjectRole;
}

/** The project's members from the accounts list (one request serves the whole administration page). */
function splitAccounts(users: AdminUser[], projectId: string): { members: Member[]; others: AdminUser[] } {
  const members: Member[] = [];
  const others: AdminUser[] = [];
  for (const user of users) {
    const membership = user.memberships.find((m) => m.projectId === projectId);
    if (membership) members.push({ user, role: membership.role });
    else others.push(user);
  }
  return { members, others };
}

/** Administrators add accounts to a project, change their role, and remove them. */
export function ProjectMembersManager({ projectId, projectName, className }: { projectId: string; projectName: string; className?: string }) {
  const users = useUsers();
  const setMember = useSetMember();
  const removeMember = useRemoveMember();
  const [confirming, setConfirming] = useState<string | null>(null);

  const title = `Members of ${projectName}`;
  if (users.isPending) {
    return (
      <Card title={title} className={className}>
        <LoadingBlock label="Loading the accounts…" />
      </Card>
    );
  }
  if (users.isError) {
    return (
      <Card title={title} className={className}>
        <ErrorPanel
          title="Accounts could not be loaded"
          message={users.error.message}
          code={users.error instanceof ApiError ? users.error.code : undefined}
          onRetry={() => void users.refetch()}
          isRetrying={users.isFetching}
        />
      </Card>
    );
  }

  const { members, others } = splitAccounts(users.data, projectId);
  const failed = setMember.isError && setMember.variables?.projectId === projectId ? setMember.error : removeMember.error;
  const busyUserId = (setMember.isPending && setMember.variables.userId) || (removeMember.isPending && removeMember.variables.userId);

  return (
    <Card title={title} subtitle={`${members.length} ${members.length === 1 ? "member" : "members"}`} className={className} flush>
      {failed ? (
        <div className="px-4 pt-3">
          <ErrorPanel
            title="The membership was not changed"
            message={failed.message}
            code={failed instanceof ApiError ? failed.code : undefined}
          />
        </div>
      ) : null}
      {members.length === 0 ? (
        <p className="px-4 py-4 text-ink-700">No members yet. Add the analysts, reviewers and viewers below.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left text-[0.95rem]" aria-label={`Members of ${projectName}`}>
            <thead>
              <tr className="border-b border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
                <th scope="col" className="px-4 py-2 font-semibold">Name</th>
                <th scope="col" className="px-4 py-2 font-semibold">E-mail</th>
                <th scope="col" className="px-4 py-2 font-semibold">Role</th>
                <th scope="col" className="px-4 py-2 font-semibold"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {members.map(({ user, role }) => {
                const busy = busyUserId === user.id;
                return (
                  <tr key={user.id} className="border-b border-ink-100 last:border-b-0">
                    <th scope="row" className="px-4 py-1.5 align-middle font-semibold">{user.name}</th>
                    <td className="px-4 py-1.5 align-middle text-ink-700">{user.email}</td>
                    <td className="px-4 py-1.5 align-middle">
                      <span className="flex items-center gap-2">
                        <select
                          aria-label={`Role of ${user.name}`}
                          value={role}
                          disabled={busy}
                          onChange={(e) =>
                            setMember.mutate({ projectId, userId: user.id, role: e.target.value as ProjectRole })
                          }
                          className="h-8 rounded-md border border-ink-300 bg-white px-1.5 text-sm hover:border-ink-400 disabled:bg-ink-50"
                        >
                          <RoleOptions />
                        </select>
                        {busy ? <Spinner size="sm" label="Saving" /> : null}
                      </span>
                    </td>
                    <td className="px-4 py-1.5 text-right align-middle whitespace-nowrap">
                      {confirming === user.id ? (
                        <span className="inline-flex items-center gap-1.5">
                          <Button
                            size="sm"
                            variant="danger"
                            isLoading={busy && removeMember.isPending}
                            onClick={() =>
                              removeMember.mutate(
                                { projectId, userId: user.id },
                                { onSettled: () => setConfirming(null) },
                              )
                            }
                          >
                            Remove {user.name}
                          </Button>
                          <Button size="sm" variant="ghost" onClick={() => setConfirming(null)}>
                            Keep
                          </Button>
                        </span>
                      ) : (
                        <Button
                          size="sm"
                          variant="secondary"
                          aria-label={`Remove ${user.name} from the project`}
                          onClick={() => setConfirming(user.id)}
                        >
                          Remove…
                        </Button>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      <div className="border-t border-ink-100 px-4 py-3">
        <AddMemberForm projectId={projectId} candidates={others} />
      </div>
      <div className="border-t border-ink-100 px-4 py-3">
        <InviteForm projectId={projectId} />
      </div>
    </Card>
  );
}
