import { useId, type ReactNode, type Ref, type SelectHTMLAttributes } from "react";
import { cn } from "@/lib/cn";

export interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, "id"> {
  label: ReactNode;
  hint?: ReactNode;
  /** The validation message; marks the select invalid and is announced with it. */
  error?: string;
  ref?: Ref<HTMLSelectElement>;
  containerClassName?: string;
}

/** A labelled native select with its hint and error tied to it, styled like `Field`; works with `register`. */
export function SelectField({ label, hint, error, ref, containerClassName, className, children, ...rest }: SelectFieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={cn("space-y-1", containerClassName)}>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      <select
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={cn(
          "block h-9 w-full rounded-md border bg-white px-2 text-[0.95rem] text-ink-950 transition-colors",
          "focus-visible:border-tide-600 disabled:cursor-not-allowed disabled:bg-ink-50 disabled:text-ink-500",
          error ? "border-signal-600" : "border-ink-300 hover:border-ink-400",
          className,
        )}
        {...rest}
      >
        {children}
      </select>
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
