import { addLine } from "@/lib/commands/standards";
import { readJson, routeHandler } from "@/lib/server/route";

export const POST = routeHandler(
  addLine,
  async (request, params) => ({ ...((await readJson(request)) as object), editionId: params.id }),
  { status: 201 },
);
