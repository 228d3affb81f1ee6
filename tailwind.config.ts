import type { Config } from "tailwindcss";

/**
 * Kept deliberately small. Tailwind 4 reads design tokens from CSS, so Stillspan's palette, type and spacing
 * live in `src/index.css` under `@theme` (one place, visible to the browser as custom properties, usable from
 * plot code). This file is loaded there with `@config` and only tells Tailwind which files hold class names.
 */
export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
} satisfies Config;
