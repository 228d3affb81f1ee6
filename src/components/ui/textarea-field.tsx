import { useId, type ReactNode, type Ref, type TextareaHTMLAttributes } from "react";
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
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={cn("space-y-1", containerClassName)}>
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      <textarea
        id={id}
        ref={ref}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={cn(
          "block w-full rounded-md border bg-white px-2.5 py-1.5 text-[0.95rem] leading-snug text-ink-950 transition-colors",
          "placeholder:text-ink-400 focus-visible:border-tide-600",
          error ? "border-signal-600" : "border-ink-300 hover:border-ink-400",
          className,
        )}
        {...rest}
      />
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
