import { getVehicle, updateVehicle } from "@/lib/commands/vehicles";
import { AppError } from "@/lib/server/errors";
import { readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getVehicle, (_request, params) => ({ id: params.id }));

/** Partial update; the body names the `version` it was based on (409 when someone saved since). */
export const PATCH = routeHandler(updateVehicle, async (request, params) => {
  const body = await readJson(request);
  if (typeof body !== "object" || body === null || Array.isArray(body)) throw new AppError("bad_request", "The request body must be a JSON object");
  return { ...body, id: params.id };
});
