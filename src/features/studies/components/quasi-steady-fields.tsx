import { useId, useState } from "react";
import type { DatasetDto } from "@shared/schemas/datasets";
import type { StudyAerodynamics } from "@shared/schemas/study";
import { cn } from "@/lib/cn";
import { SelectField } from "@/features/studies/components/select-field";

/** Static coefficient slopes for the quasi-steady model, typed or taken from a static-coefficient data set. */
export function QuasiSteadyFields({ value, readOnly, onChange, staticSets }: {
  value: Extract<StudyAerodynamics, { model: "quasi-steady" }>; readOnly: boolean; onChange: (v: StudyAerodynamics) => void;
  staticSets: readonly DatasetDto[];
}) {
  const fields = [
    ["liftSlope", "Lift slope dC_L/dα", "1/rad"],
    ["dragCoefficient", "Drag coefficient C_D (on B)", "–"],
    ["momentSlope", "Moment slope dC_M/dα", "1/rad"],
  ] as const;
  // Filling from a data set replaces the typed texts: a new generation remounts the inputs.
  const [generation, setGeneration] = useState(0);
  const fill = (id: string) => {
    const slopes = staticSets.find((d) => d.id === id)?.slopes;
    if (slopes) {
      setGeneration((g) => g + 1);
      onChange({ model: "quasi-steady", liftSlope: slopes.liftSlopePerRad, dragCoefficient: Math.max(0, slopes.dragCoefficientOnB), momentSlope: slopes.momentSlopePerRad });
    }
  };
  return (
    <div className="space-y-2">
      {!readOnly && staticSets.length > 0 ? (
        <SelectField label="Fill from a static-coefficient data set (slopes at 0°)" value="" onChange={fill}
          options={[["", "Choose…"], ...staticSets.map((d) => [d.id, d.name] as [string, string])]} />
      ) : null}
      <div className="grid grid-cols-3 gap-2">
        {fields.map(([key, label, unit]) => (
          <NumberInput key={`${key}-${generation}`} label={label} unit={unit} value={value[key]} readOnly={readOnly}
            onChange={(n) => onChange({ ...value, [key]: n })} />
        ))}
      </div>
      <p className="rounded-md border-l-4 border-l-caution-400 bg-caution-100 px-3 py-1.5 text-sm text-caution-700">
        Quasi-steady derivatives carry no aerodynamic torsional damping (A2* = 0); flutter speeds from them can be far
        too low. Meant for galloping checks and high reduced velocities.
      </p>
    </div>
  );
}

function NumberInput({ label, unit, value, readOnly, onChange }: {
  label: string; unit: string; value: number; readOnly: boolean; onChange: (value: number) => void;
}) {
  const id = useId();
  const [text, setText] = useState(String(Number(value.toPrecision(6))));
  const parsed = Number(text);
  const invalid = text.trim() === "" || !Number.isFinite(parsed);
  if (readOnly) {
    return (
      <div>
        <span className="block text-sm font-semibold text-ink-700">{label}</span>
        <span className="num block">{text} <span className="text-sm text-ink-600">{unit}</span></span>
      </div>
    );
  }
  return (
    <div className="space-y-0.5">
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">{label}</label>
      <div className="relative">
        <input id={id} value={text} inputMode="decimal" aria-invalid={invalid || undefined}
          onChange={(e) => { setText(e.target.value); const n = Number(e.target.value); if (e.target.value.trim() !== "" && Number.isFinite(n)) onChange(n); }}
          className={cn("num h-8 w-full rounded-md border bg-white px-2 pr-10 text-right", invalid ? "border-signal-600" : "border-ink-300")} />
        <span className="pointer-events-none absolute inset-y-0 right-2 flex items-center text-xs text-ink-600">{unit}</span>
      </div>
      {invalid ? <p className="text-xs font-semibold text-signal-700">must be a number</p> : null}
    </div>
  );
}
