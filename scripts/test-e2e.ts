/**
 * Browser tests: a production build served on a free port against a freshly seeded temporary
 * database, with the local SMTP stand-in on another free port, driven by Playwright in Debian's
 * Chromium. Extra arguments go to `playwright test`.
 */
import { spawn } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { seedDemo } from "@/db/seed";
import { ensureChromium } from "./lib/chromium";
import { freePort } from "./lib/ports";
import { openDatabase, prepareEnv, run, startMailStandIn, startNext, waitForHealth } from "./lib/runtime";

ensureChromium();
const dir = mkdtempSync(join(tmpdir(), "rigline-e2e-"));
const databaseUrl = `file:${join(dir, "e2e.db")}`;
const [appPort, smtpPort] = [await freePort(), await freePort()];
prepareEnv("test", {
  DATABASE_URL: databaseUrl,
  SMTP_PORT: String(smtpPort),
  PORT: String(appPort),
  APP_URL: `http://localhost:${appPort}`,
  OUTBOX_INTERVAL_MS: "500",
  STORAGE_DIR: join(dir, "files"),
});

const database = await openDatabase(databaseUrl);
await seedDemo(database);
if (!process.argv.includes("--no-build")) await run("node_modules/.bin/next", ["build"]);
const smtp = await startMailStandIn(database, smtpPort);
const app = startNext(appPort);
let exitCode = 1;
try {
  await waitForHealth(`http://127.0.0.1:${appPort}/api/health`);
  const args = process.argv.slice(2).filter((a) => a !== "--no-build");
  exitCode = await new Promise<number>((resolve) => {
    const child = spawn("node_modules/.bin/playwright", ["test", ...args], {
      stdio: "inherit",
      env: { ...process.env, E2E_BASE_URL: `http://localhost:${appPort}`, E2E_DATABASE_URL: databaseUrl },
    });
    child.on("exit", (code) => resolve(code ?? 1));
  });
} finally {
  app.kill("SIGTERM");
  await smtp.close();
  rmSync(dir, { recursive: true, force: true });
}
process.exit(exitCode);
