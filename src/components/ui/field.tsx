import { useId, type InputHTMLAttributes, type ReactNode, type Ref } from "react";
import { cn } from "@/lib/cn";

export interface FieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, "id"> {
  label: ReactNode;
  /** Unit shown at the right edge of the input (m/s, Hz, kg/m …). */
  unit?: ReactNode;
  hint?: ReactNode;
  /** The validation message; marks the input invalid and is announced with it. */
  error?: string;
  ref?: Ref<HTMLInputElement>;
  containerClassName?: string;
}

/**
 * A labelled input with its hint, unit and error tied to it (aria-describedby), so a screen reader reads the
 * label, the value, the unit and what is wrong. Works with react-hook-form's `register` (ref is a prop in React 19).
 */
export function Field({ label, unit, hint, error, className, containerClassName, ref, ...inputProps }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;

  return (
    // min-w-0: in a grid or flex row an input's intrinsic width (about 20 characters) would otherwise hold the
    // column open and push the form past a phone's screen.
    <div className={cn("min-w-0 space-y-1", containerClassName)}>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      <div className="relative">
        <input
          id={id}
          ref={ref}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={cn(
            "block h-9 w-full min-w-0 rounded-md border bg-white px-2.5 text-[0.95rem] text-ink-950 placeholder:text-ink-400",
            "transition-colors focus-visible:border-tide-600",
            error ? "border-signal-600" : "border-ink-300 hover:border-ink-400",
            unit ? "pr-14" : undefined,
            className,
          )}
          {...inputProps}
        />
        {unit ? (
          <span className="pointer-events-none absolute inset-y-0 right-2.5 flex items-center text-sm text-ink-600">
            {unit}
          </span>
        ) : null}
      </div>
      {hint ? (
        <p id={hintId} className="text-sm text-ink-600">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="text-sm font-semibold text-signal-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}
