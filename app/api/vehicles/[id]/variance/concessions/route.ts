import { grantConcession } from "@/lib/commands/fitments";
import { readJson, routeHandler } from "@/lib/server/route";

/** A manager's concession on one line: `{ lineKey, reason, expiresAt }`. */
export const POST = routeHandler(
  grantConcession,
  async (request, params) => ({ ...((await readJson(request)) as object), vehicleId: params.id }),
  { status: 201 },
);
