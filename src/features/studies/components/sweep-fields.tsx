import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { MAX_SWEEP_STEPS, sweepStepCount, type StudyDocument } from "@shared/schemas/study";
import { QuantityField } from "@/features/studies/components/quantity-field";

interface SweepFieldsProps {
  register: UseFormRegister<StudyDocument>;
  values: Partial<StudyDocument>;
  errors: FieldErrors<StudyDocument>;
  readOnly: boolean;
  showKmh: boolean;
}

const kmh = (value: unknown) => (typeof value === "number" && Number.isFinite(value) ? `${(value * 3.6).toFixed(1)} km/h` : undefined);

export function SweepFields({ register, values, errors, readOnly, showKmh }: SweepFieldsProps) {
  const sweep = values.sweep;
  const num = { valueAsNumber: true } as const;
  const valid = sweep && [sweep.from, sweep.to, sweep.step].every((v) => typeof v === "number" && Number.isFinite(v)) && sweep.step > 0 && sweep.to > sweep.from
    && sweepStepCount(sweep) <= MAX_SWEEP_STEPS; // beyond it the Step field says why; no count beside the refusal
  return (
    <div className="space-y-2">
      <div className="grid grid-cols-3 gap-3">
        <QuantityField label="From" unit="m/s" readOnly={readOnly} value={sweep?.from} registration={register("sweep.from", num)}
          error={errors.sweep?.from?.message} hint={showKmh ? kmh(sweep?.from) : undefined} />
        <QuantityField label="To" unit="m/s" readOnly={readOnly} value={sweep?.to} registration={register("sweep.to", num)}
          error={errors.sweep?.to?.message} hint={showKmh ? kmh(sweep?.to) : undefined} />
        <QuantityField label="Step" unit="m/s" readOnly={readOnly} value={sweep?.step} registration={register("sweep.step", num)}
          error={errors.sweep?.step?.message} hint={showKmh ? kmh(sweep?.step) : undefined} />
      </div>
      <p className="num text-xs text-ink-600">
        {valid ? `${sweepStepCount(sweep)} intervals; the tracker refines locally where poles come close.` : "\u00a0"}
      </p>
    </div>
  );
}
