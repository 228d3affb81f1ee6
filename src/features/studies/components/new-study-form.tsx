import { useQueryClient } from "@tanstack/react-query";
import { useId, useState, type FormEvent } from "react";
import { useNavigate } from "react-router-dom";
import type { AlternativeDto } from "@shared/schemas/alternatives";
import type { ComparisonRow } from "@shared/schemas/comparison";
import type { StudyDocument } from "@shared/schemas/study";
import { Button } from "@/components/ui/button";
import { paths } from "@/config/paths";
import { useCreateStudy } from "@/features/studies/api/create-study";
import { getRevisionQueryOptions } from "@/features/studies/api/get-revision";
import { SelectField } from "@/features/studies/components/select-field";
import { studyTemplate } from "@/features/studies/utils/study-template";

/**
 * A new study of one deck alternative, started from the latest revision of one of its studies (the usual way:
 * a variant of an existing model) or from a placeholder template; it opens in the workspace once created.
 */
export function NewStudyForm({ projectId, alternative, studies }: { projectId: string; alternative: AlternativeDto; studies: readonly ComparisonRow[] }) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const copyable = studies.filter((s) => s.latest);
  const [source, setSource] = useState(copyable[0]?.latest?.revisionId ?? "template");
  const [failure, setFailure] = useState<string | null>(null);
  const create = useCreateStudy(alternative.id, projectId);
  const queryClient = useQueryClient();
  const navigate = useNavigate();

  if (!open) {
    const start = () => {
      setSource(copyable[0]?.latest?.revisionId ?? "template");
      setOpen(true);
    };
    return <Button size="sm" variant="ghost" onClick={start}>New study…</Button>;
  }

  const submit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const name = String(data.get("name") ?? "").trim();
    if (!name) {
      setFailure("Study name: must not be blank.");
      return;
    }
    setFailure(null);
    let study: StudyDocument;
    try {
      study =
        source === "template"
          ? studyTemplate(name, alternative.deckWidthM, alternative.deckDepthM)
          : { ...(await queryClient.fetchQuery(getRevisionQueryOptions(source))).study, name };
    } catch (error) {
      setFailure(error instanceof Error ? error.message : String(error));
      return;
    }
    create.mutate(
      { name, purpose: String(data.get("purpose") ?? ""), study },
      { onSuccess: (created) => navigate(paths.app.study.getHref(projectId, created.id)) },
    );
  };

  const input = "h-7 w-full rounded-md border border-ink-300 bg-white px-2 text-sm hover:border-ink-400";
  return (
    <form onSubmit={(e) => void submit(e)} aria-label={`New study of ${alternative.name}`} className="mt-2 space-y-2 rounded-md border border-ink-200 bg-white p-3 text-sm">
      <div className="grid gap-2 sm:grid-cols-2">
        <div className="space-y-0.5">
          <label htmlFor={`${id}-name`} className="block text-xs font-semibold text-ink-700">Study name</label>
          <input id={`${id}-name`} name="name" required maxLength={200} className={input} placeholder="e.g. Erection stage, deck 60 % closed" />
        </div>
        <SelectField label="Start from" value={source} onChange={setSource}
          options={[
            ...copyable.map((s) => [s.latest!.revisionId, `${s.studyName}, r${s.latest!.number}`] as [string, string]),
            ["template", "Placeholder template (thin plate)"],
          ]} />
      </div>
      <div className="space-y-0.5">
        <label htmlFor={`${id}-purpose`} className="block text-xs font-semibold text-ink-700">Purpose</label>
        <input id={`${id}-purpose`} name="purpose" maxLength={5000} className={input} placeholder="The question this study answers" />
      </div>
      {source === "template" ? (
        <p className="text-xs text-caution-700">The template's mass, inertia, frequencies and damping are placeholders: replace them with the deck's own before relying on a result.</p>
      ) : null}
      {create.isError || failure ? <p role="alert" className="font-semibold text-signal-700">{failure ?? create.error?.message}</p> : null}
      <div className="flex gap-2">
        <Button type="submit" size="sm" isLoading={create.isPending}>Create and open</Button>
        <Button size="sm" variant="ghost" onClick={() => setOpen(false)}>Cancel</Button>
      </div>
    </form>
  );
}
