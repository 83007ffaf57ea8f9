import { createHash, randomBytes } from "node:crypto";

/** A random secret for links and API tokens; only its SHA-256 is ever stored. */
export function newSecret(bytes = 32): string {
  return randomBytes(bytes).toString("base64url");
}

export function sha256Hex(value: string | Buffer): string {
  return createHash("sha256").update(value).digest("hex");
}
