import type { ReactNode, Ref, TextareaHTMLAttributes } from "react";
import { FieldFrame } from "@/components/ui/field-frame";
import { cn } from "@/lib/cn";

export interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, "id"> {
  label: ReactNode;
  hint?: ReactNode;
  /** The validation message; marks the text area invalid and is announced with it. */
  error?: string;
  ref?: Ref<HTMLTextAreaElement>;
  containerClassName?: string;
}

/** A labelled multi-line input with its hint and error tied to it, styled like `Field`; works with `register`. */
export function TextAreaField({ label, hint, error, ref, containerClassName, className, ...rest }: TextAreaFieldProps) {
  return (
    <FieldFrame label={label} hint={hint} error={error} className={containerClassName}>
      {(control) => (
        <textarea
          {...control}
          ref={ref}
          rows={3}
          className={cn(
            "block w-full rounded-md border bg-white px-2.5 py-1.5 text-[0.95rem] leading-snug text-ink-950 transition-colors",
            "placeholder:text-ink-400 focus-visible:border-tide-600",
            error ? "border-signal-600" : "border-ink-300 hover:border-ink-400",
            className,
          )}
          {...rest}
        />
      )}
    </FieldFrame>
  );
}
