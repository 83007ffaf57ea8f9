/**
 * Fleet variance for 5,000 vehicles × 60 lines, against a baseline of one SQL scan of the
 * fitments table in the same run. Target: under 250 ms on this machine, judged on the warm read
 * (every vehicle's stored summary current: the fleet view's everyday case). The cold read (no
 * summaries yet: every vehicle judged in full and its summary written back) is printed beside
 * it, as is the full per-line judgement the single-vehicle and readiness views still use.
 */
import { sql } from "drizzle-orm";
import { fleetReadinessCounts, loadFleetReadiness } from "@/db/readiness";
import { loadFleetVariance } from "@/db/variance";
import { loadFleetVarianceFigures, type SummaryReadStats } from "@/db/variance-summary";
import { contractorFirms, depots, editionLines, editions, fitments, organisations, platforms, standards, vehicles, vehicleVarianceSummaries } from "@/db/schema";
import { defineAbilityFor, type Actor } from "@/lib/permissions";
import { benchDatabase, medianMs, type BenchResult } from "./support";

const VEHICLES = 5000;
const LINES = 60;
const TARGET_MS = 250;

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
    const baseline = await medianMs(() => database.all(sql`select * from fitments where org_id = ${orgId}`));

    // The same figures either way, or the benchmark measures the wrong thing.
    const full = await loadFleetVariance(database, actor, undefined, now);
    if (full.details.length !== VEHICLES) throw new Error(`expected ${VEHICLES} vehicles, saw ${full.details.length}`);

    // Cold: no summaries; every vehicle judged in full and written back. Emptied before each run, untimed.
    const coldTimes: number[] = [];
    let coldStats: SummaryReadStats = { stored: 0, judged: 0, written: 0 };
    for (let i = 0; i < 4; i++) {
      await database.delete(vehicleVarianceSummaries);
      coldStats = { stored: 0, judged: 0, written: 0 };
      const t0 = performance.now();
      await loadFleetVarianceFigures(database, actor, undefined, now, { stats: coldStats });
      if (i > 0) coldTimes.push(performance.now() - t0); // the first run warms the code paths
    }
    coldTimes.sort((a, b) => a - b);
    const cold = coldTimes[Math.floor(coldTimes.length / 2)]!;
    if (coldStats.judged !== VEHICLES || coldStats.written !== VEHICLES) throw new Error(`cold read judged ${coldStats.judged}, wrote ${coldStats.written}`);

    // Warm: every summary current.
    let warmStats: SummaryReadStats = { stored: 0, judged: 0, written: 0 };
    let warmFleet: Awaited<ReturnType<typeof loadFleetVarianceFigures>> | undefined;
    const warm = await medianMs(async () => {
      warmStats = { stored: 0, judged: 0, written: 0 };
      warmFleet = await loadFleetVarianceFigures(database, actor, undefined, now, { stats: warmStats });
    });
    if (warmStats.stored !== VEHICLES || warmStats.judged !== 0) throw new Error(`warm read stored ${warmStats.stored}, judged ${warmStats.judged}`);
    const { details: _full, ...fullFleet } = full;
    const { details: _warm, ...warmFigures } = warmFleet!;
    if (JSON.stringify(fullFleet) !== JSON.stringify(warmFigures)) throw new Error("the warm figures differ from the full judgement");

    const fullMs = await medianMs(() => loadFleetVariance(database, actor, undefined, now), 3);

    // Readiness counts (home page, daily snapshot): in brief from the summaries, against the
    // full per-line judgement of every vehicle they replaced; the same counts either way.
    const countsFull = async () => {
      const counts = { ready: 0, limited: 0, notReady: 0, total: 0 };
      for (const r of await loadFleetReadiness(database, actor, now)) {
        counts.total++;
        if (r.state === "ready") counts.ready++;
        else if (r.state === "limited") counts.limited++;
        else counts.notReady++;
      }
      return counts;
    };
    if (JSON.stringify(await fleetReadinessCounts(database, actor, now)) !== JSON.stringify(await countsFull())) {
      throw new Error("the readiness counts in brief differ from the full judgement");
    }
    const readinessBrief = await medianMs(() => fleetReadinessCounts(database, actor, now));
    const readinessFull = await medianMs(countsFull, 3);
    const name = `Fleet variance, ${VEHICLES.toLocaleString("en-AU")} vehicles × ${LINES} lines`;
    const scan = `${baseline.toFixed(0)} ms for one SQL scan of the fitments`;
    return [
      {
        name: `${name}: warm (every vehicle's summary current; the target is judged on this read)`,
        figure: `${warm.toFixed(0)} ms (${warmStats.stored.toLocaleString("en-AU")} summaries read, ${warmStats.judged} vehicles judged)`,
        baseline: scan,
        ratio: warm / baseline,
        ratioLabel: "× the fitments scan",
        target: `under ${TARGET_MS} ms`,
        met: warm < TARGET_MS,
      },
      {
        name: `${name}: cold (no summaries: every vehicle judged in full and written back)`,
        figure: `${cold.toFixed(0)} ms (${coldStats.judged.toLocaleString("en-AU")} judged, ${coldStats.written.toLocaleString("en-AU")} summaries written)`,
        baseline: scan,
        ratio: cold / baseline,
        ratioLabel: "× the fitments scan",
        target: `none of its own (the ${TARGET_MS} ms target is judged on the warm read)`,
        met: null,
      },
      {
        name: `${name}: full per-line judgement (loadFleetVariance, for the views that need every line)`,
        figure: `${fullMs.toFixed(0)} ms`,
        baseline: scan,
        ratio: fullMs / baseline,
        ratioLabel: "× the fitments scan",
        target: "none of its own (for comparison)",
        met: null,
      },
      {
        name: `Fleet readiness counts (home page, daily snapshot), ${VEHICLES.toLocaleString("en-AU")} vehicles, summaries current`,
        figure: `${readinessBrief.toFixed(0)} ms in brief (lib/readiness/brief.ts)`,
        baseline: `${readinessFull.toFixed(0)} ms for the full per-line judgement of every vehicle`,
        ratio: readinessBrief / readinessFull,
        ratioLabel: "× the full judgement",
        target: "none of its own (for comparison)",
        met: null,
      },
    ];
  } finally {
    close();
  }
}
