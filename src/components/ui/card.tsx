import type { HTMLAttributes, ReactNode } from "react";
import { cn } from "@/lib/cn";

interface CardProps extends Omit<HTMLAttributes<HTMLElement>, "title"> {
  title?: ReactNode;
  /** Small print under the title: units, source, a count. */
  subtitle?: ReactNode;
  /** Controls placed at the right of the title row. */
  actions?: ReactNode;
  /** Removes the body padding, for tables that run edge to edge. */
  flush?: boolean;
}

/** A bordered panel; the basic unit of every screen. Titled cards are labelled regions for screen readers. */
export function Card({ title, subtitle, actions, flush = false, className, children, ...rest }: CardProps) {
  const hasHeader = title !== undefined || actions !== undefined;
  return (
    <section
      className={cn("rounded-lg border border-ink-200 bg-surface shadow-panel", className)}
      {...rest}
    >
      {hasHeader ? (
        <header className="flex min-h-11 flex-wrap items-center justify-between gap-x-4 gap-y-1 border-b border-ink-100 px-4 py-2">
          <div className="min-w-0">
            {title !== undefined ? <h2 className="text-base leading-tight font-semibold">{title}</h2> : null}
            {subtitle !== undefined ? <p className="text-sm text-ink-600">{subtitle}</p> : null}
          </div>
          {actions !== undefined ? <div className="flex items-center gap-2">{actions}</div> : null}
        </header>
      ) : null}
      <div className={flush ? undefined : "px-4 py-3"}>{children}</div>
    </section>
  );
}
