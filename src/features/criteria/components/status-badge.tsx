import type { LockIn } from "@shared/criteria/screen-study";
import { cn } from "@/lib/cn";

type Tone = "good" | "bad" | "doubt" | "none";

const TONE_CLASS: Record<Tone, string> = {
  good: "bg-steady-100 text-steady-700",
  bad: "bg-signal-100 text-signal-700",
  doubt: "bg-caution-100 text-caution-700",
  none: "bg-ink-100 text-ink-700",
};

/** A worded status chip; the word carries the meaning, the colour only repeats it. */
export function StatusBadge({ tone, children, className }: { tone: Tone; children: string; className?: string }) {
  return (
    <span className={cn("inline-flex rounded-sm px-1.5 py-px text-xs font-semibold whitespace-nowrap", TONE_CLASS[tone], className)}>
      {children}
    </span>
  );
}

const LOCK_IN: Record<LockIn, { tone: Tone; label: string }> = {
  possible: { tone: "doubt", label: "lock-in possible" },
  "not-expected": { tone: "good", label: "not expected" },
  "not-evaluated": { tone: "none", label: "not evaluated" },
};

export function LockInBadge({ lockIn }: { lockIn: LockIn }) {
  return <StatusBadge tone={LOCK_IN[lockIn].tone}>{LOCK_IN[lockIn].label}</StatusBadge>;
}
