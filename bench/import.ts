/**
 * Vehicle import of a generated 10,000-row register, CSV and XLSX, dry run and commit, through
 * the same code as `POST /api/vehicles/import`. Baseline in the same run: the raw parse
 * (papaparse / exceljs) plus one transactional insert of the same rows. Target: the import at
 * ≥ 50 % of the baseline's speed (its time at most 2× the baseline's).
 */
import ExcelJS from "exceljs";
import { and, eq } from "drizzle-orm";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Papa from "papaparse";
import { setDbForTests } from "@/db/client";
import { memberships, organisations, platforms, users, vehicles } from "@/db/schema";
import { seedDemo } from "@/db/seed";
import { importVehicleFile } from "@/lib/commands/imports";
import { defineAbilityFor, type Actor } from "@/lib/permissions";
import type { SignedIn } from "@/lib/server/session";
import { benchDatabase, type BenchResult } from "./support";

const ROWS = 10_000;
const HEADERS = ["Fleet No", "VIN", "Rego", "Make", "Model", "Variant", "Depot", "Odometer (km)", "Cost centre"];
const DEPOTS = ["OCW", "SPC", "TRJ"];
const MODELS = [
  ["Corvane", "Trailhand 79", "single cab chassis"],
  ["Marrak", "Outback 300", "wagon"],
  ["Yendor", "Terrus 4", "dual cab ute"],
  ["Brolga", "Kestrel", "LC wagon"],
];

function rows(prefix: string): string[][] {
  return Array.from({ length: ROWS }, (_, i) => {
    const [make, model, variant] = MODELS[i % MODELS.length]!;
    return [
      `${prefix}-${String(i).padStart(5, "0")}`,
      `7RB${prefix}0${String(i).padStart(12, "0")}`.slice(0, 17),
      `B${String(i).padStart(5, "0")}`,
      make!,
      model!,
      variant!,
      DEPOTS[i % DEPOTS.length]!,
      String(10_000 + i * 3),
      `CC-${DEPOTS[i % DEPOTS.length]}`,
    ];
  });
}

const csvOf = (data: string[][]) => Buffer.from(Papa.unparse([HEADERS, ...data]), "utf8");

async function xlsxOf(data: string[][]): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet("Register");
  sheet.addRow(HEADERS);
  for (const r of data) sheet.addRow(r.map((v, i) => (i === 7 ? Number(v) : v)));
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

async function timed<T>(fn: () => Promise<T>): Promise<[number, T]> {
  const t0 = performance.now();
  const out = await fn();
  return [performance.now() - t0, out];
}

export async function run(): Promise<BenchResult[]> {
  process.env.STORAGE_DIR = mkdtempSync(join(tmpdir(), "rigline-bench-files-"));
  process.env.AUTH_SECRET ??= "bench-secret-bench-secret-bench-secret-01";
  const { database, close } = await benchDatabase();
  setDbForTests(database);
  try {
    await seedDemo(database);
    const [row] = await database
      .select({ user: users, membership: memberships, org: organisations })
      .from(users)
      .innerJoin(memberships, eq(memberships.userId, users.id))
      .innerJoin(organisations, eq(organisations.id, memberships.orgId))
      .where(eq(users.email, "manager@mirrabel-health.example"));
    const actor: Actor = { userId: row!.user.id, orgId: row!.org.id, role: "manager", firmId: null, depotId: null };
    const user: SignedIn = { ...actor, email: row!.user.email, name: row!.user.name, orgName: row!.org.name, timeZone: row!.org.timeZone, via: "session", ability: defineAbilityFor(actor) };
    const platform = await database.query.platforms.findFirst({ where: and(eq(platforms.orgId, actor.orgId)) });
    const results: BenchResult[] = [];

    for (const format of ["csv", "xlsx"] as const) {
      const prefix = format === "csv" ? "C" : "X";
      const data = rows(prefix);
      const bytes = format === "csv" ? csvOf(data) : await xlsxOf(data);
      const file = () => new Blob([new Uint8Array(bytes)], { type: "application/octet-stream" }) as Blob & { name?: string };

      // Baseline: raw parse plus one transactional insert of the same rows (into a scratch organisation).
      const [baselineMs] = await timed(async () => {
        let parsed: string[][];
        if (format === "csv") {
          parsed = (Papa.parse<string[]>(bytes.toString("utf8"), { skipEmptyLines: true }).data).slice(1);
        } else {
          const wb = new ExcelJS.Workbook();
          await wb.xlsx.load(bytes as unknown as ArrayBuffer);
          parsed = [];
          wb.worksheets[0]!.eachRow((r, n) => {
            if (n > 1) parsed.push((r.values as unknown[]).slice(1).map((v) => String(v ?? "")));
          });
        }
        const [scratch] = await database.insert(organisations).values({ name: `Scratch ${format}`, slug: `scratch-${format}` }).returning();
        const [scratchPlatform] = await database.insert(platforms).values({ orgId: scratch!.id, make: "Scratch", model: "Base" }).returning();
        await database.transaction(async (tx) => {
          for (let i = 0; i < parsed.length; i += 500) {
            await tx.insert(vehicles).values(
              parsed.slice(i, i + 500).map((r) => ({
                orgId: scratch!.id,
                fleetNumber: r[0]!,
                vin: r[1]!,
                registration: r[2]!,
                platformId: scratchPlatform!.id,
                odometerKm: Number(r[7]),
                costCentre: r[8]!,
              })),
            );
          }
        });
      });

      const [dryMs, dry] = await timed(() => importVehicleFile(user, { file: file(), dryRun: "1", mode: "good_rows" }));
      const [commitMs, committed] = await timed(() => importVehicleFile(user, { file: file(), mode: "good_rows" }));
      if (dry.valid !== ROWS || committed.created !== ROWS) {
        throw new Error(`${format}: expected ${ROWS} valid and created rows, got ${dry.valid} / ${committed.created} (${JSON.stringify(committed.errors.slice(0, 3))})`);
      }
      void platform;
      for (const [label, ms] of [["dry run", dryMs], ["commit", commitMs]] as const) {
        results.push({
          name: `Import ${ROWS.toLocaleString("en-AU")} rows from ${format.toUpperCase()}, ${label}`,
          figure: `${ms.toFixed(0)} ms (${Math.round((ROWS / ms) * 1000).toLocaleString("en-AU")} rows/s)`,
          baseline: `${baselineMs.toFixed(0)} ms for the raw parse plus one transactional insert`,
          ratio: baselineMs / ms,
          ratioLabel: "of the baseline's speed",
          target: "at least 0.50 of the baseline's speed",
          met: baselineMs / ms >= 0.5,
        });
      }
    }
    return results;
  } finally {
    close();
  }
}
