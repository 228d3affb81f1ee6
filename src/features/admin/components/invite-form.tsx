import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { projectRoleSchema } from "@shared/schemas/auth";
import { createInvitationSchema } from "@shared/schemas/invitations";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field } from "@/components/ui/field";
import { SelectField } from "@/components/ui/select-field";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { useInviteToProject } from "@/features/admin/api/invite-to-project";
import { RoleOptions } from "@/features/admin/components/role-options";

/** The form's fields: as the API's, except that an empty name means "none given". */
const inviteFormSchema = z.object({
  email: createInvitationSchema.shape.email,
  name: z.string().trim().max(200, "must have at most 200 characters"),
  role: projectRoleSchema,
});
type InviteFormValues = z.infer<typeof inviteFormSchema>;

/** Invites someone without an account: the server e-mails a one-time link (it works once, for 72 hours). */
export function InviteForm({ projectId }: { projectId: string }) {
  const invite = useInviteToProject();
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors },
  } = useForm<InviteFormValues>({
    resolver: zodResolver(inviteFormSchema),
    defaultValues: { email: "", name: "", role: "viewer" },
  });

  const onSubmit = handleSubmit(({ email, name, role }) =>
    invite.mutate(
      { projectId, input: { email, role, ...(name ? { name } : {}) } },
      { onSuccess: () => reset({ email: "", name: "", role }) },
    ),
  );

  return (
    <form noValidate aria-label="Invite by e-mail" className="space-y-2" onSubmit={onSubmit}>
      <h3 className="text-sm font-semibold tracking-wide text-ink-600 uppercase">Invite by e-mail</h3>
      {invite.isError ? (
        <ErrorPanel
          title="The invitation was not sent"
          message={invite.error.message}
          code={invite.error instanceof ApiError ? invite.error.code : undefined}
        />
      ) : null}
      {invite.isSuccess ? (
        <p role="status" className="rounded-md border border-steady-100 bg-steady-100/60 px-3 py-2 text-sm text-steady-700">
          Invitation sent to <strong>{invite.data.email}</strong>. The link works once, until{" "}
          {formatDateTime(invite.data.expiresAt)}.
        </p>
      ) : null}
      <div className="grid items-start gap-3 sm:grid-cols-2">
        <Field label="E-mail" type="email" autoComplete="off" spellCheck={false} error={errors.email?.message} {...register("email")} />
        <Field label="Name" hint="Optional; they can change it." autoComplete="off" error={errors.name?.message} {...register("name")} />
        <SelectField label="Role" error={errors.role?.message} {...register("role")}>
          <RoleOptions withDuties />
        </SelectField>
        <Button type="submit" variant="secondary" className="sm:mt-6 sm:justify-self-start" isLoading={invite.isPending}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}
