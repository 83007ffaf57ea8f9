import { createRequire } from "node:module";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { AddressInfo } from "node:net";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as downloadFile } from "@/app/api/imports/[id]/file/route";
import { POST as importRoute } from "@/app/api/vehicles/import/route";
import { imports } from "@/db/schema";
import type { ImportResult } from "@/lib/commands/imports";
import { s3Storage, setStorageForTests, type FileStorage } from "@/lib/server/storage";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

// s3rver ships without type declarations; this is the part of it the test uses.
type S3rverInstance = { run(): Promise<AddressInfo>; close(): Promise<void> };
const S3rver = createRequire(import.meta.url)("s3rver") as new (options: Record<string, unknown>) => S3rverInstance;

const database = await useTestDatabase();
const dir = mkdtempSync(join(tmpdir(), "rigline-import-s3-"));
let server: S3rverInstance;
let store: FileStorage;

beforeAll(async () => {
  server = new S3rver({ address: "127.0.0.1", port: 0, silent: true, directory: dir, configureBuckets: [{ name: "rigline-imports" }] });
  const { port } = await server.run();
  store = s3Storage({ endpoint: `http://127.0.0.1:${port}`, bucket: "rigline-imports", region: "us-east-1", accessKeyId: "S3RVER", secretAccessKey: "S3RVER" });
  setStorageForTests(store);
});
afterAll(async () => {
  setStorageForTests(undefined);
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("vehicle import with the S3 store", () => {
  it("keeps the original workbook in the bucket and gives it back byte for byte", async () => {
    const manager = await signedInAs(database, "manager@mirrabel-health.example");
    const bytes = readFileSync(join(process.cwd(), "imports/samples/vehicles-messy.xlsx"));
    const body = new FormData();
    body.set("file", new File([new Uint8Array(bytes)], "vehicles-messy.xlsx"));
    body.set("dryRun", "1");
    const { status, json } = await callRoute(importRoute, { user: manager, body });
    expect(status).toBe(200);
    const result = json as ImportResult;
    const [record] = await database.select().from(imports).where(eq(imports.id, result.importId));
    const head = await store.head(record!.storageKey!);
    expect(head).toEqual({ key: record!.storageKey, sizeBytes: bytes.byteLength, contentType: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet" });
    const download = await callRoute(downloadFile, { user: manager, params: { id: result.importId } });
    expect(download.status).toBe(200);
    expect(Buffer.compare(Buffer.from(await download.response.arrayBuffer()), bytes)).toBe(0);
  });
});
