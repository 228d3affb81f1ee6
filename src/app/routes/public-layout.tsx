import type { ReactNode } from "react";
import { CautionsLine } from "@/components/ui/cautions";
import { Wordmark } from "@/components/ui/logo";

/** The frame of the pages reached without a session (one-time links, the summary check): brand band, one column. */
export function PublicLayout({ title, intro, children, wide = false }: { title: string; intro: ReactNode; children: ReactNode; wide?: boolean }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="on-ink bg-ink-900 px-6 py-4">
        <Wordmark />
      </header>
      <main className="flex flex-1 items-start justify-center px-6 py-10 sm:items-center">
        <div className={wide ? "w-full max-w-2xl" : "w-full max-w-sm"}>
          <h1 className="mb-1 text-2xl font-semibold">{title}</h1>
          <div className="mb-5 text-ink-700">{intro}</div>
          {children}
        </div>
      </main>
      <footer className="border-t border-ink-200 px-6 py-2">
        <CautionsLine />
      </footer>
    </div>
  );
}
