/** `npm run dev`: like the demo, but with `next dev` (hot reload) instead of a production build. */
import { seedDemo } from "@/db/seed";
import { openDatabase, prepareEnv, startMailStandIn, startNext } from "./lib/runtime";

prepareEnv("development");
const database = await openDatabase();
await seedDemo(database);
const smtp = await startMailStandIn(database, Number(process.env.SMTP_PORT));
const app = startNext(Number(process.env.PORT ?? 3000), process.env, "dev");
const stop = async () => {
  app.kill("SIGTERM");
  await smtp.close();
  process.exit(0);
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
