import "server-only";
import { mkdir, readFile, rename, rm, stat, writeFile } from "node:fs/promises";
import { dirname, isAbsolute, join, relative, resolve } from "node:path";
import { randomUUID } from "node:crypto";
import { assertStorageKey, StorageKeyError } from "./keys";
import type { FileStorage, StoredFile, StoredFileInfo } from "./types";

/** `#` can never appear in a key, so the side files can never be named by one. */
const META_SUFFIX = "#meta.json";

type Meta = { contentType: string };

function isMissing(error: unknown): boolean {
  return (error as { code?: string })?.code === "ENOENT";
}

/**
 * Files on local disk below `root`. Each file sits at `<root>/<key>` with its content type in
 * `<root>/<key>#meta.json`; writes go to a temporary name first and are renamed into place, so a
 * reader never sees half a file.
 */
export function diskStorage(root: string): FileStorage {
  const base = resolve(root);

  function pathOf(key: string): string {
    assertStorageKey(key);
    const full = resolve(base, key);
    const rel = relative(base, full);
    // The key check already rules this out; the second check keeps the root even if it changes.
    if (rel === "" || rel.startsWith("..") || isAbsolute(rel)) throw new StorageKeyError(key, "it would leave the storage root");
    return full;
  }

  async function readMeta(path: string): Promise<Meta> {
    try {
      return JSON.parse(await readFile(path + META_SUFFIX, "utf8")) as Meta;
    } catch (error) {
      if (isMissing(error)) return { contentType: "application/octet-stream" };
      throw error;
    }
  }

  async function head(key: string): Promise<StoredFileInfo | null> {
    const path = pathOf(key);
    try {
      const info = await stat(path);
      if (!info.isFile()) return null;
      return { key, sizeBytes: info.size, contentType: (await readMeta(path)).contentType };
    } catch (error) {
      if (isMissing(error)) return null;
      throw error;
    }
  }

  return {
    driver: "disk",
    async put(key, bytes, contentType) {
      const path = pathOf(key);
      await mkdir(dirname(path), { recursive: true });
      const temp = join(dirname(path), `#tmp-${randomUUID()}`);
      await writeFile(temp, bytes);
      await writeFile(path + META_SUFFIX, JSON.stringify({ contentType } satisfies Meta));
      await rename(temp, path);
      return { key, sizeBytes: bytes.byteLength, contentType };
    },
    async get(key): Promise<StoredFile | null> {
      const path = pathOf(key);
      try {
        const bytes = await readFile(path);
        return { key, bytes, sizeBytes: bytes.byteLength, contentType: (await readMeta(path)).contentType };
      } catch (error) {
        if (isMissing(error) || (error as { code?: string })?.code === "EISDIR") return null;
        throw error;
      }
    },
    head,
    async delete(key) {
      const path = pathOf(key);
      await rm(path, { force: true });
      await rm(path + META_SUFFIX, { force: true });
    },
  };
}
