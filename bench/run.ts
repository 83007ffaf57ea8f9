/**
 * `npm run bench [-- <name> …] [--no-build]`: every benchmark (or the named ones), each printed
 * with its same-run baseline and the ratio. --no-build makes the API benchmark reuse the last
 * production build as it is.
 */
import "./server-only-shim";
import { report, type BenchResult } from "./support";

const flags = process.argv.slice(2).filter((a) => a.startsWith("--"));
const only = process.argv.slice(2).filter((a) => !a.startsWith("--"));

const benches: [string, () => Promise<BenchResult[]>][] = [
  ["variance", async () => (await import("./variance")).run()],
  ["import", async () => (await import("./import")).run()],
  [
    "export",
    async () => {
      const { run, TARGET_RATIO } = await import("./export");
      const r = await run();
      return [
        {
          name: `Ledger export to XLSX, ${r.rows.toLocaleString("en-AU")} rows`,
          figure: `${r.riglineMs.toFixed(0)} ms (CSV ${r.csvMs.toFixed(0)} ms)`,
          baseline: `${r.rawMs.toFixed(0)} ms for the raw exceljs write of the same rows`,
          ratio: r.ratio,
          ratioLabel: "× the raw write",
          target: `at most ${TARGET_RATIO}×`,
          met: r.pass,
        },
      ];
    },
  ],
  ["vehicles-api", async () => (await import("./vehicles-api")).run({ noBuild: flags.includes("--no-build") })],
];

const results: BenchResult[] = [];
for (const [name, runBench] of benches) {
  if (only.length && !only.includes(name)) continue;
  console.log(`Running ${name} …`);
  results.push(...(await runBench()));
}
report(results);
