import { useState, type FormEvent } from "react";
import type { AdminUser } from "@shared/schemas/users";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { RoleBadge } from "@/components/ui/role-badge";
import { LoadingBlock } from "@/components/ui/spinner";
import { ApiError } from "@/lib/api-client";
import { roleLabel } from "@/lib/authorization";
import { formatDate } from "@/lib/format";
import { useUsers } from "@/features/admin/api/get-users";
import { useUpdateUser } from "@/features/admin/api/update-user";

/** Every account: its projects and roles, the administrator flag (not one's own to remove), renaming. */
export function UsersTable({ currentUserId, className }: { currentUserId: string; className?: string }) {
  const users = useUsers();
  const update = useUpdateUser();
  const [renaming, setRenaming] = useState<string | null>(null);

  if (users.isPending) {
    return (
      <Card title="Accounts" className={className}>
        <LoadingBlock label="Loading the accounts…" />
      </Card>
    );
  }
  if (users.isError) {
    return (
      <ErrorPanel
        className={className}
        title="Accounts could not be loaded"
        message={users.error.message}
        code={users.error instanceof ApiError ? users.error.code : undefined}
        onRetry={() => void users.refetch()}
        isRetrying={users.isFetching}
      />
    );
  }

  const rows = users.data;
  const busyId = update.isPending ? update.variables.userId : null;
  return (
    <Card title="Accounts" subtitle={`${rows.length} ${rows.length === 1 ? "account" : "accounts"}`} className={className} flush>
      {update.isError ? (
        <div className="px-4 pt-3">
          <ErrorPanel
            title="The account was not changed"
            message={update.error.message}
            code={update.error instanceof ApiError ? update.error.code : undefined}
          />
        </div>
      ) : null}
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left text-[0.95rem]" aria-label="Accounts">
          <thead>
            <tr className="border-b border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
              <th scope="col" className="px-4 py-2 font-semibold">Name</th>
              <th scope="col" className="px-4 py-2 font-semibold">E-mail</th>
              <th scope="col" className="px-4 py-2 font-semibold">Projects and roles</th>
              <th scope="col" className="px-4 py-2 font-semibold">Administrator</th>
              <th scope="col" className="px-4 py-2 font-semibold">Since</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((user) => (
              <UserRow
                key={user.id}
                user={user}
                isSelf={user.id === currentUserId}
                isBusy={busyId === user.id}
                isRenaming={renaming === user.id}
                onRename={(name) =>
                  update.mutate({ userId: user.id, patch: { name } }, { onSuccess: () => setRenaming(null) })
                }
                onStartRename={() => {
                  update.reset();
                  setRenaming(user.id);
                }}
                onCancelRename={() => setRenaming(null)}
                onSetAdmin={(isAdmin, done) => update.mutate({ userId: user.id, patch: { isAdmin } }, { onSuccess: done })}
              />
            ))}
          </tbody>
        </table>
      </div>
    </Card>
  );
}

interface UserRowProps {
  user: AdminUser;
  isSelf: boolean;
  isBusy: boolean;
  isRenaming: boolean;
  onRename: (name: string) => void;
  onStartRename: () => void;
  onCancelRename: () => void;
  /** Sets the flag; `done` runs once the change is saved. */
  onSetAdmin: (isAdmin: boolean, done: () => void) => void;
}

function UserRow({ user, isSelf, isBusy, isRenaming, onRename, onStartRename, onCancelRename, onSetAdmin }: UserRowProps) {
  const [confirmingFlag, setConfirmingFlag] = useState(false);
  const submitRename = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const name = String(new FormData(event.currentTarget).get("name") ?? "").trim();
    if (name && name !== user.name) onRename(name);
    else onCancelRename();
  };

  return (
    <tr className="border-b border-ink-100 align-top last:border-b-0">
      <th scope="row" className="px-4 py-2 font-semibold">
        {isRenaming ? (
          <form onSubmit={submitRename} className="flex items-center gap-1.5" aria-label={`Rename ${user.name}`}>
            <input
              name="name"
              defaultValue={user.name}
              aria-label="New name"
              autoFocus
              maxLength={200}
              className="h-8 w-44 rounded-md border border-ink-300 bg-white px-2 text-sm font-normal"
            />
            <Button type="submit" size="sm" isLoading={isBusy}>Save</Button>
            <Button size="sm" variant="ghost" onClick={onCancelRename}>Cancel</Button>
          </form>
        ) : (
          <span className="flex items-center gap-x-2 whitespace-nowrap">
            {user.name}
            {isSelf ? <span className="text-xs font-normal text-ink-600">(you)</span> : null}
            <button
              type="button"
              onClick={onStartRename}
              className="text-sm font-normal text-tide-700 hover:underline"
              aria-label={`Rename ${user.name}`}
            >
              Rename
            </button>
          </span>
        )}
      </th>
      <td className="px-4 py-2 text-ink-700">{user.email}</td>
      <td className="px-4 py-2">
        {user.memberships.length === 0 ? (
          <span className="text-sm text-ink-600">No project</span>
        ) : (
          <ul className="flex min-w-72 flex-wrap gap-x-3 gap-y-1 text-sm">
            {user.memberships.map((m) => (
              <li key={m.projectId} className="flex items-baseline gap-1.5">
                <span>{m.projectName}</span>
                <RoleBadge tone={m.role}>{roleLabel(m.role)}</RoleBadge>
              </li>
            ))}
          </ul>
        )}
      </td>
      <td className="px-4 py-2">
        <span className="flex flex-wrap items-center gap-x-2 gap-y-1">
          {user.isAdmin ? <RoleBadge tone="admin">Administrator</RoleBadge> : <span className="text-sm text-ink-600">No</span>}
          {user.isAdmin && isSelf ? (
            <span className="text-xs text-ink-600">another administrator can remove it</span>
          ) : confirmingFlag ? (
            <span className="flex items-center gap-1">
              <Button
                size="sm"
                variant={user.isAdmin ? "danger" : "accent"}
                isLoading={isBusy && !isRenaming}
                onClick={() => onSetAdmin(!user.isAdmin, () => setConfirmingFlag(false))}
              >
                {user.isAdmin ? `Remove ${user.name}'s flag` : `Make ${user.name} administrator`}
              </Button>
              <Button size="sm" variant="ghost" onClick={() => setConfirmingFlag(false)}>
                Cancel
              </Button>
            </span>
          ) : (
            <Button
              size="sm"
              variant="ghost"
              onClick={() => setConfirmingFlag(true)}
              aria-label={user.isAdmin ? `Remove the administrator flag of ${user.name}` : `Make ${user.name} an administrator`}
            >
              {user.isAdmin ? "Remove flag…" : "Make administrator…"}
            </Button>
          )}
        </span>
      </td>
      <td className="num px-4 py-2 whitespace-nowrap text-ink-700">
        <time dateTime={user.createdAt}>{formatDate(user.createdAt)}</time>
      </td>
    </tr>
  );
}
