import type { ReactNode } from "react";

interface PageHeaderProps {
  title: ReactNode;
  /** A short line under the title: what this page is for, or the object's key facts. */
  description?: ReactNode;
  /** Breadcrumb or back link shown above the title. */
  eyebrow?: ReactNode;
  actions?: ReactNode;
}

export function PageHeader({ title, description, eyebrow, actions }: PageHeaderProps) {
  return (
    <div className="mb-4 flex flex-wrap items-end justify-between gap-3">
      <div className="min-w-0">
        {eyebrow ? <div className="mb-0.5 text-sm text-ink-600">{eyebrow}</div> : null}
        <h1 className="text-2xl leading-tight font-semibold">{title}</h1>
        {description ? <p className="mt-0.5 max-w-3xl text-ink-700">{description}</p> : null}
      </div>
      {actions ? <div className="flex items-center gap-2">{actions}</div> : null}
    </div>
  );
}
