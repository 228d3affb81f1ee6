import type { ReactNode } from "react";
import type { UseFormRegisterReturn } from "react-hook-form";
import { Field } from "@/components/ui/field";

interface QuantityFieldProps {
  label: string;
  unit?: string;
  hint?: ReactNode;
  error?: string;
  /** react-hook-form registration (numbers are registered with valueAsNumber). */
  registration: UseFormRegisterReturn;
  /** Shown instead of an input when the screen is read-only. */
  readOnly: boolean;
  value: unknown;
  step?: string;
  className?: string;
}

/** A labelled number input with its unit, or — for reviewers — the value and unit as plain text. */
export function QuantityField({ label, unit, hint, error, registration, readOnly, value, step = "any", className }: QuantityFieldProps) {
  if (readOnly) {
    return (
      <div className={className}>
        <span className="block text-sm font-semibold text-ink-700">{label}</span>
        <span className="num block text-[0.95rem] text-ink-950">
          {typeof value === "number" || typeof value === "string" ? String(value) : "—"}
          {unit ? <span className="ml-1 text-sm text-ink-600">{unit}</span> : null}
        </span>
      </div>
    );
  }
  return (
    <Field
      label={label}
      unit={unit}
      hint={hint}
      error={error}
      type="number"
      inputMode="decimal"
      step={step}
      containerClassName={className}
      className="num h-8"
      {...registration}
    />
  );
}
