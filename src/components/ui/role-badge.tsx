import { cn } from "@/lib/cn";

const TONES = {
  analyst: "border-tide-100 bg-tide-50 text-tide-700",
  reviewer: "border-steady-100 bg-steady-100 text-steady-700",
  viewer: "border-ink-200 bg-ink-50 text-ink-700",
  admin: "border-caution-100 bg-caution-100 text-caution-700",
} as const;

export function RoleBadge({ tone, children }: { tone: keyof typeof TONES; children: string }) {
  return (
    <span className={cn("inline-flex items-center rounded-sm border px-1.5 text-xs leading-5 font-semibold", TONES[tone])}>
      {children}
    </span>
  );
}
