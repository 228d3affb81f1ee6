import type { InputHTMLAttributes, ReactNode, Ref } from "react";
import { FieldFrame } from "@/components/ui/field-frame";
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
  return (
    // min-w-0: in a grid or flex row an input's intrinsic width (about 20 characters) would otherwise hold the
    // column open and push the form past a phone's screen.
    <FieldFrame label={label} hint={hint} error={error} className={cn("min-w-0", containerClassName)}>
      {(control) => (
        <div className="relative">
          <input
            {...control}
            ref={ref}
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
      )}
    </FieldFrame>
  );
}
