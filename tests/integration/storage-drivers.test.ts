import { createRequire } from "node:module";
import { mkdtempSync, readdirSync, rmSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  assertStorageKey,
  diskStorage,
  newStorageKey,
  s3Storage,
  sha256OfBytes,
  StorageKeyError,
  storageFromEnv,
  type FileStorage,
} from "@/lib/server/storage";
import { readEnv } from "@/lib/env";

// s3rver ships without type declarations; this is the part of it the tests use.
type S3rverInstance = { run(): Promise<AddressInfo>; close(): Promise<void> };
type S3rverOptions = {
  address: string;
  port: number;
  silent: boolean;
  directory: string;
  configureBuckets: { name: string }[];
};
const S3rver = createRequire(import.meta.url)("s3rver") as new (options: S3rverOptions) => S3rverInstance;

const root = mkdtempSync(join(tmpdir(), "rigline-storage-"));
const bucket = "rigline-test";
let s3server: S3rverInstance;
let s3: FileStorage;
const disk = diskStorage(join(root, "disk"));

beforeAll(async () => {
  s3server = new S3rver({ address: "127.0.0.1", port: 0, silent: true, directory: join(root, "s3"), configureBuckets: [{ name: bucket }] });
  const address = await s3server.run();
  s3 = s3Storage({
    endpoint: `http://127.0.0.1:${address.port}`,
    bucket,
    region: "us-east-1",
    accessKeyId: "S3RVER",
    secretAccessKey: "S3RVER",
  });
});

afterAll(async () => {
  await s3server?.close();
  rmSync(root, { recursive: true, force: true });
});

// Bytes that would be mangled by any text handling: every byte value, CR/LF, NUL, a UTF-8 BOM.
const binary = Buffer.from([...Array.from({ length: 256 }, (_, i) => i), 0xef, 0xbb, 0xbf, 13, 10, 0]);

const drivers: [string, () => FileStorage][] = [
  ["disk", () => disk],
  ["s3", () => s3],
];

describe.each(drivers)("file storage, %s driver", (name, store) => {
  it("names itself", () => {
    expect(store().driver).toBe(name);
  });

  it("stores bytes exactly and gives them back with type and size", async () => {
    const key = newStorageKey("tests/round-trip", "bin");
    const info = await store().put(key, binary, "application/octet-stream");
    expect(info).toEqual({ key, sizeBytes: binary.byteLength, contentType: "application/octet-stream" });
    const file = await store().get(key);
    expect(file).not.toBeNull();
    expect(Buffer.compare(file!.bytes, binary)).toBe(0);
    expect(sha256OfBytes(file!.bytes)).toBe(sha256OfBytes(binary));
    expect(file!.contentType).toBe("application/octet-stream");
    expect(file!.sizeBytes).toBe(binary.byteLength);
  });

  it("keeps a text file's content type and replaces a file put twice", async () => {
    const key = newStorageKey("tests/replace", "csv");
    await store().put(key, Buffer.from("Fleet number\nEX-001\n"), "text/csv");
    await store().put(key, Buffer.from("Fleet number\nEX-002\n"), "text/csv; charset=utf-8");
    const file = await store().get(key);
    expect(file!.bytes.toString("utf8")).toBe("Fleet number\nEX-002\n");
    expect(file!.contentType).toBe("text/csv; charset=utf-8");
  });

  it("heads a stored file without reading it, and answers null for a missing key", async () => {
    const key = newStorageKey("tests/head", "txt");
    await store().put(key, Buffer.from("twelve bytes"), "text/plain");
    expect(await store().head(key)).toEqual({ key, sizeBytes: 12, contentType: "text/plain" });
    expect(await store().head(newStorageKey("tests/head", "txt"))).toBeNull();
    expect(await store().get(newStorageKey("tests/head", "txt"))).toBeNull();
  });

  it("deletes a file, and deleting it again is not an error", async () => {
    const key = newStorageKey("tests/delete");
    await store().put(key, Buffer.from("gone soon"), "text/plain");
    await store().delete(key);
    expect(await store().head(key)).toBeNull();
    expect(await store().get(key)).toBeNull();
    await expect(store().delete(key)).resolves.toBeUndefined();
  });

  it("stores an empty file", async () => {
    const key = newStorageKey("tests/empty");
    await store().put(key, new Uint8Array(), "application/octet-stream");
    const file = await store().get(key);
    expect(file!.sizeBytes).toBe(0);
    expect(file!.bytes.byteLength).toBe(0);
  });

  it.each(["../escape.txt", "tests/../../escape.txt", "/etc/passwd", "tests//double", "tests/./dot", "Tests/Upper.csv", "tests\\back", "", "tests/ space", "tests/a#meta.json"])(
    "refuses the key %j on every operation",
    async (bad) => {
      await expect(store().put(bad, Buffer.from("x"), "text/plain")).rejects.toBeInstanceOf(StorageKeyError);
      await expect(store().get(bad)).rejects.toBeInstanceOf(StorageKeyError);
      await expect(store().head(bad)).rejects.toBeInstanceOf(StorageKeyError);
      await expect(store().delete(bad)).rejects.toBeInstanceOf(StorageKeyError);
    },
  );
});

