import { cn } from "@/lib/cn";

/** The standing caution, visible on every screen that can show a result. */
export function CautionsLine({ className }: { className?: string }) {
  return (
    <p className={cn("text-xs leading-snug text-ink-600", className)}>
      <span className="font-semibold text-ink-700">Results are indicative.</span> Critical cases need wind-tunnel
      verification and review by a licensed engineer under the local codes and standards.
    </p>
  );
}
