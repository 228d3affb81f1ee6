import { cn } from "@/lib/cn";
import { VERDICT_CHIP_TONE, VERDICT_WORD, type Verdict } from "@/lib/verdict";

/** A worded verdict chip; the word carries the meaning, the colour only repeats it. */
export function VerdictBadge({ status, className }: { status: Verdict; className?: string }) {
  return (
    <span className={cn("inline-flex shrink-0 rounded-sm px-1.5 text-xs leading-5 font-semibold whitespace-nowrap", VERDICT_CHIP_TONE[status], className)}>
      {VERDICT_WORD[status]}
    </span>
  );
}
