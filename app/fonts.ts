import localFont from "next/font/local";

/**
 * Public Sans, a variable open typeface shipped with the app (no network fetch). It carries
 * tabular figures (OpenType `tnum`), which tables and quantities switch on with
 * `font-variant-numeric: tabular-nums`.
 *
 * Put `publicSans.variable` on <html>: it sets `--font-sans`, which the theme's `font-sans`
 * (and the page default) read.
 */
export const publicSans = localFont({
  src: "../node_modules/@fontsource-variable/public-sans/files/public-sans-latin-wght-normal.woff2",
  weight: "100 900",
  style: "normal",
  variable: "--font-sans",
  display: "swap",
  fallback: ["ui-sans-serif", "system-ui", "sans-serif"],
});
