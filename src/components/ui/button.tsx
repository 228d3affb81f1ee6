import type { ButtonHTMLAttributes, ReactNode } from "react";
import { cn } from "@/lib/cn";
import { Spinner } from "@/components/ui/spinner";

const VARIANTS = {
  primary: "bg-ink-800 text-white hover:bg-ink-700 active:bg-ink-900 disabled:bg-ink-400",
  accent: "bg-tide-600 text-white hover:bg-tide-700 disabled:bg-ink-400",
  secondary:
    "border border-ink-300 bg-surface text-ink-800 hover:border-ink-400 hover:bg-ink-50 disabled:text-ink-400",
  ghost: "text-ink-700 hover:bg-ink-100 disabled:text-ink-400",
  danger: "bg-signal-600 text-white hover:bg-signal-700 disabled:bg-ink-400",
  /** For the dark ink header and panels. */
  inverse: "border border-ink-600 text-ink-100 hover:border-ink-400 hover:bg-ink-800 hover:text-white",
} as const;

const SIZES = {
  sm: "h-7 gap-1.5 px-2.5 text-sm",
  md: "h-9 gap-2 px-3.5 text-[0.95rem]",
} as const;

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: keyof typeof VARIANTS;
  size?: keyof typeof SIZES;
  /** Shows a spinner and blocks further clicks while the action runs. */
  isLoading?: boolean;
  icon?: ReactNode;
}

export function Button({
  variant = "primary",
  size = "md",
  isLoading = false,
  icon,
  className,
  children,
  disabled,
  type = "button",
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || isLoading}
      aria-busy={isLoading || undefined}
      className={cn(
        "inline-flex shrink-0 items-center justify-center rounded-md font-semibold whitespace-nowrap transition-colors",
        "disabled:cursor-not-allowed",
        VARIANTS[variant],
        SIZES[size],
        className,
      )}
      {...rest}
    >
      {isLoading ? <Spinner size="sm" label={null} /> : icon}
      {children}
    </button>
  );
}
