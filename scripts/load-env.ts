import { existsSync, readFileSync } from "node:fs";

/** Reads `.env` (if present) into process.env without overriding what is already set. */
export function loadDotEnv(path = ".env"): void {
  if (!existsSync(path)) return;
  for (const line of readFileSync(path, "utf8").split(/\r?\n/)) {
    const match = /^\s*([A-Z0-9_]+)\s*=\s*(.*)\s*$/.exec(line);
    if (!match || line.trim().startsWith("#")) continue;
    const [, key, raw] = match;
    if (key && process.env[key] === undefined) process.env[key] = raw!.replace(/^["']|["']$/g, "");
  }
}
