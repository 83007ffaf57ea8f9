import { removePlannedItem, updatePlannedItem } from "@/lib/commands/mass";
import { readJson, routeHandler } from "@/lib/server/route";

const ids = (params: Record<string, string | string[]>) => ({ id: String(params.id ?? ""), itemId: String(params.itemId ?? "") });

export const PATCH = routeHandler(updatePlannedItem, async (request, params) => {
  const body = await readJson(request);
  return { ...(body && typeof body === "object" ? body : {}), ...ids(params) };
});

export const DELETE = routeHandler(removePlannedItem, (_request, params) => ids(params));
