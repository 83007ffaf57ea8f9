/**
 * File storage for uploads (import files, evidence photos and certificates, tickets).
 *
 *   import { storage, newStorageKey } from "@/lib/server/storage";
 *   const key = newStorageKey(`evidence/${orgId}`, "jpg");   // our key, never the user's file name
 *   await storage().put(key, bytes, "image/jpeg");
 *   const file = await storage().get(key);                    // { bytes, contentType, sizeBytes } | null
 *   await storage().head(key);                                // size and type, or null
 *   await storage().delete(key);                              // no error when already gone
 *
 * `storage()` picks the driver from STORAGE_DRIVER (lib/env.ts): `disk` keeps files below
 * STORAGE_DIR; `s3` uses S3_ENDPOINT, S3_BUCKET, S3_REGION, S3_ACCESS_KEY_ID and
 * S3_SECRET_ACCESS_KEY. Both refuse any key that is not ours or could leave the root
 * (`StorageKeyError`). Keep the key (and the file's SHA-256, `sha256OfBytes`) on the record
 * that owns the file; access checks belong to that record, not to the store.
 * Files are written outside the database transaction: write the file first, then the row, so a
 * failed transaction leaves at worst an unreferenced file, never a row without its file.
 */
import "server-only";
import { createHash } from "node:crypto";
import { env, type Env } from "@/lib/env";
import { diskStorage } from "./disk";
import { s3Storage } from "./s3";
import type { FileStorage } from "./types";

export { diskStorage } from "./disk";
export { s3Storage, type S3StorageConfig } from "./s3";
export { assertStorageKey, newStorageKey, StorageKeyError } from "./keys";
export type { FileStorage, StoredFile, StoredFileInfo } from "./types";

const holder = globalThis as unknown as { riglineStorage?: FileStorage };

/** The store an environment asks for (readEnv has already checked S3_ENDPOINT and S3_BUCKET). */
export function storageFromEnv(config: Env): FileStorage {
  if (config.STORAGE_DRIVER === "s3") {
    return s3Storage({
      endpoint: config.S3_ENDPOINT ?? "",
      bucket: config.S3_BUCKET ?? "",
      region: config.S3_REGION,
      accessKeyId: config.S3_ACCESS_KEY_ID,
      secretAccessKey: config.S3_SECRET_ACCESS_KEY,
    });
  }
  return diskStorage(config.STORAGE_DIR);
}

/** The app's file store, chosen once from the environment. */
export function storage(): FileStorage {
  holder.riglineStorage ??= storageFromEnv(env());
  return holder.riglineStorage;
}

/** Tests swap in their own store (a temporary folder or an in-process S3 stand-in). */
export function setStorageForTests(store: FileStorage | undefined): void {
  holder.riglineStorage = store;
}

/** Hex SHA-256 of a file's bytes, stored beside its key. */
export function sha256OfBytes(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}
