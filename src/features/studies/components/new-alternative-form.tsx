import { useId, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/lib/api-client";
import { useCreateAlternative } from "@/features/studies/api/create-alternative";
import { DECK_DEPTH_LIMITS_M, DECK_WIDTH_LIMITS_M } from "@shared/schemas/study";

/** The form's own names for the API's fields, so a refusal names the field the analyst sees. */
const FIELD_NAMES: Record<string, string> = {
  name: "Name",
  description: "Description",
  deckWidthM: "Deck width B",
  deckDepthM: "Deck depth D",
};

/** Adds a deck alternative to the project: its name, description and the deck's width and depth. */
export function NewAlternativeForm({ projectId }: { projectId: string }) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const create = useCreateAlternative(projectId);

  if (!open) return <Button size="sm" variant="secondary" onClick={() => setOpen(true)}>New alternative…</Button>;

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    create.mutate(
      {
        name: String(data.get("name") ?? ""),
        description: String(data.get("description") ?? ""),
        deckWidthM: Number(data.get("width")),
        deckDepthM: Number(data.get("depth")),
      },
      { onSuccess: () => setOpen(false) },
    );
  };
  const details = create.error instanceof ApiError && Array.isArray(create.error.details)
    ? (create.error.details as Array<{ path?: string; message?: string }>)
    : [];
  const input = "h-8 w-full rounded-md border border-ink-300 bg-white px-2 text-sm hover:border-ink-400";
  return (
    <form onSubmit={submit} aria-label="New deck alternative" className="w-full space-y-2 rounded-lg border border-ink-200 bg-surface p-3 text-sm shadow-panel">
      <div className="grid gap-2 sm:grid-cols-[minmax(0,2fr)_8rem_8rem]">
        <div className="space-y-0.5">
          <label htmlFor={`${id}-name`} className="block text-xs font-semibold text-ink-700">Name</label>
          <input id={`${id}-name`} name="name" required maxLength={200} className={input} placeholder="e.g. C — twin box, wider gap" />
        </div>
        <div className="space-y-0.5">
          <label htmlFor={`${id}-width`} className="block text-xs font-semibold text-ink-700">Deck width B (m)</label>
          <input id={`${id}-width`} name="width" type="number" required min={DECK_WIDTH_LIMITS_M.min} max={DECK_WIDTH_LIMITS_M.max} step="any" className={input} />
        </div>
        <div className="space-y-0.5">
          <label htmlFor={`${id}-depth`} className="block text-xs font-semibold text-ink-700">Deck depth D (m)</label>
          <input id={`${id}-depth`} name="depth" type="number" required min={DECK_DEPTH_LIMITS_M.min} max={DECK_DEPTH_LIMITS_M.max} step="any" className={input} />
        </div>
      </div>
      <div className="space-y-0.5">
        <label htmlFor={`${id}-description`} className="block text-xs font-semibold text-ink-700">Description</label>
        <input id={`${id}-description`} name="description" maxLength={5000} className={input} />
      </div>
      {create.isError ? (
        <div role="alert" className="font-semibold text-signal-700">
          {details.length ? (
            <>
              <p>The alternative was not added:</p>
              <ul className="list-disc pl-5">
                {details.map((d, i) => (
                  <li key={i}>{`${FIELD_NAMES[d.path ?? ""] ?? d.path ?? ""}: ${d.message ?? ""}`}</li>
                ))}
              </ul>
            </>
          ) : (
            <p>{create.error.message}</p>
          )}
        </div>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" size="sm" isLoading={create.isPending}>Add alternative</Button>
        <Button size="sm" variant="ghost" onClick={() => setOpen(false)}>Cancel</Button>
      </div>
    </form>
  );
}
