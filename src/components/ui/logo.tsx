import { cn } from "@/lib/cn";

/** Stillspan's mark (also the favicon): calm streamlines over a faired deck section, one warm eddy below. */
export function LogoMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={cn("size-7", className)} aria-hidden="true">
      <rect width="32" height="32" rx="7" fill="#12262b" />
      <path d="M5 9.5c4-1.6 7.5-1.6 11 0s7 1.6 11 0" fill="none" stroke="#7fb3b5" strokeWidth="1.6" strokeLinecap="round" />
      <path d="M5 14c4-1.2 7.5-1.2 11 0s7 1.2 11 0" fill="none" stroke="#a9cfcf" strokeWidth="1.6" strokeLinecap="round" />
      <path d="M4.5 20.5 9 18h14l4.5 2.5L23 23H9z" fill="#e6efee" />
      <path d="M22 26c1.8-.9 3.2-.9 5 0" fill="none" stroke="#e07a3c" strokeWidth="1.8" strokeLinecap="round" />
    </svg>
  );
}

export function Wordmark({ className, tone = "light" }: { className?: string; tone?: "light" | "dark" }) {
  return (
    <span className={cn("inline-flex items-center gap-2", className)}>
      <LogoMark className={tone === "light" ? "ring-1 ring-ink-700 rounded-[7px]" : undefined} />
      <span
        className={cn(
          "text-lg font-bold tracking-[0.01em]",
          tone === "light" ? "text-white" : "text-ink-950",
        )}
      >
        Stillspan
      </span>
    </span>
  );
}
