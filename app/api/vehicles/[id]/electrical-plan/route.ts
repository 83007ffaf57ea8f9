import { electricalPlanQuery, saveElectricalPlan } from "@/lib/commands/mass";
import { readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(electricalPlanQuery, (_request, params) => ({ id: String(params.id ?? "") }));

/** The whole plan as JSON: `systemV`, `daysAutonomy`, `chemistry`, `consumers`, `sources`, `runs`. */
export const PUT = routeHandler(saveElectricalPlan, async (request, params) => {
  const body = await readJson(request);
  return { ...(body && typeof body === "object" && !Array.isArray(body) ? body : {}), id: String(params.id ?? "") };
});
