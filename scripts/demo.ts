/**
 * `npm run demo`: database, migrations, demo seed, production build, the local SMTP stand-in and
 * the app on http://localhost:3000 (or PORT), with the demo sign-ins printed.
 */
import { seedDemo } from "@/db/seed";
import { DEMO_PASSWORD, ORGANISATIONS } from "@/db/seed/scenario";
import { openDatabase, prepareEnv, run, startMailStandIn, startNext, waitForHealth } from "./lib/runtime";

prepareEnv("demo");
const port = Number(process.env.PORT ?? 3000);
const database = await openDatabase();
await seedDemo(database);
if (process.argv.includes("--no-build") === false) await run("node_modules/.bin/next", ["build"]);
const smtp = await startMailStandIn(database, Number(process.env.SMTP_PORT));
const app = startNext(port);
await waitForHealth(`http://127.0.0.1:${port}/api/health`);

console.log(`\nRigline demo on http://localhost:${port}  (local mail stand-in on port ${smtp.port})\n`);
console.log(`Password for every demo account: ${DEMO_PASSWORD}\n`);
for (const org of ORGANISATIONS) {
  console.log(org.name);
  for (const p of org.people) console.log(`  ${p.role.padEnd(11)} ${p.email}`);
}
console.log("\nPress Ctrl+C to stop.");

const stop = async () => {
  app.kill("SIGTERM");
  await smtp.close();
  process.exit(0);
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
app.on("exit", (code) => {
  void smtp.close();
  process.exit(code ?? 0);
});
