import { useId, type ReactNode } from "react";
import { cn } from "@/lib/cn";

/** What a form control needs to be tied to its label, hint and error. Spread it onto the control. */
export interface FieldControlProps {
  id: string;
  "aria-invalid": true | undefined;
  "aria-describedby": string | undefined;
}

export interface FieldFrameProps {
  label: ReactNode;
  hint?: ReactNode;
  /** The validation message; marks the control invalid and is announced with it. */
  error?: string;
  className?: string;
  /** Renders the control (input, select, text area) with the ids and aria attributes it is given. */
  children: (control: FieldControlProps) => ReactNode;
}

/**
 * The label above a form control and its hint and error below it, with the ids that tie them together
 * (htmlFor, aria-describedby, aria-invalid), so a screen reader reads the label, the value and what is wrong.
 * `Field`, `SelectField` and `TextAreaField` differ only in the control they put inside.
 */
export function FieldFrame({ label, hint, error, className, children }: FieldFrameProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={cn("space-y-1", className)}>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      {children({ id, "aria-invalid": error ? true : undefined, "aria-describedby": describedBy })}
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
