import { useId, useState, type FormEvent } from "react";
import { uploadIssueSchema, type DatasetMetaInput } from "@shared/schemas/datasets";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/lib/api-client";
import { useUploadDataset } from "@/features/studies/api/upload-dataset";
import { SelectField } from "@/features/studies/components/select-field";

type Kind = DatasetMetaInput["kind"];

function issuesOf(error: unknown) {
  if (!(error instanceof ApiError) || !Array.isArray(error.details)) return [];
  return error.details.flatMap((d) => {
    const parsed = uploadIssueSchema.safeParse(d);
    return parsed.success ? [parsed.data] : [];
  });
}

/**
 * Upload of a section-model test file for one deck alternative: flutter derivatives in their delivered
 * convention, or static coefficients with their drag reference, with where and how they were measured. Every
 * problem the server finds in the file is listed with its line and column; nothing is stored then.
 */
export function DatasetUpload({ alternativeId, projectId }: { alternativeId: string; projectId: string }) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [kind, setKind] = useState<Kind>("flutter-derivatives");
  const [abscissa, setAbscissa] = useState<"Ur" | "Ur-half" | "K" | "k-half">("Ur");
  const [normalisation, setNormalisation] = useState<"B" | "2B">("B");
  const [sign, setSign] = useState<"h-down" | "h-up">("h-down");
  const [dragReference, setDragReference] = useState<"B" | "D">("B");
  const [flow, setFlow] = useState<"smooth" | "turbulent">("smooth");
  const upload = useUploadDataset(alternativeId, projectId);
  const issues = issuesOf(upload.error);

  if (!open) {
    return <Button size="sm" variant="ghost" onClick={() => setOpen(true)}>Upload a data set…</Button>;
  }

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const file = data.get("file");
    if (!(file instanceof File) || file.size === 0) return;
    const provenance = {
      flow,
      facility: String(data.get("facility") ?? ""),
      modelScale: data.get("modelScale") ? Number(data.get("modelScale")) : null,
      notes: String(data.get("notes") ?? ""),
    };
    const name = String(data.get("name") ?? "").trim() || file.name;
    const angleText = String(data.get("meanAngleDeg") ?? "").trim();
    const meanAngleDeg = angleText === "" ? 0 : Number(angleText);
    const meta: DatasetMetaInput =
      kind === "flutter-derivatives"
        ? { kind, name, meanAngleDeg, provenance, convention: { abscissa, normalisation, sign } }
        : { kind, name, meanAngleDeg, provenance, dragReference };
    upload.mutate({ file, meta }, { onSuccess: () => setOpen(false) });
  };

  const input = "h-7 w-full rounded-md border border-ink-300 bg-white px-2 text-sm hover:border-ink-400";
  return (
    <form onSubmit={submit} aria-label="Upload a data set" className="mt-2 space-y-2 rounded-md border border-ink-200 bg-white p-3 text-sm">
      <div className="grid gap-2 sm:grid-cols-2">
        <div className="space-y-0.5">
          <label htmlFor={`${id}-file`} className="block text-xs font-semibold text-ink-700">CSV file (≤ 1 MB)</label>
          <input id={`${id}-file`} name="file" type="file" accept=".csv,text/csv,text/plain" required className="block w-full text-sm" />
        </div>
        <div className="space-y-0.5">
          <label htmlFor={`${id}-name`} className="block text-xs font-semibold text-ink-700">Name</label>
          <input id={`${id}-name`} name="name" maxLength={200} placeholder="e.g. Section model 1:60, smooth flow, 0°" className={input} />
        </div>
      </div>
      <div className="flex flex-wrap items-end gap-2">
        <SelectField label="Contents" value={kind} onChange={(v) => setKind(v as Kind)}
          options={[["flutter-derivatives", "Flutter derivatives"], ["static-coefficients", "Static coefficients"]]} />
        {kind === "flutter-derivatives" ? (
          <>
            <SelectField label="Abscissa" value={abscissa} onChange={(v) => setAbscissa(v as typeof abscissa)}
              options={[["Ur", "Ur = U/(fB)"], ["Ur-half", "U/(fb), b = B/2"], ["K", "K = Bω/U"], ["k-half", "k = bω/U"]]} />
            <SelectField label="Forces on" value={normalisation} onChange={(v) => setNormalisation(v as typeof normalisation)}
              options={[["B", "B, B² (ours)"], ["2B", "2B, 2B² (half of ours)"]]} />
            <SelectField label="Heave and lift" value={sign} onChange={(v) => setSign(v as typeof sign)}
              options={[["h-down", "Downward (ours)"], ["h-up", "Upward"]]} />
          </>
        ) : (
          <SelectField label="Drag coefficient on" value={dragReference} onChange={(v) => setDragReference(v as typeof dragReference)}
            options={[["B", "Width B"], ["D", "Depth D"]]} />
        )}
        <SelectField label="Oncoming flow" value={flow} onChange={(v) => setFlow(v as typeof flow)}
          options={[["smooth", "Smooth"], ["turbulent", "Turbulent"]]} />
      </div>
      <div className="grid gap-2 sm:grid-cols-[minmax(0,2fr)_8rem_8rem]">
        <div className="space-y-0.5">
          <label htmlFor={`${id}-facility`} className="block text-xs font-semibold text-ink-700">Facility</label>
          <input id={`${id}-facility`} name="facility" maxLength={1000} className={input} />
        </div>
        <div className="space-y-0.5">
          <label htmlFor={`${id}-scale`} className="block text-xs font-semibold text-ink-700">Model scale 1 :</label>
          <input id={`${id}-scale`} name="modelScale" type="number" min="1" step="any" className={input} />
        </div>
        {kind === "flutter-derivatives" ? (
          <div className="space-y-0.5">
            {/* The flutter derivatives of a deck change with the mean angle of attack (0°, ±3°, ±5° are usual). */}
            <label htmlFor={`${id}-angle`} className="block text-xs font-semibold text-ink-700">Mean angle α₀ (°)</label>
            <input id={`${id}-angle`} name="meanAngleDeg" type="number" min="-90" max="90" step="any" defaultValue="0" title="Mean angle of attack of the tests, nose-up positive" className={input} />
          </div>
        ) : null}
      </div>
      <div className="space-y-0.5">
        <label htmlFor={`${id}-notes`} className="block text-xs font-semibold text-ink-700">Notes</label>
        <input id={`${id}-notes`} name="notes" maxLength={5000} className={input} />
      </div>
      {upload.isError ? (
        <div role="alert" className="rounded-md border-l-4 border-l-signal-600 bg-signal-50 px-3 py-1.5">
          <p className="font-semibold text-signal-700">{upload.error.message}</p>
          {issues.length > 1 ? (
            <ul className="mt-1 list-disc pl-5 text-ink-900">
              {issues.slice(0, 20).map((issue, i) => (
                <li key={i}>
                  {issue.row !== undefined ? `Line ${issue.row}` : "File"}
                  {issue.column ? `, ${issue.column}` : ""}: {issue.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" size="sm" isLoading={upload.isPending}>Upload and convert</Button>
        <Button size="sm" variant="ghost" onClick={() => { upload.reset(); setOpen(false); }}>Cancel</Button>
      </div>
    </form>
  );
}
