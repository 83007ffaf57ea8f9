import { createHash } from "node:crypto";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it, vi } from "vitest";
import { GET as downloadFile } from "@/app/api/imports/[id]/file/route";
import { GET as listHistory } from "@/app/api/imports/route";
import { GET as downloadTemplate } from "@/app/api/imports/template/route";
import { POST as importRoute } from "@/app/api/vehicles/import/route";
import { imports } from "@/db/schema";
import { DEFAULT_MAX_BYTES, DEFAULT_MAX_ROWS } from "@/imports";
import { diskStorage, setStorageForTests } from "@/lib/server/storage";
import type { SignedIn } from "@/lib/server/session";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const filesDir = mkdtempSync(join(tmpdir(), "rigline-import-refusals-"));
setStorageForTests(diskStorage(filesDir));
afterAll(() => {
  setStorageForTests(undefined);
  rmSync(filesDir, { recursive: true, force: true });
});

const manager = await signedInAs(database, "manager@mirrabel-health.example");
const messyCsv = readFileSync(join(process.cwd(), "imports/samples/vehicles-messy.csv"));
const messyXlsx = readFileSync(join(process.cwd(), "imports/samples/vehicles-messy.xlsx"));

type ErrorJson = { error: { code: string; message: string; details: { field?: string; row?: number; column?: string; message: string }[] } };

function form(bytes: Buffer | Uint8Array, filename: string, fields: Record<string, string> = {}): FormData {
  const body = new FormData();
  body.set("file", new File([new Uint8Array(bytes)], filename));
  for (const [name, value] of Object.entries(fields)) body.set(name, value);
  return body;
}

async function upload(bytes: Buffer | Uint8Array, filename: string, fields: Record<string, string> = {}, user: SignedIn | null = manager) {
  const { status, json } = await callRoute(importRoute, { user, body: form(bytes, filename, fields), url: "http://localhost/api/vehicles/import" });
  return { status, json: json as ErrorJson };
}

/** Row counts of every table and a checksum of the register tables: "exactly what it held before". */
async function snapshot() {
  const tables = await database.all<{ name: string }>(
    sql`select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name not like '__drizzle%' order by name`,
  );
  const counts: Record<string, number> = {};
  for (const { name } of tables) {
    const [row] = await database.all<{ n: number }>(sql.raw(`select count(*) as n from "${name}"`));
    counts[name] = Number(row!.n);
  }
  const checksum = async (table: string) =>
    createHash("sha256")
      .update(JSON.stringify(await database.all(sql.raw(`select * from "${table}" order by id`))))
      .digest("hex");
  return { counts, vehicles: await checksum("vehicles"), platforms: await checksum("platforms"), files: storedFiles() };
}

function storedFiles(): string[] {
  return (readdirSync(filesDir, { recursive: true, withFileTypes: true }) as { isFile(): boolean; name: string; parentPath: string }[])
    .filter((entry) => entry.isFile())
    .map((entry) => join(entry.parentPath, entry.name))
    .sort();
}

const csv = (lines: string[]) => Buffer.from(lines.join("\r\n") + "\r\n", "utf8");
// A PNG: the eight signature bytes and the start of an IHDR chunk (PNG specification, ISO/IEC 15948; from memory).
const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0x00, 0x00, 0x00, 0x0d, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);

describe("refused files answer in the one error shape and change nothing", () => {
  it("a file above the size limit: 413", async () => {
    const before = await snapshot();
    const big = Buffer.alloc(DEFAULT_MAX_BYTES + 1, "a");
    const { status, json } = await upload(big, "huge.csv");
    expect(status).toBe(413);
    expect(json.error.code).toBe("payload_too_large");
    expect(json.error.details[0]!.field).toBe("file");
    expect(await snapshot()).toEqual(before);
  });

  it("an upload whose declared length is far above the limit: 413 before the body is read", async () => {
    const { status, json } = await callRoute(importRoute, {
      user: manager,
      body: "not read",
      headers: { "content-type": "multipart/form-data; boundary=x", "content-length": String(DEFAULT_MAX_BYTES * 2) },
    });
    expect(status).toBe(413);
    expect((json as ErrorJson).error.code).toBe("payload_too_large");
  });

  it("a PNG sent as a CSV: 415, judged by its bytes, not its name", async () => {
    const before = await snapshot();
    const { status, json } = await upload(png, "register.csv");
    expect(status).toBe(415);
    expect(json.error.code).toBe("unsupported_media_type");
    expect(await snapshot()).toEqual(before);
  });

  it("a truncated workbook: 422 corrupt", async () => {
    const before = await snapshot();
    const { status, json } = await upload(messyXlsx.subarray(0, Math.floor(messyXlsx.byteLength / 2)), "half.xlsx");
    expect(status).toBe(422);
    expect(json.error.code).toBe("validation_failed");
    expect(json.error.details[0]!.field).toBe("file");
    expect(await snapshot()).toEqual(before);
  });

  it("a CSV whose quote never closes: 422", async () => {
    const { status, json } = await upload(csv(["Fleet number,Notes", 'EX-900,"never closed']), "open-quote.csv", { dryRun: "1" });
    expect(status).toBe(422);
    expect(json.error.code).toBe("validation_failed");
  });

  it("more data rows than the limit: 422", async () => {
    const before = await snapshot();
    const lines = ["Fleet number"];
    for (let i = 0; i <= DEFAULT_MAX_ROWS; i++) lines.push(`EX-${i}`);
    const { status, json } = await upload(csv(lines), "many.csv", { dryRun: "1" });
    expect(status).toBe(422);
    expect(json.error.message).toMatch(/20,?000/);
    expect(await snapshot()).toEqual(before);
  });

  it("an empty file: 422", async () => {
    const { status } = await upload(Buffer.alloc(0), "empty.csv", { dryRun: "1" });
    expect(status).toBe(422);
  });

  it("no file at all: 422 naming the file field", async () => {
    const { status, json } = await callRoute(importRoute, { user: manager, body: { dryRun: "1" } });
    expect(status).toBe(422);
    expect(json).toMatchObject({ error: { code: "validation_failed", details: [{ field: "file" }] } });
  });

  it("a bad mode: 422 naming the mode field", async () => {
    const { status, json } = await upload(messyCsv, "vehicles-messy.csv", { mode: "some" });
    expect(status).toBe(422);
    expect(json.error.details[0]!.field).toBe("mode");
  });
});

