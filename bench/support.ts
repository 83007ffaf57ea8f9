/** Shared pieces of the benchmarks: a temporary database, timing, and one way to print results. */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { makeDb, openClient, prepareLocal, type Database } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";

export async function benchDatabase(): Promise<{ database: Database; dir: string; url: string; close: () => void }> {
  const dir = mkdtempSync(join(tmpdir(), "rigline-bench-"));
  const url = `file:${join(dir, "bench.db")}`;
  const client = openClient(url);
  await prepareLocal(client, url);
  const database = makeDb(client);
  await migrateDatabase(database);
  return { database, dir, url, close: () => { client.close(); rmSync(dir, { recursive: true, force: true }); } };
}

/** Median wall time of `runs` calls after `warmup` untimed ones. */
export async function medianMs(fn: () => Promise<unknown> | unknown, runs = 5, warmup = 1): Promise<number> {
  for (let i = 0; i < warmup; i++) await fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)]!;
}

export type BenchResult = {
  name: string;
  figure: string;
  baseline: string;
  /** How the measured figure compares with the baseline, in words and number. */
  ratio: number;
  ratioLabel: string;
  target: string;
  /** null: printed for comparison, not judged against a target. */
  met: boolean | null;
};

export function report(results: BenchResult[]): void {
  for (const r of results) {
    console.log(`\n${r.name}`);
    console.log(`  measured : ${r.figure}`);
    console.log(`  baseline : ${r.baseline}`);
    // Small ratios keep their significant digits (0.004, not 0.00).
    console.log(`  ratio    : ${r.ratio < 0.1 ? r.ratio.toPrecision(2) : r.ratio.toFixed(2)} ${r.ratioLabel}`);
    console.log(`  target   : ${r.target}${r.met === null ? "" : ` → ${r.met ? "met" : "NOT met"}`}`);
  }
}
