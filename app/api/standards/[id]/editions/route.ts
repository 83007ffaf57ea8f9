import { startDraft } from "@/lib/commands/standards";
import { readJson, routeHandler } from "@/lib/server/route";

/** Starts a new draft edition, copied from the latest published one (or `fromEditionId`). */
export const POST = routeHandler(
  startDraft,
  async (request, params) => ({ ...((await readJson(request)) as object), standardId: params.id }),
  { status: 201 },
);
