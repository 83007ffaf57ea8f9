/**
 * Fleet variance for 5,000 vehicles × 60 lines, against a baseline of one SQL scan of the
 * fitments table in the same run. Target: under 250 ms on this machine.
 */
import { sql } from "drizzle-orm";
import { loadFleetVariance } from "@/db/variance";
import { contractorFirms, depots, editionLines, editions, fitments, organisations, platforms, standards, vehicles } from "@/db/schema";
import { defineAbilityFor, type Actor } from "@/lib/permissions";
import { benchDatabase, medianMs, type BenchResult } from "./support";

const VEHICLES = 5000;
const LINES = 60;

export async function run(): Promise<BenchResult[]> {
  const { database, close } = await benchDatabase();
  try {
    const [org] = await database.insert(organisations).values({ name: "Bench Fleet", slug: "bench" }).returning();
    const orgId = org!.id;
    await database.insert(contractorFirms).values({ orgId, name: "Bench Works", email: "w@bench.example" });
    const depotRows = await database.insert(depots).values([1, 2, 3, 4].map((i) => ({ orgId, name: `Depot ${i}`, code: `D${i}` }))).returning();
    const [platform] = await database.insert(platforms).values({ orgId, make: "Benchmark", model: "Hauler", kerbMassKg: 2200, gvmKg: 3300 }).returning();
    const [standard] = await database.insert(standards).values({ orgId, name: "Bench standard" }).returning();
    const [edition] = await database.insert(editions).values({ orgId, standardId: standard!.id, number: 1, status: "published" }).returning();
    const categories = ["tyres", "suspension", "protection", "recovery", "electrical", "safety"] as const;
    const lines = Array.from({ length: LINES }, (_, i) => ({
      orgId,
      editionId: edition!.id,
      key: `k${i}`,
      code: `L-${String(i).padStart(2, "0")}`,
      category: categories[i % categories.length]!,
      title: `Line ${i}`,
      requirement: (i % 10 === 9 ? "may_fit" : "must_fit") as "may_fit" | "must_fit",
      quantity: 1,
      massKg: 5 + (i % 7),
      zone: "tub" as const,
      criteria: i % 5 === 0 ? [{ attribute: "ratingKg", op: "gte" as const, value: 400 }] : [],
      standardCostCents: 10_000 + i * 100,
    }));
    await database.insert(editionLines).values(lines);

    const fitted = new Date("2026-06-01T00:00:00Z");
    for (let start = 0; start < VEHICLES; start += 500) {
      await database.transaction(async (tx) => {
        const batch = Array.from({ length: Math.min(500, VEHICLES - start) }, (_, j) => {
          const i = start + j;
          return { orgId, fleetNumber: `B-${i}`, platformId: platform!.id, depotId: depotRows[i % 4]!.id, editionId: edition!.id };
        });
        const inserted = await tx.insert(vehicles).values(batch).returning({ id: vehicles.id });
        const rows = inserted.flatMap((v, j) =>
          lines
            .filter((_, li) => (start + j + li) % 9 !== 0) // about one line in nine left short
            .map((l, li) => ({ orgId, vehicleId: v.id, lineKey: l.key, label: l.title, fittedAt: fitted, attributes: (li % 5 === 0 ? { ratingKg: 420 } : {}) as Record<string, number> })),
        );
        for (let k = 0; k < rows.length; k += 2000) await tx.insert(fitments).values(rows.slice(k, k + 2000));
      });
    }

    const actor: Actor = { userId: "bench", orgId, role: "manager", firmId: null, depotId: null };
    void defineAbilityFor(actor);
    const now = new Date("2026-12-01T00:00:00Z");
    let vehiclesSeen = 0;
    const measured = await medianMs(async () => {
      const fleet = await loadFleetVariance(database, actor, undefined, now);
      vehiclesSeen = fleet.details.length;
    });
    const baseline = await medianMs(() => database.all(sql`select * from fitments where org_id = ${orgId}`));
    if (vehiclesSeen !== VEHICLES) throw new Error(`expected ${VEHICLES} vehicles, saw ${vehiclesSeen}`);
    return [
      {
        name: `Fleet variance, ${VEHICLES.toLocaleString("en-AU")} vehicles × ${LINES} lines`,
        figure: `${measured.toFixed(0)} ms`,
        baseline: `${baseline.toFixed(0)} ms for one SQL scan of the fitments`,
        ratio: measured / baseline,
        ratioLabel: "× the fitments scan",
        target: "under 250 ms",
        met: measured < 250,
      },
    ];
  } finally {
    close();
  }
}
