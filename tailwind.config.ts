import type { Config } from "tailwindcss";

// Loaded from app/globals.css with `@config`. The design tokens (palette and semantic colours)
// are defined there with `@theme`; this file only names where class names are written, so
// utilities used in components and routes are always generated.
const config = {
  content: ["./app/**/*.{ts,tsx,mdx}", "./components/**/*.{ts,tsx}"],
} satisfies Config;

export default config;
