import { deleteBudget, updateBudget } from "@/lib/commands/costs";
import { readJson, routeHandler } from "@/lib/server/route";

export const PATCH = routeHandler(updateBudget, async (request, params) => ({ ...((await readJson(request)) as object), id: params.id }));

export const DELETE = routeHandler(deleteBudget, (_request, params) => ({ id: params.id }));
