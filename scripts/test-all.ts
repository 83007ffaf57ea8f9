/** `npm test`: lint, typecheck, unit and integration tests, then the browser tests. Stops at the first failure. */
import { run } from "./lib/runtime";

const steps: [string, string, string[]][] = [
  ["Lint", "node_modules/.bin/eslint", ["."]],
  ["Typecheck", "node_modules/.bin/tsc", ["--noEmit", "-p", "."]],
  ["Unit and integration tests", "node_modules/.bin/vitest", ["run"]],
  ["Browser tests", "node_modules/.bin/tsx", ["scripts/test-e2e.ts"]],
];

for (const [label, command, args] of steps) {
  const started = Date.now();
  console.log(`\n━━ ${label} ━━`);
  try {
    await run(command, args);
  } catch {
    console.error(`\n✗ ${label} failed.`);
    process.exit(1);
  }
  console.log(`✓ ${label} (${Math.round((Date.now() - started) / 1000)} s)`);
}
console.log("\nAll checks passed.");