describe("a failed import leaves the database exactly as it was", () => {
  it("all or nothing with bad rows: 422, no vehicle, platform, history row, audit entry or stored file", async () => {
    const before = await snapshot();
    const { status, json } = await upload(messyCsv, "vehicles-messy.csv", { mode: "all_or_nothing" });
    expect(status).toBe(422);
    expect(json.error.details.length).toBeGreaterThan(0);
    expect(json.error.details.every((d) => typeof d.row === "number" && typeof d.column === "string")).toBe(true);
    expect(await snapshot()).toEqual(before);
  });

  it("the default mode is all or nothing", async () => {
    const before = await snapshot();
    const { status } = await upload(messyCsv, "vehicles-messy.csv");
    expect(status).toBe(422);
    expect(await snapshot()).toEqual(before);
  });

  it("no column for the fleet number: the dry run says which column to choose, the commit refuses", async () => {
    const file = csv(["Colour,Notes", "red,first", "blue,second"]);
    const dry = await upload(file, "no-fleet.csv", { dryRun: "1" });
    expect(dry.status).toBe(200);
    expect(dry.json).toMatchObject({ ready: false, missingRequired: ["fleetNumber"], unknownColumns: ["Colour"], valid: 0 });
    expect((dry.json as unknown as { errors: unknown[] }).errors).toEqual([
      { row: 1, column: "", message: "No column is matched to Fleet number; choose the column that holds it" },
    ]);
    const before = await snapshot();
    const commit = await upload(file, "no-fleet.csv", { mode: "good_rows" });
    expect(commit.status).toBe(422);
    expect(commit.json.error.details[0]!.field).toBe("mapping");
    expect(await snapshot()).toEqual(before);
  });

  it("a failure in the middle of writing rolls back every row already written, and removes the stored file", async () => {
    // Make the database refuse the third new vehicle, after the platforms and the first rows are written.
    await database.run(
      sql.raw(`create trigger refuse_gf203 before insert on vehicles when new.fleet_number = 'GF-203' begin select raise(abort, 'refused by test trigger'); end`),
    );
    const before = await snapshot();
    const mapping = JSON.stringify({ Base: null });
    const { status, json } = await upload(messyCsv, "vehicles-messy.csv", { mode: "good_rows", mapping });
    expect(status).toBe(500);
    expect(json.error).toMatchObject({ code: "internal", message: "Something went wrong on our side. Nothing was changed." });
    expect(await snapshot()).toEqual(before);
    await database.run(sql.raw("drop trigger refuse_gf203"));

    // The same import without the trigger goes through, so the failure above was the trigger's.
    const again = await upload(messyCsv, "vehicles-messy.csv", { mode: "good_rows", mapping });
    expect(again.status).toBe(200);
    expect(again.json).toMatchObject({ created: 6 });
  });
});

describe("who may import", () => {
  const endpoints = async (user: SignedIn | null) => {
    const [record] = await database.select().from(imports).limit(1);
    return [
      (await upload(png, "x.png", { dryRun: "1" }, user)).status,
      (await upload(messyCsv, "vehicles-messy.csv", { mode: "good_rows" }, user)).status,
      (await callRoute(listHistory, { user })).status,
      (await callRoute(downloadTemplate, { user })).status,
      (await callRoute(downloadFile, { user, params: { id: record!.id } })).status,
    ];
  };

  it("drivers, contractors and finance get 403 on every import endpoint, before the file is read", async () => {
    const before = await snapshot();
    for (const email of ["driver@mirrabel-health.example", "contractor@tallowbark-fitout.example", "finance@mirrabel-health.example"]) {
      expect(await endpoints(await signedInAs(database, email)), email).toEqual([403, 403, 403, 403, 403]);
    }
    expect(await snapshot()).toEqual(before);
  });

  it("nobody signed in gets 401", async () => {
    expect(await endpoints(null)).toEqual([401, 401, 401, 401, 401]);
  });

  it("an admin may import", async () => {
    const admin = await signedInAs(database, "admin@mirrabel-health.example");
    const { status } = await upload(messyCsv, "vehicles-messy.csv", { dryRun: "1" }, admin);
    expect(status).toBe(200);
    const history = await callRoute(listHistory, { user: admin });
    expect(history.status).toBe(200);
    expect(await database.$count(imports, eq(imports.orgId, admin.orgId))).toBeGreaterThan(0);
  });
});
