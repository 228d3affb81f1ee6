import { useId, type ReactNode, type Ref, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";
import { cn } from "@/lib/cn";

/** Select and multi-line text with the label, hint and error wiring of the shell's `Field`. */

interface ControlFrameProps {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
  children: (ids: { id: string; describedBy: string | undefined }) => ReactNode;
}

function ControlFrame({ label, hint, error, className, children }: ControlFrameProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={cn("space-y-1", className)}>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      {children({ id, describedBy })}
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

const controlClass = (error?: string) =>
  cn(
    "block w-full rounded-md border bg-white px-2.5 text-[0.95rem] text-ink-950 transition-colors focus-visible:border-tide-600",
    error ? "border-signal-600" : "border-ink-300 hover:border-ink-400",
  );

interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, "id"> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  ref?: Ref<HTMLSelectElement>;
  containerClassName?: string;
}

export function SelectField({ label, hint, error, ref, containerClassName, className, children, ...rest }: SelectFieldProps) {
  return (
    <ControlFrame label={label} hint={hint} error={error} className={containerClassName}>
      {({ id, describedBy }) => (
        <select
          id={id}
          ref={ref}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={cn(controlClass(error), "h-9", className)}
          {...rest}
        >
          {children}
        </select>
      )}
    </ControlFrame>
  );
}

interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, "id"> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  ref?: Ref<HTMLTextAreaElement>;
  containerClassName?: string;
}

export function TextAreaField({ label, hint, error, ref, containerClassName, className, ...rest }: TextAreaFieldProps) {
  return (
    <ControlFrame label={label} hint={hint} error={error} className={containerClassName}>
      {({ id, describedBy }) => (
        <textarea
          id={id}
          ref={ref}
          rows={2}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={cn(controlClass(error), "py-1.5 leading-snug", className)}
          {...rest}
        />
      )}
    </ControlFrame>
  );
}
