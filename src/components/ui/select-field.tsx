import type { ReactNode, Ref, SelectHTMLAttributes } from "react";
import { FieldFrame } from "@/components/ui/field-frame";
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
  return (
    <FieldFrame label={label} hint={hint} error={error} className={containerClassName}>
      {(control) => (
        <select
          {...control}
          ref={ref}
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
      )}
    </FieldFrame>
  );
}
