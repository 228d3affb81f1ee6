import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { projectRoleSchema } from "@shared/schemas/auth";
import type { AdminUser } from "@shared/schemas/users";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { SelectField } from "@/components/ui/select-field";
import { ApiError } from "@/lib/api-client";
import { useSetMember } from "@/features/admin/api/set-member";
import { RoleOptions } from "@/features/admin/components/role-options";

const addMemberSchema = z.object({
  userId: z.string().min(1, "choose a person"),
  role: projectRoleSchema,
});
type AddMemberValues = z.infer<typeof addMemberSchema>;

/** Adds an existing account to the project with a role. `candidates`: the accounts not yet members. */
export function AddMemberForm({ projectId, candidates }: { projectId: string; candidates: AdminUser[] }) {
  const setMember = useSetMember();
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors },
  } = useForm<AddMemberValues>({
    resolver: zodResolver(addMemberSchema),
    defaultValues: { userId: "", role: "viewer" },
  });

  const onSubmit = handleSubmit((values) =>
    setMember.mutate({ projectId, ...values }, { onSuccess: () => reset({ userId: "", role: values.role }) }),
  );

  return (
    <form noValidate aria-label="Add a member" className="space-y-2" onSubmit={onSubmit}>
      <h3 className="text-sm font-semibold tracking-wide text-ink-600 uppercase">Add a member</h3>
      {setMember.isError ? (
        <ErrorPanel
          title="The member was not added"
          message={setMember.error.message}
          code={setMember.error instanceof ApiError ? setMember.error.code : undefined}
        />
      ) : null}
      {candidates.length === 0 ? (
        <p className="text-sm text-ink-600">Every account is already a member of this project.</p>
      ) : (
        <div className="grid items-start gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto]">
          <SelectField label="Person" error={errors.userId?.message} {...register("userId")}>
            <option value="">Choose an account…</option>
            {candidates.map((user) => (
              <option key={user.id} value={user.id}>
                {user.name} ({user.email})
              </option>
            ))}
          </SelectField>
          <SelectField label="Role" error={errors.role?.message} {...register("role")}>
            <RoleOptions withDuties />
          </SelectField>
          <Button type="submit" variant="accent" className="sm:mt-6" isLoading={setMember.isPending}>
            Add member
          </Button>
        </div>
      )}
    </form>
  );
}