describe("storage keys", () => {
  it("are made by us: prefix, year and month, a random id and the extension", () => {
    const key = newStorageKey("imports/org-1", "XLSX", new Date(Date.UTC(2026, 2, 31)));
    expect(key).toMatch(/^imports\/org-1\/2026\/03\/[0-9a-f-]{36}\.xlsx$/);
    expect(newStorageKey("imports/org-1")).not.toBe(newStorageKey("imports/org-1"));
  });

  it("refuse a prefix or extension that could carry a path", () => {
    expect(() => newStorageKey("../up")).toThrow(StorageKeyError);
    expect(() => newStorageKey("imports", "../csv")).toThrow(StorageKeyError);
    expect(() => newStorageKey("/abs")).toThrow(StorageKeyError);
    expect(() => assertStorageKey("a".repeat(513))).toThrow(StorageKeyError);
  });

  it("keep the disk driver's files below its root", async () => {
    const diskRoot = join(root, "disk-only");
    const store = diskStorage(diskRoot);
    const key = newStorageKey("tests/inside", "txt");
    await store.put(key, Buffer.from("inside"), "text/plain");
    expect(existsSync(join(diskRoot, key))).toBe(true);
    await expect(store.put("../outside.txt", Buffer.from("x"), "text/plain")).rejects.toBeInstanceOf(StorageKeyError);
    expect(readdirSync(root)).not.toContain("outside.txt");
  });
});

describe("storage()", () => {
  const base = { AUTH_SECRET: "test-secret-test-secret-test-secret-0000" };

  it("uses the disk below STORAGE_DIR by default", async () => {
    const dir = join(root, "from-env");
    const store = storageFromEnv(readEnv({ ...base, STORAGE_DIR: dir }));
    expect(store.driver).toBe("disk");
    const key = newStorageKey("tests/env", "txt");
    await store.put(key, Buffer.from("here"), "text/plain");
    expect(existsSync(join(dir, key))).toBe(true);
  });

  it("uses the S3 store named by S3_ENDPOINT and S3_BUCKET when STORAGE_DRIVER=s3", async () => {
    const endpoint = (s3server as unknown as { httpServer: { address(): AddressInfo } }).httpServer.address();
    const store = storageFromEnv(
      readEnv({
        ...base,
        STORAGE_DRIVER: "s3",
        S3_ENDPOINT: `http://127.0.0.1:${endpoint.port}`,
        S3_BUCKET: bucket,
        S3_ACCESS_KEY_ID: "S3RVER",
        S3_SECRET_ACCESS_KEY: "S3RVER",
      }),
    );
    expect(store.driver).toBe("s3");
    const key = newStorageKey("tests/env", "bin");
    await store.put(key, binary, "application/octet-stream");
    // The same object is visible through the other client: it went to that bucket.
    expect(Buffer.compare((await s3.get(key))!.bytes, binary)).toBe(0);
  });

  it("refuses STORAGE_DRIVER=s3 without an endpoint and bucket", () => {
    expect(() => readEnv({ ...base, STORAGE_DRIVER: "s3" })).toThrow(/S3_ENDPOINT and S3_BUCKET/);
  });
});
