import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { projectCreateSchema, type ProjectCreateInput } from "@shared/schemas/projects";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field } from "@/components/ui/field";
import { TextAreaField } from "@/components/ui/textarea-field";
import { ApiError } from "@/lib/api-client";
import type { Project } from "@/types/api";
import { useCreateProject } from "@/features/admin/api/create-project";

/** A new project (a crossing) with its name and optional texts; members are added next. */
export function CreateProjectForm({ onCreated }: { onCreated: (project: Project) => void }) {
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors },
  } = useForm<ProjectCreateInput>({
    resolver: zodResolver(projectCreateSchema),
    defaultValues: { name: "", description: "", siteNotes: "" },
  });
  const create = useCreateProject({
    onSuccess: (project) => {
      reset();
      onCreated(project);
    },
  });

  return (
    <Card title="New project" subtitle="One crossing or deck design job; you add its members next">
      <form
        noValidate
        aria-label="New project"
        className="space-y-3"
        onSubmit={handleSubmit((values) => create.mutate(values))}
      >
        {create.isError ? (
          <ErrorPanel
            title="The project was not created"
            message={create.error.message}
            code={create.error instanceof ApiError ? create.error.code : undefined}
          />
        ) : null}
        <Field label="Name" autoComplete="off" error={errors.name?.message} {...register("name")} />
        <TextAreaField
          label="Description"
          hint="Optional: the crossing, the span, the design stage."
          error={errors.description?.message}
          {...register("description")}
        />
        <TextAreaField
          label="Site notes"
          hint="Optional: terrain, exposure, deck height; analysts can edit them later."
          error={errors.siteNotes?.message}
          {...register("siteNotes")}
        />
        <Button type="submit" variant="primary" isLoading={create.isPending}>
          Create project
        </Button>
      </form>
    </Card>
  );
}
