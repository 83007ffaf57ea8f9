/** `npm run bench`: every benchmark, each printed with its same-run baseline and the ratio. */
import { report, type BenchResult } from "./support";

const benches: [string, () => Promise<{ run: () => Promise<BenchResult[]> }>][] = [
  ["variance", () => import("./variance")],
];

const only = process.argv.slice(2);
const results: BenchResult[] = [];
for (const [name, load] of benches) {
  if (only.length && !only.includes(name)) continue;
  console.log(`Running ${name} …`);
  results.push(...(await (await load()).run()));
}
report(results);
