import { deleteLine, updateLine } from "@/lib/commands/standards";
import { readJson, routeHandler } from "@/lib/server/route";

/** Changes the given fields of a draft's line (a published edition answers 409). */
export const PATCH = routeHandler(updateLine, async (request, params) => ({
  ...((await readJson(request)) as object),
  editionId: params.id,
  lineId: params.lineId,
}));

export const DELETE = routeHandler(deleteLine, (_request, params) => ({ editionId: params.id, lineId: params.lineId }));
