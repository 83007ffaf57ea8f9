import { randomUUID } from "node:crypto";

/** A key was refused: it could name something outside the store, or is not one of ours. */
export class StorageKeyError extends Error {
  constructor(key: string, reason: string) {
    super(`Storage key ${JSON.stringify(key.slice(0, 80))} refused: ${reason}`);
    this.name = "StorageKeyError";
  }
}

const SEGMENT = /^[a-z0-9][a-z0-9._-]*$/;
const MAX_KEY_LENGTH = 512;

/**
 * Checks a key before any driver touches it: lower-case letters, digits, `.`, `_` and `-` in
 * `/`-separated segments, no empty, `.` or `..` segment, no leading slash, no backslash.
 * Such a key can only ever name a file below the store's root.
 */
export function assertStorageKey(key: string): string {
  if (typeof key !== "string" || key.length === 0) throw new StorageKeyError(String(key), "empty");
  if (key.length > MAX_KEY_LENGTH) throw new StorageKeyError(key, `longer than ${MAX_KEY_LENGTH} characters`);
  for (const segment of key.split("/")) {
    if (segment === "." || segment === "..") throw new StorageKeyError(key, "a segment is . or ..");
    if (!SEGMENT.test(segment)) throw new StorageKeyError(key, "segments are lower-case letters, digits, . _ and -, not empty");
  }
  return key;
}

const PREFIX = /^[a-z0-9][a-z0-9_-]*(\/[a-z0-9][a-z0-9_-]*)*$/;
const EXTENSION = /^[a-z0-9]{1,8}$/;

/**
 * A fresh key under a prefix we choose, e.g. `newStorageKey("imports/<orgId>", "csv")` →
 * `imports/<orgId>/2026/03/6f1c…e2.csv`. The user's file name never becomes part of it; keep the
 * original name in the database if it must be shown.
 */
export function newStorageKey(prefix: string, extension?: string, now: Date = new Date()): string {
  const cleanPrefix = prefix.toLowerCase();
  if (!PREFIX.test(cleanPrefix)) throw new StorageKeyError(prefix, "the prefix is not a plain folder path");
  const ext = extension?.toLowerCase();
  if (ext !== undefined && !EXTENSION.test(ext)) throw new StorageKeyError(prefix, "the extension is not 1–8 letters or digits");
  const year = String(now.getUTCFullYear());
  const month = String(now.getUTCMonth() + 1).padStart(2, "0");
  return assertStorageKey(`${cleanPrefix}/${year}/${month}/${randomUUID()}${ext ? `.${ext}` : ""}`);
}
