import { listImports } from "@/lib/commands/imports";
import { routeHandler } from "@/lib/server/route";

/** GET /api/imports — this organisation's import history, newest first. */
export const GET = routeHandler(listImports, () => ({}), {
  respond: (items) => Response.json({ items }),
});
