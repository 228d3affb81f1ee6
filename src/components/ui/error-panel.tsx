import type { ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { cn } from "@/lib/cn";

interface ErrorPanelProps {
  title?: string;
  /** What went wrong, in the words the user needs. */
  message: ReactNode;
  /** The machine code from the API (`{ error: { code } }`), shown small for support requests. */
  code?: string;
  onRetry?: () => void;
  isRetrying?: boolean;
  className?: string;
}

/** The one way a failed load or action is shown: what failed, the reason, and a way on. */
export function ErrorPanel({
  title = "Something went wrong",
  message,
  code,
  onRetry,
  isRetrying,
  className,
}: ErrorPanelProps) {
  return (
    <div
      role="alert"
      className={cn(
        "flex flex-wrap items-start justify-between gap-3 rounded-md border border-signal-100 border-l-4 border-l-signal-600 bg-signal-50 px-4 py-3",
        className,
      )}
    >
      <div className="min-w-0 space-y-0.5">
        <p className="font-semibold text-signal-700">{title}</p>
        <div className="text-sm text-ink-800">{message}</div>
        {code ? <p className="font-mono text-xs text-ink-600">code: {code}</p> : null}
      </div>
      {onRetry ? (
        <Button variant="secondary" size="sm" onClick={onRetry} isLoading={isRetrying}>
          Retry
        </Button>
      ) : null}
    </div>
  );
}
