import { getPlatform, updatePlatform } from "@/lib/commands/platforms";
import { AppError } from "@/lib/server/errors";
import { readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getPlatform, (_request, params) => ({ id: params.id }));

export const PATCH = routeHandler(updatePlatform, async (request, params) => {
  const body = await readJson(request);
  if (typeof body !== "object" || body === null || Array.isArray(body)) throw new AppError("bad_request", "The request body must be a JSON object");
  return { ...body, id: params.id };
});
