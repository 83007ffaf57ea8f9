import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";

/** The colour tokens as written in app/globals.css, `var()` references resolved to hex. */
export function readColorTokens(): Map<string, string> {
  const cssPath = fileURLToPath(new URL("../../../app/globals.css", import.meta.url));
  const css = readFileSync(cssPath, "utf8");
  const theme = /@theme\s*\{([\s\S]*?)\n\}/.exec(css)?.[1];
  if (!theme) throw new Error("no @theme block in app/globals.css");
  const raw = new Map<string, string>();
  for (const m of theme.matchAll(/--color-([a-z0-9-]+):\s*([^;]+);/g)) {
    const [, name, value] = m;
    if (name && value) raw.set(name, value.trim());
  }
  const resolved = new Map<string, string>();
  const resolve = (name: string, seen: Set<string>): string => {
    const value = raw.get(name);
    if (value === undefined) throw new Error(`--color-${name} is not defined`);
    const ref = /^var\(--color-([a-z0-9-]+)\)$/.exec(value);
    if (!ref?.[1]) return value.toLowerCase();
    if (seen.has(ref[1])) throw new Error(`--color-${name} refers to itself`);
    return resolve(ref[1], new Set([...seen, name]));
  };
  for (const name of raw.keys()) resolved.set(name, resolve(name, new Set()));
  return resolved;
}

/** Names that are rungs of a palette scale ("earth-500"), as opposed to semantic names. */
export const scalePattern = /^(earth|spinifex|saltbush|night|sand)-\d{2,3}$/;
